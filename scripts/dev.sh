#!/usr/bin/env bash
# `npm run dev`: like `npm start`, with hot reload instead of a build.
set -euo pipefail
cd "$(dirname "$0")/.."
. scripts/prepare.sh
prepare app
start_smtp
# The one address of the app: links in e-mail and the origin the CSRF check accepts.
export DW_PUBLIC_URL=${DW_PUBLIC_URL:-http://127.0.0.1:${PORT:-3000}}
npx tsx scripts/print-demo.ts "$DW_PUBLIC_URL"
exec npx nuxt dev --host 127.0.0.1 --port "${PORT:-3000}"
