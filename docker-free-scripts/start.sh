#!/usr/bin/env bash
# npm start: install what is missing, start MariaDB, migrate, load the demo on first start, serve.
source "$(dirname "$0")/lib.sh"
ensure_node_modules
db_start
app_env
build_frontend
cd "$ROOT"
exec npx tsx backend/src/cli/start.ts
