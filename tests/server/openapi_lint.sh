#!/usr/bin/env bash
# Validates server/openapi.json with an OpenAPI linter from the npm registry (Redocly CLI),
# installed into a test-local node_modules. Exit 77 (skipped) without npm or network.
# That every route of routes.c is documented is checked by server_routes
# (test_openapi__documents_every_route), which reads the route table itself.
set -uo pipefail
src="${PKAD_SOURCE_DIR:?PKAD_SOURCE_DIR is not set}"
work="${PKAD_LINT_DIR:-${TMPDIR:-/tmp}/pkad-openapi-lint}"
linter="@redocly/cli@2.77.0"
if ! command -v npm >/dev/null 2>&1; then
  echo "skipped: npm is not installed (Debian packages nodejs npm; deploy/setup.sh --test)"
  exit 77
fi
mkdir -p "$work"
if [ ! -x "$work/node_modules/.bin/redocly" ]; then
  if ! (cd "$work" && npm install --no-audit --no-fund --loglevel=error "$linter" >/dev/null 2>&1); then
    echo "skipped: could not install $linter from the npm registry (offline?)"
    exit 77
  fi
fi
"$work/node_modules/.bin/redocly" lint --format stylish "$src/server/openapi.json"
