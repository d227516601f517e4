#!/usr/bin/env bash
# `npm test`: everything the tests need on a fresh machine, then every test (unit, api, browser).
# Extra arguments go to vitest: `npm test -- tests/unit/roles.test.ts`.
set -euo pipefail
cd "$(dirname "$0")/.."
. scripts/prepare.sh
mkdir -p .data
prepare test
# The tests read the mail that arrived, so they always send to the local fake SMTP, whatever SMTP_URL says.
start_smtp always
bash scripts/ensure-system.sh
[ -n "${DW_SKIP_BUILD:-}" ] || build_app
# A full run (no arguments) also lints and type-checks the whole project, as CI does (DW_LINT=1 lints a partial run).
if [ $# -eq 0 ] || [ -n "${DW_LINT:-}" ]; then
  echo "[lint] eslint ." >&2
  npx eslint . > .data/lint.log 2>&1 || { grep -E 'error' .data/lint.log >&2 || tail -20 .data/lint.log >&2; tail -3 .data/lint.log >&2; exit 1; }
  echo "[format] prettier --check ." >&2
  npx prettier --check . > .data/format.log 2>&1 || { grep -F '[warn]' .data/format.log >&2; echo "[format] run: npm run format" >&2; exit 1; }
fi
if [ $# -eq 0 ]; then
  echo "[typecheck] nuxt typecheck" >&2
  npx nuxt typecheck > .data/typecheck.log 2>&1 || { grep -E 'error TS' .data/typecheck.log >&2 || tail -20 .data/typecheck.log >&2; exit 1; }
fi
exec npx vitest run --reporter=default --reporter=json --outputFile.json=.data/vitest.json "$@"
