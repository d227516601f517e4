#!/usr/bin/env bash
# `npm run bench:browser`: the editor at 512, 4,096 and 16,384 nozzles in headless Chromium, against the built
# server (scripts/bench/browser.ts). Not a test. Builds when there is no build or DW_BENCH_BUILD=1;
# DW_BENCH_OUTPUT=<folder> runs another build's server (e.g. a copy of main's `.output`, to compare).
set -euo pipefail
cd "$(dirname "$0")/.."
. scripts/prepare.sh
prepare test
if [ -z "${DW_BENCH_OUTPUT:-}" ] && { [ ! -f .output/server/index.mjs ] || [ "${DW_BENCH_BUILD:-}" = 1 ]; }; then build_app; fi
exec npx tsx scripts/bench/browser.ts
