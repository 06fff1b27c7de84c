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
mkdir -p "$DATA"
status=0
npx vitest run --reporter=default --reporter=json --outputFile="$DATA/vitest-report.json" "$@" || status=$?
# A plain closing line that any CI reader understands.
node -e '
  const r = JSON.parse(require("fs").readFileSync(process.argv[1], "utf8"));
  const skipped = (r.numPendingTests || 0) + (r.numTodoTests || 0);
  console.log(`Tests: ${r.numPassedTests} passed, ${r.numFailedTests} failed` + (skipped ? `, ${skipped} skipped` : ""));
' "$DATA/vitest-report.json" || true
exit "$status"
