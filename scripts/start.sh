#!/usr/bin/env bash
# npm start: installs what is missing, starts MariaDB and the local fakes, migrates, seeds
# the demo organisation, builds when needed and serves the app.
set -euo pipefail
ROOT="$(cd "$(dirname "${BASH_SOURCE[0]}")/.." && pwd)"
cd "$ROOT"
bash scripts/install.sh
source scripts/env.sh
bash scripts/db.sh start "$DB_NAME"
bash scripts/services.sh start
bash scripts/migrate.sh
bash scripts/build.sh
node scripts/demo-accounts.cjs
echo -e "\nOutturn is starting on $APP_URL  (Ctrl+C to stop; npm run db:down stops MariaDB)\n"
exec node_modules/.bin/next start -p "$PORT"
