#!/usr/bin/env bash
# npm test: install what is missing, start MariaDB, then lint, typecheck, build and run every test.
source "$(dirname "$0")/lib.sh"
ensure_chromium
ensure_node_modules
db_start
app_env
cd "$ROOT"
log "lint"; npx eslint . --max-warnings=0
log "typecheck"; npm run typecheck --silent
build_frontend
log "tests"
npx vitest run "$@"
