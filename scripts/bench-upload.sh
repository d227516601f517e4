#!/usr/bin/env bash
# `npm run bench:upload`: the designs list's latency while 20 MB micrographs are uploaded (scripts/bench/upload.ts).
set -euo pipefail
cd "$(dirname "$0")/.."
. scripts/prepare.sh
prepare test
start_smtp
[ -n "${DW_SKIP_BUILD:-}" ] || build_app
exec npx tsx scripts/bench/upload.ts
