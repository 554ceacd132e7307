#!/usr/bin/env bash
# Brings the schema of $DB_NAME up to date, then adds the demo organisation once.
set -euo pipefail
ROOT="$(cd "$(dirname "${BASH_SOURCE[0]}")/.." && pwd)"
cd "$ROOT"
node_modules/.bin/sequelize-cli db:migrate >/dev/null
node_modules/.bin/sequelize-cli db:seed:all >/dev/null
echo "Database $DB_NAME migrated and seeded."
