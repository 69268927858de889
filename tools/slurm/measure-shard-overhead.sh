#!/usr/bin/env bash
# What sharding costs, measured on this machine: one ingest of TREE against N shard ingests of it run one after
# another (each task starts the runtime, loads the model and scans the whole tree), then the merge of the parts,
# then one shard again with nothing to do (the fixed cost of a task).
#
#   LOOKUP_CMD="dotnet src/Lookup.Cli/bin/Release/net10.0/Lookup.Cli.dll" tools/slurm/measure-shard-overhead.sh TREE [N=3] [WORKERS=1]
set -euo pipefail
tree="${1:?usage: $0 TREE [N] [WORKERS]}"
n="${2:-3}"
workers="${3:-1}"
read -r -a lookup <<< "${LOOKUP_CMD:-lookup}"
work="$(mktemp -d)"
trap 'rm -rf "$work"' EXIT

# Runs lookup, accepting exit 1 (some photos failed: they are recorded), and prints the wall seconds.
timed() {
  local start end status=0
  start=$(date +%s.%N)
  "${lookup[@]}" "$@" --quiet > "$work/last.out" || status=$?
  end=$(date +%s.%N)
  if [ "$status" -gt 1 ]; then echo "lookup $* exited $status" >&2; cat "$work/last.out" >&2; exit "$status"; fi
  awk -v a="$start" -v b="$end" 'BEGIN { printf "%.2f", b - a }'
}

echo "tree $tree, $n shards, $workers worker(s) per process, load $(cut -d' ' -f1 /proc/loadavg)"
single=$(timed ingest "$tree" --index "$work/single.lookup" --workers "$workers")
printf 'one process          %8.1f s\n' "$single"
total=0
parts=()
for ((k = 1; k <= n; k++)); do
  s=$(timed ingest "$tree" --index "$work/part-$k.lookup" --shard "$k/$n" --workers "$workers")
  printf 'shard %d/%d            %8.1f s\n' "$k" "$n" "$s"
  total=$(awk -v a="$total" -v b="$s" 'BEGIN { printf "%.2f", a + b }')
  parts+=("$work/part-$k.lookup")
done
awk -v t="$total" -v s="$single" 'BEGIN { printf "sum of shards        %8.1f s  (%+.1f s, %+.0f %% against one process)\n", t, t - s, 100 * (t - s) / s }'
merge=$(timed merge "${parts[@]}" --index "$work/merged.lookup")
printf 'merge                %8.1f s\n' "$merge"
idle=$(timed ingest "$tree" --index "$work/part-1.lookup" --shard "1/$n" --workers "$workers")
printf 'shard rerun, nothing to do %4.1f s  (start, model load, scan of the whole tree, plan)\n' "$idle"
