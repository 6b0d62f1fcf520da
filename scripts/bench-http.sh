#!/usr/bin/env bash
# The HTTP load benchmark (part of npm run bench): its own MariaDB and database, the built server (.output, built
# only when missing or with VEERLINE_BENCH_BUILD=1), the demo grown to 203 airfields and 1,000 users, autocannon.
# Ports from the environment, defaults outside every developer's range: VEERLINE_BENCH_DB_PORT (3309),
# VEERLINE_BENCH_PORT (3102), VEERLINE_BENCH_BARE_PORT (3103). Prints the table; see bench/http/run.ts.
source "$(dirname "$0")/lib/common.sh"
source "$ROOT/scripts/lib/mariadb.sh"
source "$ROOT/scripts/lib/app.sh"

export VEERLINE_DATA_DIR=$ROOT/.data/bench
export VEERLINE_DB_DIR=$VEERLINE_DATA_DIR/mariadb
export VEERLINE_DB_PORT=${VEERLINE_BENCH_DB_PORT:-3309}
export VEERLINE_HOST=127.0.0.1
BENCH_PORT=${VEERLINE_BENCH_PORT:-3102}
BARE_PORT=${VEERLINE_BENCH_BARE_PORT:-3103}
# No mail or push stand-ins run here: the outbox worker polls as in production, its few sends fail and back off.
export VEERLINE_SMTP_PORT=${VEERLINE_BENCH_SMTP_PORT:-2599}
export VEERLINE_PUSH_PORT=${VEERLINE_BENCH_PUSH_PORT:-8599}
mkdir -p "$VEERLINE_DATA_DIR"
unset NODE_ENV

ensure_node_modules
app_session_password

APP_PID=""
BARE_PID=""
cleanup() {
  trap - INT TERM EXIT
  stop_pid "$APP_PID"
  stop_pid "$BARE_PID"
  mariadb_stop
}
trap cleanup INT TERM EXIT

mariadb_start
app_database veerline_bench fresh
app_migrate_and_seed
if [ "${VEERLINE_BENCH_BUILD:-}" = 1 ] || [ ! -f .output/server/index.mjs ]; then
  VEERLINE_SKIP_BUILD='' app_build
fi
log "bench: using the build of $(date -u -r .output/server/index.mjs '+%Y-%m-%d %H:%M:%SZ')"
if [ ! -f "$VEERLINE_DATA_DIR/bare/.output/server/index.mjs" ]; then
  log "building the bare Nuxt page (bench/http/bare-nuxt), once"
  node_modules/.bin/nuxt build bench/http/bare-nuxt >"$VEERLINE_DATA_DIR/bare-build.log" 2>&1 || die "bare build failed: see $VEERLINE_DATA_DIR/bare-build.log"
fi
HOST=127.0.0.1 PORT=$BARE_PORT NITRO_HOST=127.0.0.1 NITRO_PORT=$BARE_PORT \
  node "$VEERLINE_DATA_DIR/bare/.output/server/index.mjs" >"$VEERLINE_DATA_DIR/bare.log" 2>&1 &
BARE_PID=$!
# VEERLINE_BENCH_NODE_ARGS (e.g. "--cpu-prof --cpu-prof-dir=/tmp/prof") go to the app server's node only.
VEERLINE_NODE_ARGS="${VEERLINE_BENCH_NODE_ARGS:-}" app_serve "$BENCH_PORT" "$VEERLINE_DATA_DIR/server.log"

VEERLINE_BENCH_URL="http://127.0.0.1:$BENCH_PORT" VEERLINE_BENCH_BARE_URL="http://127.0.0.1:$BARE_PORT" \
  node_modules/.bin/tsx bench/http/run.ts
