#!/usr/bin/env bash
# npm start: dependencies, PostgreSQL, migrations + demo seed, mail fake, one worker and the server on :3000.
set -euo pipefail
source "$(dirname "$0")/lib.sh"
cd "$REPO"
ensure_deps
say "starting PostgreSQL on 127.0.0.1:${SIGMATAIL_PGPORT:-55432}…"
DATABASE_URL=$(bash scripts/pg.sh start)
export DATABASE_URL
say "building the web app (cached when unchanged)…"
node_modules/.bin/turbo run build --filter=@sigmatail/web --output-logs=errors-only
exec "$REPO/node_modules/.bin/tsx" --conditions=@sigmatail/source scripts/supervise.ts
