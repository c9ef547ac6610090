#!/usr/bin/env bash
# Submits a design's job array of N shards and a merge job that starts once every shard succeeded.
# Usage: submit.sh DESIGN N [sbatch options for the array ...]
#   e.g. submit.sh grids/lcdm.design 16 --cpus-per-task=32 --time=12:00:00
# Options both jobs need (partition, account, ...) go in sbatch's own variables: SBATCH_PARTITION,
# SBATCH_ACCOUNT. SIBYL (the sibyl executable) is passed on to the jobs with the rest of the environment.
set -euo pipefail

usage="usage: submit.sh DESIGN N [sbatch options for the array ...]"
[[ $# -ge 2 ]] || { echo "$usage" >&2; exit 2; }
design="$1"
shards="$2"
shift 2
[[ -f "$design" ]] || { echo "submit.sh: design file '$design' not found" >&2; exit 2; }
[[ "$shards" =~ ^[1-9][0-9]*$ ]] || { echo "submit.sh: N must be a positive integer, got '$shards'" >&2; exit 2; }
here="$(cd "$(dirname "${BASH_SOURCE[0]}")" && pwd)"

# --parsable prints "JOBID" or "JOBID;CLUSTER".
array_id="$(sbatch --parsable --array="0-$((shards - 1))" "$@" "$here/train-array.sbatch" "$design" "$shards")"
array_id="${array_id%%;*}"
# Without --kill-on-invalid-dep a merge whose array failed would wait in the queue forever.
merge_id="$(sbatch --parsable --dependency="afterok:$array_id" --kill-on-invalid-dep=yes "$here/merge.sbatch" "$design")"
merge_id="${merge_id%%;*}"

echo "array job $array_id ($shards shards of $design)"
echo "merge job $merge_id (after every shard succeeds)"
