#!/usr/bin/env bash
# Installs what is missing: node modules (npm ci when absent or older than the lock file),
# and, with --browser, Debian's Chromium for the end-to-end tests.
set -euo pipefail
ROOT="$(cd "$(dirname "${BASH_SOURCE[0]}")/.." && pwd)"
cd "$ROOT"
if [ ! -f node_modules/.package-lock.json ] || [ package-lock.json -nt node_modules/.package-lock.json ]; then
  echo "Installing node modules (npm ci)…"
  npm ci --no-audit --no-fund --loglevel=error
fi
if [ "${1:-}" = "--browser" ] && [ ! -x /usr/bin/chromium ]; then
  echo "Installing Chromium from Debian's packages…"
  apt-get update -q >/dev/null
  DEBIAN_FRONTEND=noninteractive apt-get install -y -q --no-install-recommends chromium fonts-liberation >/dev/null
fi
