#!/usr/bin/env bash
# Builds a ThreadSanitizer tree and runs the daemon's concurrency test against it: 16
# clients in parallel against `pkad serve --threads 4`; any race report fails the run.
# usage: tests/tsan/run_server_tsan.sh [BUILD_DIR]   (default: build-tsan under the source tree)
set -euo pipefail
src="$(cd "$(dirname "$0")/../.." && pwd)"
build="${1:-$src/build-tsan}"
cmake -S "$src" -B "$build" -DCMAKE_BUILD_TYPE=Debug -DTSAN=ON -DWERROR=ON >/dev/null
cmake --build "$build" -j2 --target pkad test_server_concurrency
log="$(mktemp)"
trap 'rm -f "$log"' EXIT
# exitcode: a daemon that saw a race exits 66, which the test's exit-status check catches.
export TSAN_OPTIONS="exitcode=66 second_deadlock_stack=1 ${TSAN_OPTIONS:-}"
export PKAD_SOURCE_DIR="$src" PKAD_BIN="$build/server/pkad" PKAD_TEST_LOG="$log"
status=0
"$build/tests/test_server_concurrency" || status=$?
reports=$(grep -c "WARNING: ThreadSanitizer" "$log" || true)
echo "tsan: daemon reports: $reports"
if [ "$reports" -ne 0 ]; then
  grep -A 30 "WARNING: ThreadSanitizer" "$log" | head -80
  exit 1
fi
[ "$status" -eq 0 ] || [ "$status" -eq 77 ] || exit "$status"
echo "tsan: clean"
