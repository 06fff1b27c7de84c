#!/usr/bin/env bash
# npm run dev: API with reload on 127.0.0.1:$PORT and the Vite dev server proxying to it.
source "$(dirname "$0")/lib.sh"
ensure_node_modules
db_start
app_env
cd "$ROOT"
npx tsx watch backend/src/cli/start.ts &
API=$!
trap 'kill $API 2>/dev/null' EXIT
npm run dev -w frontend
