#!/usr/bin/env bash
# The fan-out benchmark's life cycle (bench/fanout.ts): its own MariaDB, database, stand-ins and data folder, then the
# app instances bench/fanout.ts starts itself (on ports the system picks). Ports come from the environment, with
# defaults outside every developer's test range: VEERLINE_BENCH_DB_PORT (3491), VEERLINE_BENCH_SMTP_PORT (2691),
# VEERLINE_BENCH_PUSH_PORT (8591). VEERLINE_SKIP_BUILD=1 reuses .output. Stops everything it started.
source "$(dirname "$0")/lib/common.sh"
source "$ROOT/scripts/lib/mariadb.sh"
source "$ROOT/scripts/lib/app.sh"

export VEERLINE_DATA_DIR=${VEERLINE_BENCH_DATA_DIR:-$ROOT/.data/bench-fanout}
export VEERLINE_DB_DIR=$VEERLINE_DATA_DIR/mariadb
export VEERLINE_DB_PORT=${VEERLINE_BENCH_DB_PORT:-3491}
export VEERLINE_SMTP_PORT=${VEERLINE_BENCH_SMTP_PORT:-2691}
export VEERLINE_PUSH_PORT=${VEERLINE_BENCH_PUSH_PORT:-8591}
export VEERLINE_HOST=127.0.0.1
export VEERLINE_TRUST_PROXY=1
unset NODE_ENV
mkdir -p "$VEERLINE_DATA_DIR"
# A fresh mailbox for every run: the bench counts what arrived.
rm -rf "$VEERLINE_DATA_DIR/standins"

app_session_password
cleanup() {
  trap - INT TERM EXIT
  standins_stop
  mariadb_stop
}
trap cleanup INT TERM EXIT

mariadb_start
app_database veerline_bench fresh
app_migrate_and_seed
app_build
standins_start
node_modules/.bin/tsx bench/fanout.ts
