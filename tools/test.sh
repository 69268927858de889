#!/usr/bin/env bash
# The project's test command: restore, build (warnings are errors) and run every test.
set -euo pipefail
cd "$(dirname "$0")/.."
dotnet test Lookup.sln -c Release --nologo "$@"
