#!/usr/bin/env bash
# npm run worker: one more worker process. Point DATABASE_URL at the shared database to run it on another machine.
set -euo pipefail
source "$(dirname "$0")/lib.sh"
cd "$REPO"
ensure_deps
if [ -z "${DATABASE_URL:-}" ]; then
  DATABASE_URL=$(bash scripts/pg.sh start)
  export DATABASE_URL
fi
exec "$REPO/node_modules/.bin/tsx" --conditions=@sigmatail/source packages/server/src/worker/main.ts
