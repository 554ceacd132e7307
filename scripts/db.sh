#!/usr/bin/env bash
# A private MariaDB for this project: installed from Debian when missing, data in .data/mariadb,
# bound to 127.0.0.1 on its own port and socket. `db.sh start [DBNAME]` is safe to repeat:
# a running instance is reused. `db.sh stop` shuts it down cleanly.
set -euo pipefail
ROOT="$(cd "$(dirname "${BASH_SOURCE[0]}")/.." && pwd)"
source "$ROOT/scripts/env.sh"
D="$ROOT/.data/mariadb"
SOCK="$D/mysqld.sock"
admin() { mariadb-admin --no-defaults --socket="$SOCK" -uroot "$@"; }
sql() { mariadb --no-defaults --socket="$SOCK" -uroot -e "$1"; }

install_if_missing() {
  if ! command -v mariadbd >/dev/null 2>&1 && [ ! -x /usr/sbin/mariadbd ]; then
    echo "Installing MariaDB from Debian's packages…"
    apt-get update -q >/dev/null
    DEBIAN_FRONTEND=noninteractive apt-get install -y -q --no-install-recommends mariadb-server >/dev/null
  fi
}

start() {
  install_if_missing
  export PATH="$PATH:/usr/sbin"
  mkdir -p "$D"
  if [ -S "$SOCK" ] && admin ping >/dev/null 2>&1; then
    echo "MariaDB already running on 127.0.0.1:$DB_PORT."
  else
    if [ ! -d "$D/data/mysql" ]; then
      mariadb-install-db --no-defaults --datadir="$D/data" --user=root \
        --auth-root-authentication-method=normal --skip-test-db >"$D/install.log" 2>&1
    fi
    rm -f "$SOCK" "$D/mysqld.pid"
    nohup mariadbd --no-defaults --datadir="$D/data" --socket="$SOCK" --pid-file="$D/mysqld.pid" \
      --port="$DB_PORT" --bind-address=127.0.0.1 --user=root --skip-name-resolve \
      --character-set-server=utf8mb4 --collation-server=utf8mb4_unicode_ci \
      --log-error="$D/error.log" >/dev/null 2>&1 &
    for _ in $(seq 1 200); do
      admin ping >/dev/null 2>&1 && break
      sleep 0.1
    done
    admin ping >/dev/null 2>&1 || { echo "MariaDB did not start; see $D/error.log"; exit 1; }
    echo "MariaDB started on 127.0.0.1:$DB_PORT."
  fi
  for name in "$@"; do ensure_database "$name"; done
}

ensure_database() {
  local name="$1"
  sql "CREATE DATABASE IF NOT EXISTS \`$name\` CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci;
       CREATE USER IF NOT EXISTS '$DB_USER'@'127.0.0.1' IDENTIFIED BY '$DB_PASSWORD';
       ALTER USER '$DB_USER'@'127.0.0.1' IDENTIFIED BY '$DB_PASSWORD';
       GRANT ALL PRIVILEGES ON \`$name\`.* TO '$DB_USER'@'127.0.0.1';
       FLUSH PRIVILEGES;"
}

stop() {
  export PATH="$PATH:/usr/sbin"
  if [ -S "$SOCK" ] && admin ping >/dev/null 2>&1; then
    admin shutdown && echo "MariaDB stopped."
  else
    echo "MariaDB is not running."
  fi
}

case "${1:-start}" in
  start) shift || true; start "$@" ;;
  stop) stop ;;
  *) echo "usage: db.sh start [DBNAME…] | stop"; exit 2 ;;
esac
