#!/usr/bin/env bash
# Emulator accuracy against training-set size: builds the 500-, 1000- and 2000-point training sets of the
# 7-parameter nDGP matter box (each with 200 held-out points), fits an emulator to each with the default
# options, and prints the held-out 99th-percentile error at k <= 0.3 h/Mpc. Work files go to a scratch folder
# (first argument, default a new temporary folder); reports and figures stay there for inspection.
set -euo pipefail
here="$(cd "$(dirname "${BASH_SOURCE[0]}")" && pwd)"
sibyl="$here/../../sibyl"
work="${1:-$(mktemp -d)}"
mkdir -p "$work"
echo "accuracy: work files in $work" >&2
for n in 500 1000 2000; do
  design="$work/matter-ndgp-$n.design"
  "$sibyl" plan "$here/matter-ndgp-$n.json" --out "$design" > /dev/null
  "$sibyl" run "$design" 2> "$work/run-$n.log"
  "$sibyl" merge "$design" > /dev/null 2>&1
  start=$(date +%s)
  "$sibyl" fit "$work/matter-ndgp-$n.training" 2> "$work/fit-$n.log" > /dev/null
  end=$(date +%s)
  echo "== $n training points (fit $((end - start)) s):"
  grep -E "99th percentile" "$work/fit-$n.log"
done
