#!/usr/bin/env bash
# npm run bench: speed and memory benchmarks against the real MariaDB.
# Prints PASS/MISS against each target and writes bench-output/*.json; fails only on a broken run.
# BENCH_POLLS (default 100000) sizes the archive; SKIP_NPM_CI=1 leaves node_modules as it is.
source "$(dirname "$0")/lib.sh"

[ "${SKIP_NPM_CI:-0}" = 1 ] || ensure_node_modules
db_start
app_env
cd "$ROOT"
mkdir -p bench-output
for b in tests/bench/*.bench.ts; do
  [ -e "$b" ] || continue
  log "bench: $b"
  node --expose-gc --import tsx "$b"
done
