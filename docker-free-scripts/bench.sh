#!/usr/bin/env bash
# npm run bench: speed and memory benchmarks against the real MariaDB.
# Prints PASS/MISS against each target and writes bench-output/*.json; fails only on a broken run.
# BENCH_POLLS (default 100000) sizes the archive; SKIP_NPM_CI=1 leaves node_modules as it is.
source "$(dirname "$0")/lib.sh"

# Debian's pandas and PyMySQL for the pandas yardstick of the audit benchmark (tests/bench/pandas_audit.py).
ensure_python_modules() {
  if /usr/bin/python3 -c 'import pandas, pymysql' >/dev/null 2>&1; then return 0; fi
  log "installing python3-pandas python3-pymysql from Debian's packages"
  if [ "$APT_UPDATED" -eq 0 ]; then as_root apt-get -o DPkg::Lock::Timeout=600 update -qq; APT_UPDATED=1; fi
  DEBIAN_FRONTEND=noninteractive as_root apt-get -o DPkg::Lock::Timeout=600 install -y -qq --no-install-recommends \
    python3 python3-pandas python3-pymysql >/dev/null
}

[ "${SKIP_NPM_CI:-0}" = 1 ] || ensure_node_modules
ensure_python_modules
db_start
app_env
cd "$ROOT"
mkdir -p bench-output
for b in tests/bench/*.bench.ts; do
  [ -e "$b" ] || continue
  log "bench: $b"
  node --expose-gc --import tsx "$b"
done
