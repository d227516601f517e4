#!/usr/bin/env bash
# `npm start`: dependencies, PostgreSQL, migrations, demo data, build, then serve on 127.0.0.1:${PORT:-3000}.
set -euo pipefail
cd "$(dirname "$0")/.."
bash scripts/ensure-deps.sh
if [ -z "${DATABASE_URL:-}" ]; then
  bash scripts/db.sh start
  set -a; . .data/postgres.env; set +a
fi
if [ -z "${SMTP_URL:-}" ]; then
  bash scripts/smtp.sh start
  set -a; . .data/smtp.env; set +a
fi
npx tsx scripts/migrate.ts
npx tsx scripts/seed.ts
echo "[build] nuxt build" >&2
npx nuxt build > .data/build.log 2>&1 || { tail -40 .data/build.log >&2; exit 1; }
export HOST=${HOST:-127.0.0.1} PORT=${PORT:-3000}
npx tsx scripts/print-demo.ts "http://$HOST:$PORT"
exec node .output/server/index.mjs
