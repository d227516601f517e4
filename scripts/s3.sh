#!/usr/bin/env bash
# Local fake S3 for this checkout: `s3.sh start | stop | status`.
# Runs scripts/fake-s3.ts (s3rver) in the background on 127.0.0.1, on a port derived from the checkout (or
# DW_S3_PORT), keeping objects in .data/s3/. Writes .data/s3.env (DW_S3_ENDPOINT, DW_S3_BUCKET, keys) for the other
# scripts to source. A second start reuses the running one. With DW_S3_ENDPOINT set, nothing here runs.
set -euo pipefail
cd "$(dirname "$0")/.."
ROOT=$(pwd)
KEY=$(printf '%s' "$ROOT" | cksum | cut -d' ' -f1)
PORT=${DW_S3_PORT:-$((26000 + KEY % 900))}
BUCKET=${DW_S3_BUCKET:-dropwright}
ENV_FILE="$ROOT/.data/s3.env"
PID_FILE="$ROOT/.data/s3.pid"

log() { printf '[s3] %s\n' "$*" >&2; }

# The fake answers a bucket listing with its own bucket; anything else (or nothing) is not ours.
ours() { curl -fsS --max-time 2 "http://127.0.0.1:$PORT/" 2>/dev/null | grep -q "<Name>$BUCKET</Name>"; }
listening() { timeout 1 bash -c "exec 3<>/dev/tcp/127.0.0.1/$PORT" 2>/dev/null; }

write_env() {
  mkdir -p "$ROOT/.data"
  cat > "$ENV_FILE" <<ENV
DW_S3_ENDPOINT=http://127.0.0.1:$PORT
DW_S3_BUCKET=$BUCKET
DW_S3_REGION=us-east-1
DW_S3_ACCESS_KEY=S3RVER
DW_S3_SECRET_KEY=S3RVER
ENV
}

start() {
  if [ -n "${DW_S3_ENDPOINT:-}" ]; then log "DW_S3_ENDPOINT is set: storing there, not starting the local fake S3"; return; fi
  mkdir -p "$ROOT/.data/s3"
  if ours; then write_env; log "fake S3 already listening on 127.0.0.1:$PORT"; return; fi
  if listening; then
    log "port $PORT on 127.0.0.1 is taken by another program. Stop it, or choose another port: DW_S3_PORT=4569 npm start"
    exit 1
  fi
  setsid nohup node_modules/.bin/tsx scripts/fake-s3.ts "$PORT" "$BUCKET" >> "$ROOT/.data/s3.log" 2>&1 < /dev/null &
  echo $! > "$PID_FILE"
  for _ in $(seq 1 150); do
    if ours; then write_env; log "fake S3 listening on 127.0.0.1:$PORT (bucket $BUCKET, objects in .data/s3/)"; return; fi
    sleep 0.1
  done
  log "the fake S3 did not start; see .data/s3.log"; tail -5 "$ROOT/.data/s3.log" >&2; exit 1
}

stop() {
  if [ -f "$PID_FILE" ] && kill -0 "$(cat "$PID_FILE")" 2>/dev/null; then
    kill -- "-$(cat "$PID_FILE")" 2>/dev/null || kill "$(cat "$PID_FILE")"; rm -f "$PID_FILE"; log "stopped"
  else
    log "not running (or not started by this checkout)"
  fi
}

case "${1:-start}" in
  start) start ;;
  stop) stop ;;
  status) if ours; then echo "listening on 127.0.0.1:$PORT"; else echo "stopped"; fi ;;
  *) echo "usage: s3.sh start|stop|status" >&2; exit 64 ;;
esac
