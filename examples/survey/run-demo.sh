#!/usr/bin/env bash
# The whole survey demo end to end, on an INVENTED survey (not any real survey): a training set over the demo's box
# (plan, run, merge), an emulator fitted with options sized for 2 cores, synthetic data from the direct calculation,
# an ensemble-sampler chain on the emulator in process and through the gRPC server (sibyl serve), a short chain on
# the direct calculation for the wall-clock comparison,
# and the emulator-vs-direct likelihood comparison at the chain's points.
#
# usage: examples/survey/run-demo.sh [--quick] [--out FOLDER]
#   --quick       60 training points and a 300-step chain (about 3 minutes on 2 cores) instead of 200 and 3000
#   --out FOLDER  scratch folder [${TMPDIR:-/tmp}/sibyl-survey-demo]; everything is written there
set -euo pipefail
here="$(cd "$(dirname "${BASH_SOURCE[0]}")" && pwd)"
root="$(cd "$here/../.." && pwd)"
quick=0
out="${TMPDIR:-/tmp}/sibyl-survey-demo"
while [[ $# -gt 0 ]]; do
  case "$1" in
    --quick) quick=1; shift ;;
    --out) out="$2"; shift 2 ;;
    -h|--help) sed -n '2,10p' "${BASH_SOURCE[0]}"; exit 0 ;;
    *) echo "run-demo.sh: unknown argument '$1'" >&2; exit 2 ;;
  esac
done

if [[ $quick == 1 ]]; then
  spec="$here/survey-emulator-quick.json"; steps=300; server_steps=100; python_steps=150; direct_steps=5; points=200
else
  spec="$here/survey-emulator.json"; steps=3000; server_steps=1000; python_steps=600; direct_steps=20; points=500
fi
scenario="$here/scenario.json"
mkdir -p "$out"
cd "$out"
sibyl="$root/sibyl"
# Built in place (bin/ is ignored by git), so a second run reuses the build.
demo="$root/examples/csharp/SurveyDemo/bin/Release/net10.0/survey-demo"
log() { printf '\n== %s\n' "$*" >&2; }

log "building the demo program"
dotnet build "$root/examples/csharp/SurveyDemo/SurveyDemo.csproj" -c Release --nologo -v quiet >&2

log "training set: plan, run, merge ($(basename "$spec"))"
"$sibyl" plan "$spec" --out survey.design
"$sibyl" run survey.design
"$sibyl" merge survey.design

log "emulator: one process per leading component, hyperparameters on 150 points, no restarts"
"$sibyl" fit survey.training --separate 1 --hyper-points 150 --restarts 0 2> fit.log || { cat fit.log >&2; exit 1; }
grep -E "fitted and validated" fit.log >&2

log "synthetic data from the direct calculation at the hidden parameters"
"$demo" make-data --scenario "$scenario" --spec "$spec" --out data

log "chain on the emulator ($steps steps)"
"$demo" fit --scenario "$scenario" --data data --emulator survey.emulator --out chain --steps "$steps"

log "the same sampler through the gRPC server ($server_steps steps): sibyl serve on a free loopback port"
"$sibyl" serve survey=survey.emulator --port 0 > serve.out 2> serve.log &
server=$!
trap 'kill "$server" 2> /dev/null || true' EXIT
for _ in $(seq 1 120); do grep -q "listening on" serve.out && break; sleep 0.5; done
address="$(grep -o 'http://[0-9.]*:[0-9]*' serve.out | head -n 1)"
[[ -n "$address" ]] || { cat serve.log >&2; echo "run-demo.sh: the server did not start" >&2; exit 1; }
"$demo" fit --scenario "$scenario" --data data --server "$address" --served-name survey --out chain-server --steps "$server_steps"
# The Python sampler needs Debian's python3-grpcio and python3-protobuf, protoc and its gRPC plugin (as .ci/run installs).
if /usr/bin/python3 -c "import grpc" 2> /dev/null && command -v protoc > /dev/null && command -v grpc_python_plugin > /dev/null; then
  log "the Python sampler (examples/python/survey_sampler.py) through the same server"
  "$root/examples/python/generate.sh" "$out/stubs" > /dev/null
  PYTHONPATH="$out/stubs" /usr/bin/python3 "$root/examples/python/survey_sampler.py" --server "${address#http://}" --emulator survey \
    --scenario "$scenario" --data data --steps "$python_steps" | tee python-sampler.csv
else
  log "skipping the Python sampler: it needs python3-grpcio, python3-protobuf, protoc and grpc_python_plugin"
fi
kill -TERM "$server"
wait "$server"
trap - EXIT

log "the same sampler on the direct calculation, $direct_steps steps only, for the wall-clock comparison"
"$demo" fit --scenario "$scenario" --data data --direct "$spec" --out chain-direct --steps "$direct_steps" --burn-in 0 | tail -n 1

log "emulator vs direct likelihoods at $points chain points"
"$demo" compare --scenario "$scenario" --data data --chain chain/chain.csv --emulator survey.emulator --out compare --points "$points"

log "done: $out (data/, chain/, chain-server/, chain-direct/, compare/, survey-heldout.txt)"
