#!/usr/bin/env bash
# `npm run dev`: like `npm start`, with hot reload instead of a build.
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
npx tsx scripts/print-demo.ts "http://127.0.0.1:${PORT:-3000}"
exec npx nuxt dev --host 127.0.0.1 --port "${PORT:-3000}"
