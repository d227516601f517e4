#!/usr/bin/env bash
# `npm test`: everything the tests need on a fresh machine, then every test (unit, api, browser).
# Extra arguments go to vitest: `npm test -- tests/unit/roles.test.ts`.
set -euo pipefail
cd "$(dirname "$0")/.."
bash scripts/ensure-deps.sh
if [ -z "${DATABASE_URL:-}" ]; then
  bash scripts/db.sh start
  set -a; . .data/postgres.env; set +a
fi
# The tests read the mail that arrived, so they always send to the local fake SMTP, whatever SMTP_URL says.
SMTP_URL= bash scripts/smtp.sh start
set -a; . .data/smtp.env; set +a
export DATABASE_URL=${TEST_DATABASE_URL:-$DATABASE_URL}
bash scripts/ensure-system.sh
npx tsx scripts/migrate.ts --test
npx tsx scripts/seed.ts --test
if [ -z "${DW_SKIP_BUILD:-}" ]; then
  echo "[build] nuxt build" >&2
  npx nuxt build > .data/build.log 2>&1 || { tail -40 .data/build.log >&2; exit 1; }
fi
mkdir -p .data
# A full run (no arguments) also type-checks the whole project, as CI does.
if [ $# -eq 0 ]; then
  echo "[typecheck] nuxt typecheck" >&2
  npx nuxt typecheck > .data/typecheck.log 2>&1 || { grep -E 'error TS' .data/typecheck.log >&2 || tail -20 .data/typecheck.log >&2; exit 1; }
fi
exec npx vitest run --reporter=default --reporter=json --outputFile.json=.data/vitest.json "$@"
