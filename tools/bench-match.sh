#!/usr/bin/env bash
# Latency of `lookup match` as a whole process (start, model load, index open, decode, crops, search, ranking) on an
# index of 100,000 photos, built without embedding 100,000 photos: the demo catalogue is ingested, then
# tools/MatchBench grows the index with synthetic photo records whose vectors are noisy copies of the real ones
# (three per synthetic SKU, each inserted into the graph). The CLI is published ReadyToRun for linux-x64, as a
# release would ship it. Timing: hyperfine if installed (Debian package `hyperfine`), otherwise a loop of runs.
#
# Usage: tools/bench-match.sh [runs, default 10]
# Environment: BENCH_DIR (default /tmp/lookup-bench-match; the index is kept there and reused), PHOTOS (100000).
# Results go in DEVELOPERS.md, section Matching. Run it on a quiet machine: other work on the cores inflates every figure.
set -euo pipefail
cd "$(dirname "$0")/.."
runs="${1:-10}"
dir="${BENCH_DIR:-/tmp/lookup-bench-match}"
photos="${PHOTOS:-100000}"
index="$dir/parts-${photos}.lookup"
cli="$dir/cli/Lookup.Cli"
mkdir -p "$dir"

echo "== publishing the CLI (ReadyToRun, linux-x64) to $dir/cli" >&2
dotnet publish src/Lookup.Cli -c Release -r linux-x64 --self-contained false -p:PublishReadyToRun=true -o "$dir/cli" --nologo -v quiet >&2

if [[ ! -f "$index" ]]; then
  echo "== building $index: ingest the demo catalogue, then grow to $photos photos" >&2
  rm -f "$index.tmp"*
  "$cli" ingest demo-catalogue/photos --index "$index.tmp" --quiet >&2
  dotnet run -c Release --project tools/MatchBench -- grow --index "$index.tmp" --to "$photos" >&2
  mv "$index.tmp" "$index"
  rm -f "$index.tmp".*
fi

photo=demo-catalogue/field/bench-07.jpg
commands=(
  "$cli match $photo --index $index"
  "$cli match $photo --index $index --crops none"
  "$cli match $photo --index $index --crops standard"
  "$cli match $photo --index $index --crops dense"
  "$cli match --like HB-M8x40-ZN --index $index"
)
echo "== $(nproc) cores, load average $(cut -d' ' -f1-3 /proc/loadavg), $(date -u +%FT%TZ)"
if command -v hyperfine >/dev/null; then
  hyperfine --warmup 1 --runs "$runs" --shell=none --export-markdown "$dir/match-latency.md" "${commands[@]}"
  cat "$dir/match-latency.md"
else
  for command in "${commands[@]}"; do
    $command >/dev/null
    start=$(date +%s%N)
    for ((i = 0; i < runs; i++)); do $command >/dev/null; done
    echo "$(( ($(date +%s%N) - start) / runs / 1000000 )) ms  $command"
  done
fi
