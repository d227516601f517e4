#!/usr/bin/env bash
# `npm run bench:api` / `bench:upload`: a benchmark against the built server and the real PostgreSQL (test
# database): `bash scripts/bench-server.sh api` runs scripts/bench/api.ts. Builds first (a stale build would measure
# old code) unless DW_SKIP_BUILD is set.
set -euo pipefail
cd "$(dirname "$0")/.."
bench=${1:?name the benchmark: api or upload}
[ -f "scripts/bench/$bench.ts" ] || { echo "no benchmark scripts/bench/$bench.ts" >&2; exit 2; }
. scripts/prepare.sh
prepare test
start_smtp
[ -n "${DW_SKIP_BUILD:-}" ] || build_app
exec npx tsx "scripts/bench/$bench.ts"
