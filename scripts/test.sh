#!/usr/bin/env bash
# npm test: the same set-up as npm start against a fresh test database, then every check:
# format, lint, types, unit tests, integration tests (real MariaDB, real app server) and
# end-to-end tests in Debian's Chromium.
set -euo pipefail
ROOT="$(cd "$(dirname "${BASH_SOURCE[0]}")/.." && pwd)"
cd "$ROOT"
bash scripts/install.sh --browser
source scripts/env.sh

# OUTTURN_TEST_SLOT=N gives a second copy of the suite its own database, ports and build
# folder, so that two developers' runs on one machine do not collide. CI uses slot 0.
slot="${OUTTURN_TEST_SLOT:-0}"
if [ "$slot" = 0 ]; then
  export DB_NAME=outturn_test NEXT_DIST_DIR=.next
else
  export DB_NAME="outturn_test_$slot" NEXT_DIST_DIR=".next-test-$slot"
fi
export PORT=$((3100 + slot * 10)) MAIL_UI_PORT=$((2581 + slot * 10)) SMTP_PORT=$((2526 + slot * 10))
export STRIPE_FAKE_PORT=$((12112 + slot * 10))
export APP_URL="http://localhost:$PORT" NEXTAUTH_URL="http://localhost:$PORT"
export RUN="$ROOT/.data/run-test-$slot"
# A private Redis for the tests of queue mode (workers, two web instances); the test app server
# itself runs embedded, as `npm start` does.
redis_port=$((6400 + slot))
export REDIS_TEST_URL="redis://127.0.0.1:$redis_port"
# The tests stand where a reverse proxy would: the app believes the X-Forwarded-For they send.
export TRUSTED_PROXIES="127.0.0.1,::1"
mkdir -p "$RUN"

echo "== Static checks"
node_modules/.bin/prettier --check . --log-level warn
node_modules/.bin/eslint . --max-warnings 0
node_modules/.bin/tsc --noEmit

echo "== Unit tests"
node_modules/.bin/vitest run --project unit

echo "== Test database and services"
# Set before anything starts, so that a failed step still stops the fakes and the tests' Redis.
server_pid=""
cleanup() {
  [ -n "$server_pid" ] && kill "$server_pid" 2>/dev/null || true
  bash scripts/services.sh stop || true
  bash scripts/redis.sh stop "$redis_port" >/dev/null || true
}
trap cleanup EXIT
bash scripts/db.sh start
mariadb --no-defaults --socket="$ROOT/.data/mariadb/mysqld.sock" -uroot -e "DROP DATABASE IF EXISTS \`$DB_NAME\`"
bash scripts/db.sh start "$DB_NAME" >/dev/null
bash scripts/services.sh start
bash scripts/redis.sh start "$redis_port"
bash scripts/migrate.sh
bash scripts/build.sh

node_modules/.bin/next start -p "$PORT" >"$RUN/test-server.log" 2>&1 &
server_pid=$!
for _ in $(seq 1 300); do
  curl -fsS -o /dev/null "$APP_URL/sign-in" 2>/dev/null && break
  sleep 0.2
done
curl -fsS -o /dev/null "$APP_URL/sign-in" || { echo "The app did not start; see $RUN/test-server.log"; exit 1; }

echo "== Integration tests"
node_modules/.bin/vitest run --project integration

echo "== End-to-end tests"
node_modules/.bin/playwright test
