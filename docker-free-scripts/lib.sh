#!/usr/bin/env bash
# Shared set-up steps for `npm start`, `npm test`, `npm run bench` and the db scripts.
# Everything the project needs on a fresh Debian machine with Node.js 20 is installed here.
set -euo pipefail

ROOT="$(cd "$(dirname "${BASH_SOURCE[0]}")/.." && pwd)"
DATA="$ROOT/.data"
DB_DIR="$DATA/mariadb"
export DB_HOST="${DB_HOST:-127.0.0.1}"
export DB_PORT="${DB_PORT:-3407}"
export DB_NAME="${DB_NAME:-veracast}"
export DB_USER="${DB_USER:-veracast}"

log() { printf '[veracast] %s\n' "$*" >&2; }

as_root() {
  if [ "$(id -u)" -eq 0 ]; then "$@"; elif command -v sudo >/dev/null; then sudo "$@"; else
    log "need root to run: $*"; return 1; fi
}

APT_UPDATED=0
# ensure_debian_packages CMD PACKAGE...: install the packages when CMD is not on PATH.
ensure_debian_packages() {
  local cmd="$1"; shift
  if command -v "$cmd" >/dev/null 2>&1 || [ -x "/usr/sbin/$cmd" ] || [ -x "/usr/bin/$cmd" ]; then return 0; fi
  log "installing $* from Debian's packages"
  if [ "$APT_UPDATED" -eq 0 ]; then as_root apt-get -o DPkg::Lock::Timeout=600 update -qq; APT_UPDATED=1; fi
  DEBIAN_FRONTEND=noninteractive as_root apt-get -o DPkg::Lock::Timeout=600 install -y -qq --no-install-recommends "$@" >/dev/null
}

ensure_mariadb() { ensure_debian_packages mariadbd mariadb-server mariadb-client; }
ensure_chromium() { ensure_debian_packages chromium chromium; }

# npm ci when node_modules is missing or older than the lock file.
ensure_node_modules() {
  local stamp="$ROOT/node_modules/.veracast-lock.sha256"
  local want; want="$(sha256sum "$ROOT/package-lock.json" | cut -d' ' -f1)"
  if [ -f "$stamp" ] && [ "$(cat "$stamp")" = "$want" ]; then return 0; fi
  log "installing npm dependencies (npm ci)"
  (cd "$ROOT" && npm ci --no-audit --no-fund --loglevel=error)
  echo "$want" > "$stamp"
}

# A secret kept under .data/ so it survives restarts; an environment value wins.
secret_file() {
  local file="$DATA/$1"
  mkdir -p "$DATA"; chmod 700 "$DATA"
  if [ ! -s "$file" ]; then (umask 077; node -e "process.stdout.write(require('crypto').randomBytes(32).toString('base64url'))" > "$file"); fi
  cat "$file"
}

mysql_root() { mariadb --no-defaults --socket="$DB_DIR/mysqld.sock" -uroot "$@"; }

db_running() {
  [ -S "$DB_DIR/mysqld.sock" ] && mariadb-admin --no-defaults --socket="$DB_DIR/mysqld.sock" -uroot ping >/dev/null 2>&1
}

# Start the private MariaDB (idempotent), create the database and the application user.
db_start() {
  ensure_mariadb
  export DB_PASSWORD="${DB_PASSWORD:-$(secret_file db-password)}"
  mkdir -p "$DB_DIR"
  if [ ! -d "$DB_DIR/data/mysql" ]; then
    log "initialising MariaDB data directory in .data/mariadb"
    mariadb-install-db --no-defaults --datadir="$DB_DIR/data" --user=root \
      --auth-root-authentication-method=normal --skip-test-db >"$DB_DIR/install.log" 2>&1
  fi
  if ! db_running; then
    log "starting MariaDB on $DB_HOST:$DB_PORT"
    nohup mariadbd --no-defaults --user=root --datadir="$DB_DIR/data" --socket="$DB_DIR/mysqld.sock" \
      --pid-file="$DB_DIR/mysqld.pid" --port="$DB_PORT" --bind-address="$DB_HOST" --skip-name-resolve \
      --log-error="$DB_DIR/error.log" --local-infile=1 --character-set-server=utf8mb4 \
      --collation-server=utf8mb4_unicode_ci --max-allowed-packet=256M --innodb-buffer-pool-size=512M \
      --innodb-flush-log-at-trx-commit=2 >/dev/null 2>&1 &
    local i=0
    until db_running; do
      i=$((i + 1)); if [ "$i" -gt 300 ]; then log "MariaDB did not start; see .data/mariadb/error.log"; tail -20 "$DB_DIR/error.log" >&2; return 1; fi
      sleep 0.1
    done
  fi
  mysql_root <<SQL
CREATE DATABASE IF NOT EXISTS \`$DB_NAME\` CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci;
CREATE USER IF NOT EXISTS '$DB_USER'@'127.0.0.1' IDENTIFIED BY '$DB_PASSWORD';
ALTER USER '$DB_USER'@'127.0.0.1' IDENTIFIED BY '$DB_PASSWORD';
GRANT ALL PRIVILEGES ON \`$DB_NAME\`.* TO '$DB_USER'@'127.0.0.1';
GRANT ALL PRIVILEGES ON \`${DB_NAME}\_test%\`.* TO '$DB_USER'@'127.0.0.1';
GRANT ALL PRIVILEGES ON \`${DB_NAME}\_bench%\`.* TO '$DB_USER'@'127.0.0.1';
GRANT FILE ON *.* TO '$DB_USER'@'127.0.0.1';
FLUSH PRIVILEGES;
SQL
}

db_stop() {
  if db_running; then
    log "stopping MariaDB"
    mariadb-admin --no-defaults --socket="$DB_DIR/mysqld.sock" -uroot shutdown
  else
    log "MariaDB is not running"
  fi
}

app_env() {
  export JWT_SECRET="${JWT_SECRET:-$(secret_file jwt-secret)}"
  export PORT="${PORT:-8080}"
}

# Builds the web client unless frontend/dist is newer than every source it is built from.
build_frontend() {
  local stamp="$ROOT/frontend/dist/index.html"
  if [ -f "$stamp" ] && [ -z "$(find "$ROOT/frontend/src" "$ROOT/frontend/index.html" "$ROOT/frontend/vite.config.ts" \
      "$ROOT/frontend/package.json" "$ROOT/shared-types/src" "$ROOT/package-lock.json" -newer "$stamp" -print -quit 2>/dev/null)" ]; then
    log "web client is up to date"
    return 0
  fi
  log "building the web client"
  (cd "$ROOT" && npm run build --silent -w frontend >/dev/null)
}
