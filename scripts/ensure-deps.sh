#!/usr/bin/env bash
# `npm ci` when node_modules is missing or older than the committed lock file.
set -euo pipefail
cd "$(dirname "$0")/.."
want=$(sha256sum package-lock.json | cut -d' ' -f1)
have=$(cat node_modules/.dropwright-lock 2>/dev/null || true)
if [ ! -d node_modules ] || [ "$want" != "$have" ]; then
  echo "[deps] installing from package-lock.json (npm ci)" >&2
  npm ci --no-audit --no-fund --loglevel=error >&2
  echo "$want" > node_modules/.dropwright-lock
fi
