#!/usr/bin/env bash
# `npm start`: dependencies, PostgreSQL, migrations, demo data, build, then serve on 127.0.0.1:${PORT:-3000}.
set -euo pipefail
cd "$(dirname "$0")/.."
. scripts/prepare.sh
prepare app
start_smtp
build_app
export HOST=${HOST:-127.0.0.1} PORT=${PORT:-3000}
# The one address of the app: links in e-mail and the origin the CSRF check accepts (set your own behind a proxy).
case "$HOST" in 0.0.0.0|::|'[::]') public_host=localhost ;; *) public_host=$HOST ;; esac
export DW_PUBLIC_URL=${DW_PUBLIC_URL:-http://$public_host:$PORT}
npx tsx scripts/print-demo.ts "$DW_PUBLIC_URL"
exec node .output/server/index.mjs
