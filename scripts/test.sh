#!/usr/bin/env bash
# npm test: the whole gate on a fresh test database — format → types → lint → build → every suite incl. browser tests.
set -euo pipefail
source "$(dirname "$0")/lib.sh"
cd "$REPO"
ensure_deps
ensure_chromium
say "starting PostgreSQL…"
SIGMATAIL_PG_FAST=1 bash scripts/pg.sh start >/dev/null
TEST_DATABASE_URL=$(bash scripts/pg.sh reset-db "${SIGMATAIL_TEST_DB:-sigmatail_test}")
export TEST_DATABASE_URL
say "format check";  node_modules/.bin/prettier --check . --log-level=warn
say "typecheck";     node_modules/.bin/tsc -b
say "lint";          node_modules/.bin/eslint . --max-warnings=0
say "build web";     node_modules/.bin/turbo run build --filter=@sigmatail/web --output-logs=errors-only
say "tests";         node_modules/.bin/turbo run test --concurrency=1 --continue --output-logs=full
say "all checks passed"
