#!/usr/bin/env bash
# `npm run bench:api`: load on the built server and the real PostgreSQL (test database), with autocannon.
set -euo pipefail
cd "$(dirname "$0")/.."
. scripts/prepare.sh
prepare test
[ -f .output/server/index.mjs ] || build_app
exec npx tsx scripts/bench/api.ts
