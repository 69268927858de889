#!/usr/bin/env bash
# Submits a sharded ingest to Slurm: a job array of N ingest tasks (one shard each, part-K.lookup) and a merge
# job that runs after all of them succeeded (--dependency=afterok) and writes the merged index.
#
#   tools/slurm/submit.sh --tree /shared/photos --index /shared/lookup/catalogue.lookup --shards 8 [options] [-- SBATCH-ARGS...]
#
#   --tree DIR        the catalogue folder, the same path on every node (shared filesystem)
#   --index FILE      the merged index (created, or updated incrementally if it exists)
#   --shards N        how many shards (array tasks)
#   --parts DIR       where part-K.lookup and logs/ go (default: a "parts" folder beside --index)
#   --cpus C          CPUs per task = ingest workers per task (default 2)
#   --sku-from SPEC   as for lookup ingest (default folder); --model CARD likewise
#   --only K[,K...]   submit only these shards (a rerun after a failure: ingest resumes where it stopped), then merge all N
#   --lookup CMD      how to run lookup on the nodes (default $LOOKUP_CMD or "lookup"), e.g. "dotnet /opt/lookup/Lookup.Cli.dll"
#   -- ARGS           passed to both sbatch calls (e.g. --partition=batch --time=04:00:00 --account=catalogue)
#
# Prints "array=<job id>" and "merge=<job id>" on stdout; logs go to PARTS/logs/. Needs sbatch on PATH (and
# SLURM_CONF when the cluster's configuration is not in the default place).
set -euo pipefail

here="$(cd "$(dirname "$0")" && pwd)"
die() { echo "submit.sh: $*" >&2; exit 2; }

tree="" index="" shards="" parts="" cpus=2 sku_from="folder" model="" only="" lookup="${LOOKUP_CMD:-lookup}"
extra=()
while [ $# -gt 0 ]; do
  case "$1" in
    --tree) tree="${2:?}"; shift 2 ;;
    --index) index="${2:?}"; shift 2 ;;
    --shards) shards="${2:?}"; shift 2 ;;
    --parts) parts="${2:?}"; shift 2 ;;
    --cpus) cpus="${2:?}"; shift 2 ;;
    --sku-from) sku_from="${2:?}"; shift 2 ;;
    --model) model="${2:?}"; shift 2 ;;
    --only) only="${2:?}"; shift 2 ;;
    --lookup) lookup="${2:?}"; shift 2 ;;
    --) shift; extra=("$@"); break ;;
    *) die "unknown option $1 (see the header of $0)" ;;
  esac
done
[ -n "$tree" ] && [ -n "$index" ] && [ -n "$shards" ] || die "--tree, --index and --shards are required"
[[ "$shards" =~ ^[1-9][0-9]*$ ]] || die "--shards must be a whole number ≥ 1, not '$shards'"
[[ "$cpus" =~ ^[1-9][0-9]*$ ]] || die "--cpus must be a whole number ≥ 1, not '$cpus'"
[ -d "$tree" ] || die "$tree is not a folder"

tree="$(cd "$tree" && pwd)"
index="$(realpath -m "$index")"
parts="$(realpath -m "${parts:-$(dirname "$index")/parts}")"
array_spec="1-$shards"
if [ -n "$only" ]; then
  [[ "$only" =~ ^[0-9]+(,[0-9]+)*$ ]] || die "--only takes shard numbers separated by commas, e.g. 3,7"
  for k in ${only//,/ }; do [ "$k" -ge 1 ] && [ "$k" -le "$shards" ] || die "shard $k is not between 1 and $shards"; done
  array_spec="$only"
fi
command -v sbatch >/dev/null || die "sbatch not found: run this on a Slurm login node"
mkdir -p "$parts/logs"

# Passed through the environment (--export=ALL), not --export=NAME=VALUE, so values may hold commas.
export LOOKUP_TREE="$tree" LOOKUP_PARTS="$parts" LOOKUP_INDEX="$index" LOOKUP_SHARDS="$shards"
export LOOKUP_SKU_FROM="$sku_from" LOOKUP_MODEL="$model" LOOKUP_CMD="$lookup"

array_job="$(sbatch --parsable --export=ALL --array="$array_spec" --cpus-per-task="$cpus" \
  --output="$parts/logs/ingest-%A_%a.out" "${extra[@]}" "$here/ingest-shard.sbatch")"
array_job="${array_job%%;*}"
merge_job="$(sbatch --parsable --export=ALL --dependency="afterok:$array_job" --kill-on-invalid-dep=yes \
  --output="$parts/logs/merge-%j.out" "${extra[@]}" "$here/merge-parts.sbatch")"
merge_job="${merge_job%%;*}"

echo "submitted shards $array_spec of $shards as array job $array_job ($cpus CPUs each); merge job $merge_job runs when all succeed" >&2
echo "logs: $parts/logs/   merged index: $index" >&2
echo "array=$array_job"
echo "merge=$merge_job"
