#!/usr/bin/env bash
# `npm run bench:browser`: the editor on the 512-nozzle chip in headless Chromium, against the built server. Not a test.
set -euo pipefail
cd "$(dirname "$0")/.."
. scripts/prepare.sh
prepare test
[ -f .output/server/index.mjs ] || build_app
exec npx tsx scripts/bench/browser.ts
