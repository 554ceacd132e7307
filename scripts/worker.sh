#!/usr/bin/env bash
# npm run worker: one queue worker process (queue mode). It needs REDIS_URL and the database
# settings of .env (or the environment); it builds its bundle, then replaces this shell, so a
# SIGTERM sent to it reaches the worker, which hands its runs back and exits 0.
set -euo pipefail
ROOT="$(cd "$(dirname "${BASH_SOURCE[0]}")/.." && pwd)"
cd "$ROOT"
source scripts/env.sh
mkdir -p .data
node scripts/build-worker.mjs >.data/worker-build.log 2>&1 || {
  echo "The worker's bundle did not build; see .data/worker-build.log"
  tail -20 .data/worker-build.log
  exit 1
}
exec node .build/outturn-worker.mjs
