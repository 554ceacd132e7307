#!/usr/bin/env bash
# Starts (or stops) the local fakes of outside services on loopback. Each fake is a
# small Node program under scripts/fakes/; a running one is reused.
set -euo pipefail
ROOT="$(cd "$(dirname "${BASH_SOURCE[0]}")/.." && pwd)"
cd "$ROOT"
RUN="${RUN:-$ROOT/.data/run}"
mkdir -p "$RUN"

start_one() {
  local name="$1" port="$2" file="scripts/fakes/$1.ts"
  [ -f "$file" ] || return 0
  if [ -f "$RUN/$name.pid" ] && kill -0 "$(cat "$RUN/$name.pid")" 2>/dev/null; then return 0; fi
  nohup node_modules/.bin/tsx "$file" >"$RUN/$name.log" 2>&1 &
  echo $! >"$RUN/$name.pid"
  for _ in $(seq 1 100); do
    (exec 3<>"/dev/tcp/127.0.0.1/$port") 2>/dev/null && { echo "Local $name fake on 127.0.0.1:$port."; return 0; }
    sleep 0.1
  done
  echo "The $name fake did not start; see $RUN/$name.log"
  exit 1
}

stop_all() {
  for f in "$RUN"/*.pid; do
    [ -f "$f" ] || continue
    kill "$(cat "$f")" 2>/dev/null || true
    rm -f "$f"
  done
}

case "${1:-start}" in
  start)
    start_one mail "${MAIL_UI_PORT:-2580}"
    start_one payments "${STRIPE_FAKE_PORT:-12111}"
    ;;
  stop) stop_all ;;
esac
