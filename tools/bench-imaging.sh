#!/usr/bin/env bash
# Imaging and embedding benchmark (single thread): decode + resize of generated 2 MP and 12 MP JPEGs, dHash, and
# inference per photo. Usage: tools/bench-imaging.sh [timed-runs, default 20]. Results go in DEVELOPERS.md,
# section "Imaging and embedding". Run it on a quiet machine: other builds on the 2 cores inflate every figure.
set -euo pipefail
cd "$(dirname "$0")/.."
exec dotnet run -c Release --file tools/bench-imaging.cs -- "${1:-20}"
