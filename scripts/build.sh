#!/usr/bin/env bash
# Builds the app for production when no build exists or the sources changed since the last one.
set -euo pipefail
ROOT="$(cd "$(dirname "${BASH_SOURCE[0]}")/.." && pwd)"
cd "$ROOT"
export NEXT_TELEMETRY_DISABLED=1
dist="${NEXT_DIST_DIR:-.next}"
stamp="$dist/.source-hash"
hash="$( (git ls-files -co --exclude-standard -- app components lib models types public proxy.ts instrumentation.ts scripts/build-worker.mjs \
  next.config.mjs tailwind.config.ts postcss.config.mjs tsconfig.json package-lock.json 2>/dev/null || true) \
  | sort | xargs -r sha1sum 2>/dev/null | sha1sum | cut -d' ' -f1)"
if [ -f "$dist/BUILD_ID" ] && [ -f "$stamp" ] && [ "$(cat "$stamp")" = "$hash" ]; then
  # The engine never builds its worker at run time: make sure it is there.
  [ -f .build/sim-worker.mjs ] || node scripts/build-worker.mjs
  echo "Production build is up to date."
  exit 0
fi
echo "Building the engine's worker and the app (next build)…"
node scripts/build-worker.mjs
# next build adds its build folder to tsconfig.json when that folder is not .next:
# keep the file as committed, even when the build fails.
backup="$(mktemp)"
cp tsconfig.json "$backup"
trap 'cp "$backup" tsconfig.json; rm -f "$backup"' EXIT
node_modules/.bin/next build
echo "$hash" > "$stamp"
