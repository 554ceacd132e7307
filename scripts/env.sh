#!/usr/bin/env bash
# Makes .env from .env.example on first run, with generated secrets, then exports it.
# Sourced by the other scripts: `source scripts/env.sh`.
set -euo pipefail
ROOT="$(cd "$(dirname "${BASH_SOURCE[0]}")/.." && pwd)"
if [ ! -f "$ROOT/.env" ]; then
  while IFS= read -r line; do
    if [[ "$line" == *"__generate__"* ]]; then
      secret="$(node -e "process.stdout.write(require('crypto').randomBytes(24).toString('hex'))")"
      line="${line/__generate__/$secret}"
    fi
    printf '%s\n' "$line"
  done < "$ROOT/.env.example" > "$ROOT/.env"
  echo "Made .env with generated secrets."
fi
# Variables already set win over .env, as they do for Next.js and sequelize-cli.
while IFS= read -r line; do
  [[ "$line" =~ ^([A-Z_][A-Z0-9_]*)=(.*)$ ]] || continue
  name="${BASH_REMATCH[1]}"
  value="${BASH_REMATCH[2]}"
  value="${value%\"}"
  value="${value#\"}"
  [ -n "${!name+x}" ] || export "$name=$value"
done < "$ROOT/.env"
export NEXT_TELEMETRY_DISABLED=1
