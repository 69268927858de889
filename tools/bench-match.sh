#!/usr/bin/env bash
# Latency of `lookup match` as a whole process (start, model load, index open, decode, crops, search, ranking) on an
# index of 100,000 photos, built without embedding 100,000 photos: the demo catalogue is ingested, then
# tools/MatchBench grows the index with synthetic photo records whose vectors are noisy copies of the real ones
# (three per synthetic SKU, each inserted into the graph). The CLI is published twice for linux-x64: ReadyToRun (as
# a release ships it) and plain IL (compiled at run time), to show what precompiling saves.
#
# Each command runs once to warm the file cache, then RUNS times under /usr/bin/time; the table gives the median
# wall time and the median CPU time (user + system, all threads). On a machine shared with other work the wall time
# grows with the load while the CPU time mostly does not: on two idle cores a run takes about its CPU time divided
# by the cores it keeps busy, and never less than CPU ÷ 2.
#
# Usage: tools/bench-match.sh [runs, default 10]
# Environment: BENCH_DIR (default /tmp/lookup-bench-match; the index is kept there and reused), PHOTOS (100000),
# PHOTO (the query, default demo-catalogue/field/bench-07.jpg), VARIANTS ("r2r jit").
# Results go in DEVELOPERS.md, section Matching. Run it on a quiet machine: other work on the cores inflates every figure.
set -euo pipefail
cd "$(dirname "$0")/.."
runs="${1:-10}"
dir="${BENCH_DIR:-/tmp/lookup-bench-match}"
photos="${PHOTOS:-100000}"
photo="${PHOTO:-demo-catalogue/field/bench-07.jpg}"
variants="${VARIANTS:-r2r jit}"
index="$dir/parts-${photos}.lookup"
mkdir -p "$dir"

for variant in $variants; do
  r2r=$([[ $variant == r2r ]] && echo true || echo false)
  echo "== publishing the CLI ($variant, linux-x64) to $dir/cli-$variant" >&2
  dotnet publish src/Lookup.Cli -c Release -r linux-x64 --self-contained false -p:PublishReadyToRun="$r2r" \
    -o "$dir/cli-$variant" --nologo -v quiet >&2
done
first="$dir/cli-${variants%% *}/Lookup.Cli"

if [[ ! -f "$index" ]]; then
  echo "== building $index: ingest the demo catalogue, then grow to $photos photos" >&2
  rm -f "$index.tmp"*
  "$first" ingest demo-catalogue/photos --index "$index.tmp" --quiet >&2
  dotnet run -c Release --project tools/MatchBench -- grow --index "$index.tmp" --to "$photos" >&2
  mv "$index.tmp" "$index"
  rm -f "$index.tmp".*
fi

queries=(
  "match $photo --index $index"
  "match $photo --index $index --crops standard"
  "match $photo --index $index --crops none"
  "match --like HB-M8x40-ZN --index $index"
  "--version"
)
median() { sort -n | awk '{ v[NR] = $1 } END { if (NR % 2) print v[(NR + 1) / 2]; else print (v[NR / 2] + v[NR / 2 + 1]) / 2 }'; }

echo "== $(nproc) cores, load average $(cut -d' ' -f1-3 /proc/loadavg), $(date -u +%FT%TZ), $runs runs per command"
echo
echo "| build | command | median wall s | median CPU s (user + sys) | load before → after |"
echo "| --- | --- | ---: | ---: | --- |"
times="$dir/times.txt"
for variant in $variants; do
  cli="$dir/cli-$variant/Lookup.Cli"
  for query in "${queries[@]}"; do
    # shellcheck disable=SC2086 # the query is a list of words on purpose
    $cli $query >/dev/null
    before=$(cut -d' ' -f1 /proc/loadavg)
    : >"$times"
    for ((i = 0; i < runs; i++)); do
      # shellcheck disable=SC2086
      /usr/bin/time -f '%e %U %S' -a -o "$times" $cli $query >/dev/null
    done
    wall=$(awk '{ print $1 }' "$times" | median)
    cpu=$(awk '{ print $2 + $3 }' "$times" | median)
    echo "| $variant | lookup ${query//$dir\//} | $wall | $cpu | $before → $(cut -d' ' -f1 /proc/loadavg) |"
  done
done
