#!/usr/bin/env bash
# npm run db:start: start the private MariaDB (idempotent).
source "$(dirname "$0")/lib.sh"
db_start
log "MariaDB answers on $DB_HOST:$DB_PORT (database $DB_NAME, user $DB_USER)"
