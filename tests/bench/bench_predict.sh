#!/usr/bin/env bash
# Benchmark: single-thread `pkad predict` throughput on the NCI first_5K set against bare
# Open Babel SMILES parsing of the same molecules (bench_parse), both timed in this run as
# whole processes, best of three. Usage: bench_predict.sh PKAD_BIN BENCH_PARSE_BIN [FILE.smi]
# (`cmake --build build --target bench` runs it with the built binaries.)
set -euo pipefail
pkad="$1"
parse="$2"
set_file="${3:-/usr/share/RDKit/Data/NCI/first_5K.smi}"
for b in "$pkad" "$parse"; do
  [ -x "$b" ] || { echo "bench: $b is not an executable" >&2; exit 2; }
done
if [ ! -r "$set_file" ]; then
  echo "bench: skip: $set_file not found (Debian package rdkit-data)"
  exit 0
fi
n="$(grep -cv '^[[:space:]]*\(#\|$\)' "$set_file")"

# best wall time of three runs of the command, in nanoseconds
best_of_three() {
  local best=0 t0 t1 st
  for _ in 1 2 3; do
    t0="$(date +%s%N)"
    # status 1 only says that some molecule of the set was answered with an error
    st=0; "$@" >/dev/null || st=$?
    [ "$st" -le 1 ] || { echo "bench: $* exited with $st" >&2; exit 2; }
    t1="$(date +%s%N)"
    if [ "$best" -eq 0 ] || [ $((t1 - t0)) -lt "$best" ]; then best=$((t1 - t0)); fi
  done
  echo "$best"
}

t_predict="$(best_of_three "$pkad" predict --threads 1 --no-progress "$set_file")"
t_parse="$(best_of_three "$parse" "$set_file")"
awk -v n="$n" -v tp="$t_predict" -v tb="$t_parse" 'BEGIN {
  tp /= 1e9; tb /= 1e9
  printf "bench: %d molecules; predict %.3f s, parse %.3f s\n", n, tp, tb
  printf "predict %.0f mol/s, parse %.0f mol/s, ratio %.2f\n", n / tp, n / tb, tb / tp
}'
