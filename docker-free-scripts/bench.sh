#!/usr/bin/env bash
# npm run bench: speed and memory benchmarks against the real MariaDB.
source "$(dirname "$0")/lib.sh"
ensure_node_modules
db_start
app_env
cd "$ROOT"
mkdir -p bench-output
for b in tests/bench/*.bench.ts; do
  [ -e "$b" ] || continue
  log "bench: $b"
  node --expose-gc --import tsx "$b"
done
