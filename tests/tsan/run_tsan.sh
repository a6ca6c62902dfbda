#!/usr/bin/env bash
# Builds a ThreadSanitizer tree and runs the obwrap thread-safety test in it (used by CI).
# usage: tests/tsan/run_tsan.sh [BUILD_DIR]   (default: build-tsan under the source tree)
set -euo pipefail
src="$(cd "$(dirname "$0")/../.." && pwd)"
build="${1:-$src/build-tsan}"
cmake -S "$src" -B "$build" -DCMAKE_BUILD_TYPE=Debug -DTSAN=ON -DWERROR=ON >/dev/null
cmake --build "$build" -j2 --target test_obwrap_threads test_obwrap
# halt_on_error: any report fails the run; the test's own checks still decide the rest.
export TSAN_OPTIONS="halt_on_error=1 second_deadlock_stack=1 ${TSAN_OPTIONS:-}"
export PKAD_SOURCE_DIR="$src"
"$build/tests/test_obwrap"
"$build/tests/test_obwrap_threads"
echo "tsan: clean"
