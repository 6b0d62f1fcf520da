#!/usr/bin/env bash
# npm start: installs what is missing, starts MariaDB and the local stand-ins, migrates, seeds the demo once,
# builds and serves Veerline on http://127.0.0.1:3000. Ctrl-C or SIGTERM stops everything it started.
source "$(dirname "$0")/lib/common.sh"
source "$ROOT/scripts/lib/mariadb.sh"
source "$ROOT/scripts/lib/app.sh"

export VEERLINE_DATA_DIR=${VEERLINE_DATA_DIR:-$ROOT/.data}
export VEERLINE_DB_DIR=${VEERLINE_DB_DIR:-$VEERLINE_DATA_DIR/mariadb}
export VEERLINE_DB_PORT=${VEERLINE_DB_PORT:-3307}
export VEERLINE_DB_NAME=${VEERLINE_DB_NAME:-veerline}
export VEERLINE_HOST=${VEERLINE_HOST:-127.0.0.1}
export VEERLINE_PORT=${VEERLINE_PORT:-3000}
export VEERLINE_SMTP_PORT=${VEERLINE_SMTP_PORT:-2525}
export VEERLINE_PUSH_PORT=${VEERLINE_PUSH_PORT:-8443}
mkdir -p "$VEERLINE_DATA_DIR"

app_session_password
ensure_node_modules

APP_PID=""
cleanup() {
  trap - INT TERM EXIT
  log "stopping"
  stop_pid "$APP_PID"
  standins_stop
  mariadb_stop
  exit 0
}
trap cleanup INT TERM EXIT

mariadb_start
app_database "$VEERLINE_DB_NAME"
app_migrate_and_seed
app_build
standins_start
app_serve "$VEERLINE_PORT" "$VEERLINE_DATA_DIR/server.log"

log "Veerline is running at http://$VEERLINE_HOST:$VEERLINE_PORT (log: $VEERLINE_DATA_DIR/server.log)"
if [ "${NODE_ENV:-}" != production ]; then
  log "demo sign-ins (password for all: veerline-demo):"
  log "  admin@veerline.example       admin"
  log "  dispatch@veerline.example    dispatcher"
  log "  pilot@veerline.example       pilot"
  log "  safety@veerline.example      safety officer"
fi
log "press Ctrl-C to stop"
# npm passes SIGTERM to its shell, which may end without passing it on: stop as well when the parent goes.
PARENT_PID=$PPID
while kill -0 "$APP_PID" 2>/dev/null; do
  if ! kill -0 "$PARENT_PID" 2>/dev/null; then
    log "npm has stopped"
    cleanup
  fi
  sleep 1 &
  wait $! || true
done
log "the app server has stopped: see $VEERLINE_DATA_DIR/server.log"
