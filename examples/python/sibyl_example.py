#!/usr/bin/env python3
"""Calls a running `sibyl serve` from Python with grpcio: describe, one point, a batch, a stream, and a refusal.

Generate the stubs first (./generate.sh, or see README.md), then:
    PYTHONPATH=generated python3 sibyl_example.py --server 127.0.0.1:50051 --emulator quick
"""
import argparse
import random
import sys
import time

import grpc

from sibyl.v1 import emulator_pb2 as pb
from sibyl.v1 import emulator_pb2_grpc as rpc


def wait_until_serving(channel, seconds):
    """Polls the standard gRPC health service until it answers SERVING.

    The health messages are tiny, so they are written by hand instead of needing grpcio-health-checking:
    an empty HealthCheckRequest is zero bytes, and SERVING is field 1 = 1, the bytes 08 01.
    """
    check = channel.unary_unary("/grpc.health.v1.Health/Check",
                                request_serializer=lambda b: b, response_deserializer=lambda b: b)
    deadline = time.monotonic() + seconds
    while True:
        try:
            if check(b"", timeout=1.0) == b"\x08\x01":
                return
        except grpc.RpcError:
            pass
        if time.monotonic() > deadline:
            raise SystemExit(f"the server did not answer SERVING within {seconds} s")
        time.sleep(0.2)


def point(description, rng, nuisance_value=1.0):
    """A request at a random point of the box, at the first trained redshift, every nuisance parameter set."""
    request = pb.PredictRequest(emulator=description.name)
    for p in description.parameters:
        request.parameters[p.name] = rng.uniform(p.min, p.max)
    if description.redshifts:
        request.z = description.redshifts[0]
    for name in description.nuisance:
        request.nuisance[name] = nuisance_value
    return request


def main():
    parser = argparse.ArgumentParser(description=__doc__.splitlines()[0])
    parser.add_argument("--server", default="127.0.0.1:50051", help="host:port of sibyl serve")
    parser.add_argument("--emulator", required=True, help="name given to sibyl serve NAME=FILE")
    parser.add_argument("--wait", type=float, default=0.0, help="seconds to wait for the health check first")
    args = parser.parse_args()

    rng = random.Random(1)
    with grpc.insecure_channel(args.server) as channel:
        if args.wait > 0:
            wait_until_serving(channel, args.wait)
        stub = rpc.EmulatorStub(channel)

        description = stub.Describe(pb.DescribeRequest(emulator=args.emulator)).emulators[0]
        ranges = ", ".join(f"{p.name} in [{p.min:g}, {p.max:g}]" for p in description.parameters)
        print(f"{description.name}: {ranges}; z slices {list(description.redshifts)}; "
              f"{len(description.k)} k in [{description.k[0]:g}, {description.k[-1]:g}] h/Mpc")
        for a in description.accuracy:
            print(f"  {a.term}: 99th-percentile {description.accuracy_source} error {100 * a.worst_p99:.3g}% "
                  f"at k <= {a.headline_k_max:g} h/Mpc")

        # One point with its basis terms (for analytic marginalisation) and, when available, variances.
        request = point(description, rng)
        request.include_basis = True
        request.include_variance = description.has_variance
        reply = stub.Predict(request)
        observable = reply.observables[0]
        assert len(observable.values) == len(description.k)
        assert [t.name for t in reply.terms] == [t.name for t in description.terms]
        print("k,", observable.name)
        for k, value in list(zip(reply.k, observable.values))[:3]:
            print(f"{k!r},{value!r}")

        # Spectra at k values of our choosing, inside the emulator's range.
        request.ClearField("k")
        request.k.extend([description.k[0], 0.5 * (description.k[0] + description.k[-1])])
        assert len(stub.Predict(request).observables[0].values) == 2

        # An ensemble sampler's step: many points in one call, then the same as a stream.
        batch = [point(description, rng) for _ in range(200)]
        replies = stub.PredictBatch(pb.PredictBatchRequest(points=batch)).points
        assert len(replies) == len(batch)
        streamed = list(stub.PredictStream(iter(batch[:20])))
        assert [r.observables[0].values for r in streamed] == [r.observables[0].values for r in replies[:20]]
        print(f"batch of {len(replies)} and stream of {len(streamed)} points: ok")

        # Outside the box: refused with OUT_OF_RANGE, the message naming the parameter and its range.
        outside = point(description, rng)
        first = description.parameters[0]
        outside.parameters[first.name] = first.max + (first.max - first.min)
        try:
            stub.Predict(outside)
            raise SystemExit("a point outside the box was not refused")
        except grpc.RpcError as e:
            assert e.code() == grpc.StatusCode.OUT_OF_RANGE, e.code()
            print(f"refused as expected: {e.code().name}: {e.details()}")
    return 0


if __name__ == "__main__":
    sys.exit(main())
