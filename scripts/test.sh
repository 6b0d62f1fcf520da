#!/usr/bin/env bash
# npm test: lint, type check, then unit, API and browser suites against a freshly emptied test database,
# the real built server and Debian's Chromium. Stops everything it started; non-zero on any failure.
source "$(dirname "$0")/lib/common.sh"
source "$ROOT/scripts/lib/mariadb.sh"
source "$ROOT/scripts/lib/app.sh"

export VEERLINE_DATA_DIR=${VEERLINE_TEST_DATA_DIR:-$ROOT/.data/test}
export VEERLINE_DB_DIR=$VEERLINE_DATA_DIR/mariadb
export VEERLINE_DB_PORT=${VEERLINE_TEST_DB_PORT:-3308}
export VEERLINE_HOST=127.0.0.1
export VEERLINE_PORT=${VEERLINE_TEST_PORT:-3100}
# A second app instance, started by the two-instance delivery test itself (tests/api/alerts.test.ts).
export VEERLINE_PORT_2=${VEERLINE_TEST_PORT_2:-3101}
export VEERLINE_SMTP_PORT=${VEERLINE_TEST_SMTP_PORT:-2526}
export VEERLINE_PUSH_PORT=${VEERLINE_TEST_PUSH_PORT:-8444}
export VEERLINE_TRUST_PROXY=1
# The default push-service allow-list plus a listed name that resolves to loopback, for the send-time address check.
export VEERLINE_PUSH_HOSTS=${VEERLINE_PUSH_HOSTS:-fcm.googleapis.com,android.googleapis.com,updates.push.services.mozilla.com,web.push.apple.com,*.push.apple.com,*.notify.windows.com,localhost}
export TEST_OUTPUT_DIR=${TEST_OUTPUT_DIR:-$ROOT/test-results}
mkdir -p "$VEERLINE_DATA_DIR" "$TEST_OUTPUT_DIR"
unset NODE_ENV

failed=()
step() { local name=$1; shift; log "── $name"; if ! "$@"; then failed+=("$name"); log "✗ $name failed"; fi; }

ensure_node_modules
ensure_chromium_installed
app_session_password

APP_PID=""
cleanup() {
  trap - INT TERM EXIT
  stop_pid "$APP_PID"
  standins_stop
  mariadb_stop
}
trap cleanup INT TERM EXIT

# VEERLINE_QUICK=1 skips lint and type check while iterating; CI and a plain `npm test` always run them.
if [ "${VEERLINE_QUICK:-}" != 1 ]; then
  step lint node_modules/.bin/eslint .
  step typecheck node_modules/.bin/nuxt typecheck
fi

mariadb_start
# A database of its own for the delivery fault tests (tests/api/outbox.test.ts): only the app instances that test
# starts work on it, so it can stop and kill them without the main test server's worker taking their rows.
app_database veerline_test_outbox fresh
app_migrate_and_seed
export VEERLINE_OUTBOX_TEST_DATABASE_URL=$DATABASE_URL
app_database veerline_test fresh
app_migrate_and_seed
app_build
standins_start
app_serve "$VEERLINE_PORT" "$VEERLINE_DATA_DIR/server.log"
export TEST_BASE_URL="http://$VEERLINE_HOST:$VEERLINE_PORT"

# Extra arguments go to vitest, e.g. `npm test -- tests/api/session.test.ts`.
step tests node_modules/.bin/vitest run "$@"

cleanup
if [ ${#failed[@]} -gt 0 ]; then
  log "FAILED: ${failed[*]}"
  exit 1
fi
log "all steps passed"
