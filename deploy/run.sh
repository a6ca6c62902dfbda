#!/usr/bin/env bash
# Installs what is missing, builds pkad, and starts the daemon on its embedded default.
set -euo pipefail
cd "$(dirname "$0")/.."
bash deploy/setup.sh
cmake -S . -B build -DCMAKE_BUILD_TYPE=Release >/dev/null
cmake --build build -j"$(nproc)" >/dev/null
exec ./build/server/pkad serve "$@"
