#!/usr/bin/env bash
# Start or stop the private MariaDB that start.sh / test.sh use: scripts/db.sh start|stop|status
# Reads VEERLINE_DB_DIR and VEERLINE_DB_PORT (test.sh exports them for the test suites).
source "$(dirname "$0")/lib/common.sh"
source "$ROOT/scripts/lib/mariadb.sh"
export VEERLINE_DB_DIR=${VEERLINE_DB_DIR:-$ROOT/.data/mariadb}
export VEERLINE_DB_PORT=${VEERLINE_DB_PORT:-3307}
case "${1:-status}" in
  start) mariadb_start ;;
  stop) mariadb_stop ;;
  status) mariadb_env; if mariadb_is_up; then echo up; else echo down; exit 1; fi ;;
  *) die "usage: scripts/db.sh start|stop|status" ;;
esac
