# A private MariaDB on loopback with its data inside the project. Source after common.sh.
# Needs: VEERLINE_DB_DIR (data folder), VEERLINE_DB_PORT.

mariadb_socket_dir() {
  local dir="$VEERLINE_DB_DIR/run"
  # Unix socket paths are limited to about 100 characters: fall back to a short temporary folder.
  if [ ${#dir} -gt 80 ]; then
    dir="/tmp/veerline-$(printf '%s' "$VEERLINE_DB_DIR" | md5sum | cut -c1-10)"
  fi
  printf '%s' "$dir"
}

mariadb_env() {
  MARIADB_RUN_DIR=$(mariadb_socket_dir)
  MARIADB_SOCKET="$MARIADB_RUN_DIR/mysqld.sock"
  MARIADB_PID_FILE="$MARIADB_RUN_DIR/mysqld.pid"
  export MARIADB_SOCKET MARIADB_PID_FILE
}

mariadb_root() { mariadb --no-defaults --socket="$MARIADB_SOCKET" -uroot "$@"; }

mariadb_is_up() { mariadb-admin --no-defaults --socket="$MARIADB_SOCKET" -uroot ping >/dev/null 2>&1; }

mariadb_start() {
  ensure_mariadb_installed
  mariadb_env
  mkdir -p "$VEERLINE_DB_DIR/db" "$MARIADB_RUN_DIR"
  if mariadb_is_up; then log "MariaDB already running on port $VEERLINE_DB_PORT"; return 0; fi
  if [ ! -d "$VEERLINE_DB_DIR/db/mysql" ]; then
    log "initialising MariaDB data in $VEERLINE_DB_DIR/db"
    mariadb-install-db --no-defaults --user=root --datadir="$VEERLINE_DB_DIR/db" \
      --auth-root-authentication-method=socket --skip-test-db >"$VEERLINE_DB_DIR/install.log" 2>&1 \
      || die "mariadb-install-db failed: see $VEERLINE_DB_DIR/install.log"
  fi
  log "starting MariaDB on 127.0.0.1:$VEERLINE_DB_PORT"
  mariadbd --no-defaults --user=root --datadir="$VEERLINE_DB_DIR/db" --socket="$MARIADB_SOCKET" \
    --pid-file="$MARIADB_PID_FILE" --port="$VEERLINE_DB_PORT" --bind-address=127.0.0.1 --skip-name-resolve \
    --log-error="$VEERLINE_DB_DIR/mysqld.err" --innodb-buffer-pool-size=64M \
    --character-set-server=utf8mb4 --collation-server=utf8mb4_unicode_ci </dev/null >/dev/null 2>&1 &
  local i
  for i in $(seq 1 150); do
    mariadb_is_up && return 0
    sleep 0.2
  done
  die "MariaDB did not start: see $VEERLINE_DB_DIR/mysqld.err"
}

mariadb_stop() {
  mariadb_env
  if mariadb_is_up; then
    log "stopping MariaDB"
    mariadb-admin --no-defaults --socket="$MARIADB_SOCKET" -uroot shutdown >/dev/null 2>&1 || true
    # Wait until it is really gone: a start right after a stop must not find a server that is still shutting down.
    local i
    for i in $(seq 1 150); do
      if [ ! -f "$MARIADB_PID_FILE" ] && ! mariadb_is_up; then return 0; fi
      sleep 0.2
    done
  fi
}

# Creates the database and the application user (idempotent). Args: database, user, password, [fresh]
mariadb_prepare() {
  local db=$1 user=$2 pass=$3 fresh=${4:-}
  if [ "$fresh" = fresh ]; then mariadb_root -e "DROP DATABASE IF EXISTS \`$db\`"; fi
  mariadb_root <<SQL
CREATE DATABASE IF NOT EXISTS \`$db\` CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci;
CREATE USER IF NOT EXISTS '$user'@'127.0.0.1' IDENTIFIED BY '$pass';
ALTER USER '$user'@'127.0.0.1' IDENTIFIED BY '$pass';
GRANT ALL PRIVILEGES ON \`$db\`.* TO '$user'@'127.0.0.1';
FLUSH PRIVILEGES;
SQL
}
