#!/usr/bin/env bash
# Submit a sharded Lightfold run as a Slurm job array, printing exactly what it runs.
#   scripts/slurm/submit.sh --shards N --out DIR [--wait] [--dry-run] [-- simulate options...]
# Builds the CLI once (Release) unless LIGHTFOLD_BIN is set; logs go to DIR/logs/.
set -euo pipefail
here=$(cd "$(dirname "$0")" && pwd)
repo=$(cd "$here/../.." && pwd)
shards="" out="" wait="" dry=""
while [ $# -gt 0 ]; do
  case "$1" in
    --shards) shards=$2; shift 2 ;;
    --out) out=$2; shift 2 ;;
    --wait) wait="--wait"; shift ;;
    --dry-run) dry=1; shift ;;
    --) shift; break ;;
    *) echo "unknown option $1 (usage: $0 --shards N --out DIR [--wait] [--dry-run] [-- simulate options])" >&2; exit 2 ;;
  esac
done
[[ "$shards" =~ ^[1-9][0-9]*$ ]] || { echo "--shards N: a positive integer is required" >&2; exit 2; }
[ -n "$out" ] || { echo "--out DIR is required" >&2; exit 2; }
out=$(mkdir -p "$out" && cd "$out" && pwd)
mkdir -p "$out/logs"
if [ -z "${LIGHTFOLD_BIN:-}" ]; then
  [ -n "$dry" ] || dotnet build -c Release "$repo/src/Lightfold.Cli" -v q -nologo >/dev/null
  export LIGHTFOLD_BIN="dotnet $repo/src/Lightfold.Cli/bin/Release/net10.0/lightfold.dll"
fi
export LIGHTFOLD_OUT="$out"
cmd=(sbatch $wait --array="0-$((shards - 1))" --output="$out/logs/lightfold-%A_%a.log" "$here/array.sbatch" "$@")
echo "LIGHTFOLD_OUT=$LIGHTFOLD_OUT LIGHTFOLD_BIN=\"$LIGHTFOLD_BIN\" ${cmd[*]}"
[ -n "$dry" ] || "${cmd[@]}"
