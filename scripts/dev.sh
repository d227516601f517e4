#!/usr/bin/env bash
# `npm run dev`: like `npm start`, with hot reload instead of a build.
set -euo pipefail
cd "$(dirname "$0")/.."
. scripts/prepare.sh
prepare app
start_smtp
npx tsx scripts/print-demo.ts "http://127.0.0.1:${PORT:-3000}"
exec npx nuxt dev --host 127.0.0.1 --port "${PORT:-3000}"
