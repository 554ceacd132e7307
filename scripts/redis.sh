#!/usr/bin/env bash
# A private Redis for this project, as scripts/db.sh does for MariaDB: installed from Debian when
# missing, data in .data/redis-<port>, bound to 127.0.0.1. `redis.sh start [PORT]` is safe to
# repeat (a running instance is reused) and prints nothing else; `redis.sh stop [PORT]` shuts it
# down. Only queue mode (REDIS_URL) and the tests that need Redis use it; `npm start` does not.
set -euo pipefail
ROOT="$(cd "$(dirname "${BASH_SOURCE[0]}")/.." && pwd)"
PORT="${2:-${REDIS_PORT:-6390}}"
D="$ROOT/.data/redis-$PORT"

install_if_missing() {
  if ! command -v redis-server >/dev/null 2>&1; then
    echo "Installing Redis from Debian's packages…"
    apt-get update -q >/dev/null
    DEBIAN_FRONTEND=noninteractive apt-get install -y -q --no-install-recommends redis-server >/dev/null
  fi
}

running() { redis-cli -h 127.0.0.1 -p "$PORT" ping >/dev/null 2>&1; }

start() {
  install_if_missing
  mkdir -p "$D"
  if running; then
    echo "Redis already running on 127.0.0.1:$PORT."
    return 0
  fi
  # No persistence: queued runs also live in MariaDB, which is the record a restart recovers from.
  redis-server --port "$PORT" --bind 127.0.0.1 --dir "$D" --save "" --appendonly no \
    --daemonize yes --pidfile "$D/redis.pid" --logfile "$D/redis.log" >/dev/null
  for _ in $(seq 1 100); do
    running && break
    sleep 0.1
  done
  running || { echo "Redis did not start; see $D/redis.log"; exit 1; }
  echo "Redis started on 127.0.0.1:$PORT."
}

stop() {
  if running; then
    redis-cli -h 127.0.0.1 -p "$PORT" shutdown nosave >/dev/null 2>&1 || true
    echo "Redis stopped."
  elif [ -f "$D/redis.pid" ]; then
    kill "$(cat "$D/redis.pid")" 2>/dev/null || true
  fi
  rm -f "$D/redis.pid"
}

case "${1:-start}" in
  start) start ;;
  stop) stop ;;
  *) echo "usage: redis.sh start|stop [PORT]"; exit 2 ;;
esac
