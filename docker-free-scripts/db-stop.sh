#!/usr/bin/env bash
# npm run db:stop: stop the private MariaDB cleanly.
source "$(dirname "$0")/lib.sh"
db_stop
