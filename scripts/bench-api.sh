#!/usr/bin/env bash
# `npm run bench:api`: load and chaos on the built server and the real PostgreSQL (test database), with autocannon.
# Builds first (a stale build would measure old code) unless DW_SKIP_BUILD is set.
set -euo pipefail
cd "$(dirname "$0")/.."
. scripts/prepare.sh
prepare test
start_smtp
[ -n "${DW_SKIP_BUILD:-}" ] || build_app
exec npx tsx scripts/bench/api.ts
