#!/usr/bin/env bash
# Refits fragments/params.tsv on the train split from the tables alone, so that the result
# does not depend on the previous fit: a scratch copy of fragments/ keeps of params.tsv only
# the rows `pkad fit` does not fit (global.interaction*, global.unc_*) and the held priors
# (a site parameter or corr. row whose prior_sd was set below 0.2 by hand; value reset to its
# prior) and the fall-off held at 0.40, `pkad fit` runs on that copy, and its params.tsv replaces fragments/params.tsv.
# Usage: bash data/refit.sh [PKAD_BIN]   (default build/server/pkad); rebuild afterwards,
# then run the gates (ctest -L gate) and data/make_report.sh.
set -euo pipefail
cd "$(dirname "$0")/.."
pkad="${1:-build/server/pkad}"
scratch="$(mktemp -d)"
trap 'rm -rf "$scratch"' EXIT
cp -r fragments "$scratch/fragments"
awk -F'\t' -v OFS='\t' '
  /^#/ || $1 == "id" { print; next }
  $1 == "global.falloff" { $2 = 0.40; $3 = 0.40; $7 = "held at 0.40 (common practice, about 0.4 per bond): the train fit is flat from 0.38 to 0.42 (weighted rmse 0.586-0.588 on 2026-12-02) and the free search landed on 0.377, 0.391 or 0.421 in successive refits"; print; next }
  $7 != "fitted" && $7 !~ /^not fitted/ { print; next }
  $4 + 0 < 0.2 && ($1 ~ /\.(parent|rho|rho_star|rho_para)$/ || $1 ~ /^corr\./) { $2 = $3; $7 = "held prior"; print }
' fragments/params.tsv > "$scratch/fragments/params.tsv"
"$pkad" fit --no-falloff --fragments "$scratch/fragments" --out "$scratch/fragments/params.tsv" \
  data/handbook-acids.csv data/handbook-bases.csv data/handbook-additions.csv data/iupac-pka.csv
cp "$scratch/fragments/params.tsv" fragments/params.tsv
echo "refit: fragments/params.tsv written; rebuild to embed it"
