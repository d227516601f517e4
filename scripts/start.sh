#!/usr/bin/env bash
# `npm start`: dependencies, PostgreSQL, migrations, demo data, build, then serve on 127.0.0.1:${PORT:-3000}.
set -euo pipefail
cd "$(dirname "$0")/.."
. scripts/prepare.sh
prepare app
start_smtp
build_app
export HOST=${HOST:-127.0.0.1} PORT=${PORT:-3000}
npx tsx scripts/print-demo.ts "http://$HOST:$PORT"
exec node .output/server/index.mjs
