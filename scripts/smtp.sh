#!/usr/bin/env bash
# Local fake SMTP for this checkout: `smtp.sh start | stop | status`.
# Runs scripts/fake-smtp.ts in the background on 127.0.0.1, on a port derived from the checkout (or DW_SMTP_PORT),
# keeping every message in .data/mail/. Writes .data/smtp.env (SMTP_URL, DW_DEV_OUTBOX, DW_MAIL_DIR) for the other
# scripts to source. A second start reuses the running one. With SMTP_URL set, nothing here runs.
set -euo pipefail
cd "$(dirname "$0")/.."
ROOT=$(pwd)
KEY=$(printf '%s' "$ROOT" | cksum | cut -d' ' -f1)
PORT=${DW_SMTP_PORT:-$((25000 + KEY % 900))}
ENV_FILE="$ROOT/.data/smtp.env"
PID_FILE="$ROOT/.data/smtp.pid"
MAIL_DIR="$ROOT/.data/mail"
BANNER='Dropwright local fake SMTP'

log() { printf '[smtp] %s\n' "$*" >&2; }

# The first line the server on PORT says, or nothing when no one listens.
greeting() { timeout 2 bash -c "exec 3<>/dev/tcp/127.0.0.1/$PORT && head -n1 <&3" 2>/dev/null || true; }

write_env() {
  mkdir -p "$ROOT/.data"
  cat > "$ENV_FILE" <<ENV
SMTP_URL=smtp://127.0.0.1:$PORT
DW_DEV_OUTBOX=1
DW_MAIL_DIR=$MAIL_DIR
ENV
}

start() {
  if [ -n "${SMTP_URL:-}" ]; then log "SMTP_URL is set: sending there, not starting the local fake SMTP"; return; fi
  mkdir -p "$MAIL_DIR"
  local hello; hello=$(greeting)
  if [[ "$hello" == *"$BANNER"* ]]; then write_env; log "fake SMTP already listening on 127.0.0.1:$PORT"; return; fi
  if [ -n "$hello" ]; then
    log "port $PORT on 127.0.0.1 is taken by another program. Stop it, or choose another port: DW_SMTP_PORT=2526 npm start"
    exit 1
  fi
  DW_MAIL_DIR="$MAIL_DIR" setsid nohup node_modules/.bin/tsx scripts/fake-smtp.ts "$PORT" >> "$ROOT/.data/smtp.log" 2>&1 < /dev/null &
  echo $! > "$PID_FILE"
  for _ in $(seq 1 100); do
    if [[ "$(greeting)" == *"$BANNER"* ]]; then
      write_env
      log "fake SMTP listening on 127.0.0.1:$PORT (mail kept in .data/mail/)"
      return
    fi
    sleep 0.1
  done
  log "the fake SMTP did not start; see .data/smtp.log"; tail -5 "$ROOT/.data/smtp.log" >&2; exit 1
}

stop() {
  if [ -f "$PID_FILE" ] && kill -0 "$(cat "$PID_FILE")" 2>/dev/null; then
    kill "$(cat "$PID_FILE")"; rm -f "$PID_FILE"; log "stopped"
  else
    log "not running (or not started by this checkout)"
  fi
}

case "${1:-start}" in
  start) start ;;
  stop) stop ;;
  status) if [[ "$(greeting)" == *"$BANNER"* ]]; then echo "listening on 127.0.0.1:$PORT"; else echo "stopped"; fi ;;
  *) echo "usage: smtp.sh start|stop|status" >&2; exit 64 ;;
esac
