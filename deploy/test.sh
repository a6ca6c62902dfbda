#!/usr/bin/env bash
# Installs what is missing, builds pkad with warnings as errors, runs the whole test suite,
# then the unit tests again under AddressSanitizer and UBSan, then the thread tests under TSan.
set -euo pipefail
cd "$(dirname "$0")/.."
bash deploy/setup.sh --test
jobs="$(nproc)"
cmake -S . -B build -DCMAKE_BUILD_TYPE=Release -DWERROR=ON >/dev/null
cmake --build build -j"$jobs"
ctest --test-dir build --output-on-failure -j"$jobs"
cmake -S . -B build-asan -DCMAKE_BUILD_TYPE=Debug -DWERROR=ON -DSANITIZE=ON >/dev/null
cmake --build build-asan -j"$jobs"
ASAN_OPTIONS=detect_leaks=1 LSAN_OPTIONS="suppressions=$PWD/tests/lsan.supp" \
  ctest --test-dir build-asan --output-on-failure -j"$jobs" -L unit
# Thread safety of the Open Babel wrapper and of the daemon, under ThreadSanitizer.
bash tests/tsan/run_tsan.sh "$PWD/build-tsan"
bash tests/tsan/run_server_tsan.sh "$PWD/build-tsan"
