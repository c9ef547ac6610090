#!/usr/bin/env python3
"""Fits the INVENTED survey of examples/survey (not any real survey) through a running `sibyl serve`.

An affine-invariant ensemble sampler (Goodman & Weare 2010, CAMCoS 5, 65; stretch move, a = 2) in plain Python over
the cosmological parameters of the served emulator's box and the linear bias b1, with flat priors; every other
nuisance parameter is held at the scenario's hidden value (a simplification of the C# demo, which also samples b2
and bG2 and integrates out the counterterms). Each half-step of the ensemble is one PredictBatch call. The likelihood
is Gaussian with the covariance written by `survey-demo make-data`. Prints posterior means and 68 % intervals against
the injected values, and exits with code 3 if any injected value lies more than 3 posterior standard deviations away.

    PYTHONPATH=generated python3 survey_sampler.py --server 127.0.0.1:50051 --emulator survey \
        --scenario ../survey/scenario.json --data DATA_FOLDER
"""
import argparse
import csv
import json
import math
import random
import sys
import time

import grpc

from sibyl.v1 import emulator_pb2 as pb
from sibyl.v1 import emulator_pb2_grpc as rpc


def read_rows(path):
    with open(path, newline="") as f:
        return [row for row in csv.reader(line for line in f if not line.startswith("#"))]


def cholesky(matrix):
    n = len(matrix)
    lower = [[0.0] * n for _ in range(n)]
    for i in range(n):
        for j in range(i + 1):
            s = matrix[i][j] - sum(lower[i][m] * lower[j][m] for m in range(j))
            lower[i][j] = math.sqrt(s) if i == j else s / lower[j][j]
    return lower


def chi2(lower, residual):
    """r^T C^-1 r = |L^-1 r|^2 by forward substitution."""
    y = []
    for i, row in enumerate(lower):
        y.append((residual[i] - sum(row[m] * y[m] for m in range(i))) / row[i])
    return sum(v * v for v in y)


def main():
    parser = argparse.ArgumentParser(description=__doc__.splitlines()[0])
    parser.add_argument("--server", default="127.0.0.1:50051", help="host:port of sibyl serve")
    parser.add_argument("--emulator", default="survey", help="name given to sibyl serve NAME=FILE")
    parser.add_argument("--scenario", required=True, help="examples/survey/scenario.json")
    parser.add_argument("--data", required=True, help="folder written by survey-demo make-data")
    parser.add_argument("--walkers", type=int, default=16)
    parser.add_argument("--steps", type=int, default=300)
    parser.add_argument("--seed", type=int, default=1)
    args = parser.parse_args()

    scenario = json.load(open(args.scenario))
    rows = read_rows(f"{args.data}/data.csv")
    header, rows = rows[0], rows[1:]
    multipoles = [name for name in header if name.startswith("P")]
    data = [float(row[header.index(name)]) for name in multipoles for row in rows]
    lower = cholesky([[float(v) for v in row] for row in read_rows(f"{args.data}/covariance.csv")])

    rng = random.Random(args.seed)
    with grpc.insecure_channel(args.server) as channel:
        stub = rpc.EmulatorStub(channel)
        description = stub.Describe(pb.DescribeRequest(emulator=args.emulator)).emulators[0]
        names = [p.name for p in description.parameters] + ["b1"]
        b1 = next(s for s in scenario["sampled_nuisance"] if s["name"] == "b1")
        lows = [p.min for p in description.parameters] + [b1["min"]]
        highs = [p.max for p in description.parameters] + [b1["max"]]
        injected = [scenario["hidden_cosmology"][p.name] for p in description.parameters] + [scenario["hidden_nuisance"]["b1"]]

        def request(x):
            r = pb.PredictRequest(emulator=args.emulator, z=scenario["redshift"])
            for name, value in zip(names[:-1], x):
                r.parameters[name] = value
            for name, value in scenario["hidden_nuisance"].items():
                r.nuisance[name] = value
            r.nuisance["b1"] = x[-1]
            return r

        def log_posterior(points):
            inside = [all(lo <= v <= hi for v, lo, hi in zip(x, lows, highs)) for x in points]
            asked = [x for x, ok in zip(points, inside) if ok]
            replies = iter(stub.PredictBatch(pb.PredictBatchRequest(points=[request(x) for x in asked])).points) if asked else iter(())
            values = []
            for ok in inside:
                if not ok:
                    values.append(-math.inf)
                    continue
                reply = next(replies)
                model = {s.name: list(s.values) for s in reply.observables}
                theory = [v for name in multipoles for v in model[name]]
                values.append(-0.5 * chi2(lower, [d - t for d, t in zip(data, theory)]))
            return values

        centre = [0.5 * (lo + hi) for lo, hi in zip(lows, highs)]
        walkers = [[c + 0.02 * (hi - lo) * rng.gauss(0, 1) for c, lo, hi in zip(centre, lows, highs)] for _ in range(args.walkers)]
        logp = log_posterior(walkers)
        half = args.walkers // 2
        samples, accepted, clock = [], 0, time.monotonic()
        for step in range(args.steps):
            for first in (0, half):
                active = range(first, first + half)
                others = [walkers[j] for j in range(args.walkers) if j not in active]
                proposals, stretches = [], []
                for i in active:
                    z = (1.0 + rng.random()) ** 2 / 2.0  # g(z) ∝ 1/sqrt(z) on [1/2, 2] (a = 2)
                    partner = rng.choice(others)
                    proposals.append([p + z * (w - p) for w, p in zip(walkers[i], partner)])
                    stretches.append(z)
                new = log_posterior(proposals)
                for i, proposal, z, value in zip(active, proposals, stretches, new):
                    if math.log(rng.random()) < (len(names) - 1) * math.log(z) + value - logp[i]:
                        walkers[i], logp[i] = proposal, value
                        accepted += 1
            if step >= args.steps // 2:
                samples.extend(list(w) for w in walkers)
        seconds = time.monotonic() - clock

    print(f"# INVENTED survey '{scenario['name']}' (not any real survey), Python ensemble sampler through sibyl serve")
    print(f"# {args.walkers} walkers x {args.steps} steps, acceptance {accepted / (args.walkers * args.steps):.3f}, "
          f"{seconds:.1f} s ({1000 * seconds / (args.walkers * args.steps):.3f} ms per likelihood)")
    print("parameter,injected,mean,sd,p16,p84")
    far = []
    for q, name in enumerate(names):
        column = sorted(s[q] for s in samples)
        mean = sum(column) / len(column)
        sd = math.sqrt(sum((v - mean) ** 2 for v in column) / (len(column) - 1))
        p16, p84 = column[int(0.16 * len(column))], column[int(0.84 * len(column))]
        print(f"{name},{injected[q]!r},{mean!r},{sd!r},{p16!r},{p84!r}")
        if abs(mean - injected[q]) > 3 * sd:
            far.append(name)
    if far:
        print(f"survey_sampler: injected value more than 3 sd from the posterior mean: {', '.join(far)}", file=sys.stderr)
        sys.exit(3)


if __name__ == "__main__":
    main()
