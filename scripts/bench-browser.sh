#!/usr/bin/env bash
# `npm run bench:browser`: the editor on the 512-nozzle chip in headless Chromium, against the built server. Not a test.
set -euo pipefail
cd "$(dirname "$0")/.."
bash scripts/ensure-deps.sh
if [ -z "${DATABASE_URL:-}" ]; then
  bash scripts/db.sh start
  set -a; . .data/postgres.env; set +a
fi
export DATABASE_URL=${TEST_DATABASE_URL:-$DATABASE_URL}
npx tsx scripts/migrate.ts --test
npx tsx scripts/seed.ts --test
[ -f .output/server/index.mjs ] || npx nuxt build > .data/build.log 2>&1
exec npx tsx scripts/bench/browser.ts
