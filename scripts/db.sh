#!/usr/bin/env bash
# Project-local MariaDB: `db.sh up` installs (Debian's mariadb-server, if mariadbd is missing),
# initialises $PHASELOOM_DB_DATADIR, starts mariadbd on 127.0.0.1:$PHASELOOM_DB_PORT with its own socket
# and pid file, waits until it answers, and creates the database and the application user.
# `db.sh stop` stops the server started from this data folder. `db.sh reset-database` drops and
# recreates the database (used by the test script).
# Variables: PHASELOOM_DB_PORT (3307), PHASELOOM_DB_NAME (phaseloom), PHASELOOM_DB_USER (phaseloom),
#            PHASELOOM_DB_DATADIR (.data/mariadb). The application user's password is generated on
#            first use into $PHASELOOM_DB_DATADIR.secret unless PHASELOOM_DB_PASSWORD is set.
source "$(dirname "${BASH_SOURCE[0]}")/lib.sh"

DB_PORT="${PHASELOOM_DB_PORT:-3307}"
DB_NAME="${PHASELOOM_DB_NAME:-phaseloom}"
DB_USER="${PHASELOOM_DB_USER:-phaseloom}"
DATADIR="${PHASELOOM_DB_DATADIR:-$ROOT/.data/mariadb}"
case "$DATADIR" in /*) ;; *) DATADIR="$ROOT/$DATADIR" ;; esac
RUNDIR="$DATADIR.run"
SOCKET="$RUNDIR/mariadb.sock"
PIDFILE="$RUNDIR/mariadb.pid"
LOGFILE="$RUNDIR/mariadb.err"
SECRET_FILE="$DATADIR.secret"

[[ "$DB_NAME" =~ ^[A-Za-z0-9_]+$ ]] || die "PHASELOOM_DB_NAME must be letters, digits and _ (got '$DB_NAME')"
[[ "$DB_USER" =~ ^[A-Za-z0-9_]+$ ]] || die "PHASELOOM_DB_USER must be letters, digits and _ (got '$DB_USER')"
[[ "$DB_PORT" =~ ^[0-9]+$ ]] || die "PHASELOOM_DB_PORT must be a port number (got '$DB_PORT')"

sql() { mariadb --no-defaults --socket="$SOCKET" -u "$(id -un)" --batch --skip-column-names -e "$1"; }

running() { [ -f "$PIDFILE" ] && kill -0 "$(cat "$PIDFILE")" 2>/dev/null; }

db_password() {
  if [ -n "${PHASELOOM_DB_PASSWORD:-}" ]; then printf '%s' "$PHASELOOM_DB_PASSWORD"; return; fi
  if [ ! -s "$SECRET_FILE" ]; then
    mkdir -p "$(dirname "$SECRET_FILE")"
    (umask 077; node -e 'process.stdout.write(require("crypto").randomBytes(24).toString("base64url"))' > "$SECRET_FILE")
  fi
  cat "$SECRET_FILE"
}

up() {
  ensure_debian_command mariadbd mariadb-server mariadb-client
  mkdir -p "$RUNDIR"
  if running; then
    say "MariaDB already running on 127.0.0.1:$DB_PORT (data in ${DATADIR#$ROOT/})"
  else
    if port_in_use "$DB_PORT"; then
      die "port $DB_PORT on 127.0.0.1 is already in use; stop what uses it or set PHASELOOM_DB_PORT to a free port"
    fi
    if [ ! -d "$DATADIR/mysql" ]; then
      say "initialising the MariaDB data folder ${DATADIR#$ROOT/}…"
      mkdir -p "$DATADIR"
      mariadb-install-db --no-defaults --datadir="$DATADIR" --user="$(id -un)" \
        --auth-root-authentication-method=socket --skip-test-db >"$RUNDIR/install.log" 2>&1 \
        || { cat "$RUNDIR/install.log" >&2; die "mariadb-install-db failed (log above)"; }
    fi
    rm -f "$SOCKET"
    mariadbd --no-defaults --datadir="$DATADIR" --socket="$SOCKET" --pid-file="$PIDFILE" \
      --port="$DB_PORT" --bind-address=127.0.0.1 --user="$(id -un)" --skip-name-resolve \
      --log-error="$LOGFILE" --innodb-buffer-pool-size=128M --max-connections=300 \
      --character-set-server=utf8mb4 --collation-server=utf8mb4_unicode_ci >/dev/null 2>&1 &
    for _ in $(seq 1 120); do
      if mariadb-admin --no-defaults --socket="$SOCKET" -u "$(id -un)" ping >/dev/null 2>&1; then break; fi
      if ! running && [ -f "$PIDFILE" ]; then break; fi
      sleep 0.25
    done
    mariadb-admin --no-defaults --socket="$SOCKET" -u "$(id -un)" ping >/dev/null 2>&1 \
      || { tail -n 20 "$LOGFILE" >&2 || true; die "MariaDB did not start (log: ${LOGFILE#$ROOT/})"; }
    say "MariaDB started on 127.0.0.1:$DB_PORT (data in ${DATADIR#$ROOT/})"
  fi
  local pw; pw="$(db_password)"
  sql "CREATE DATABASE IF NOT EXISTS \`$DB_NAME\` CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci;
       CREATE USER IF NOT EXISTS '$DB_USER'@'127.0.0.1' IDENTIFIED BY '$pw';
       ALTER USER '$DB_USER'@'127.0.0.1' IDENTIFIED BY '$pw';
       GRANT ALL PRIVILEGES ON *.* TO '$DB_USER'@'127.0.0.1';
       FLUSH PRIVILEGES;"
}

reset_database() {
  running || die "MariaDB is not running for ${DATADIR#$ROOT/}; run scripts/db.sh up first"
  sql "DROP DATABASE IF EXISTS \`$DB_NAME\`; CREATE DATABASE \`$DB_NAME\` CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci;"
}

stop() {
  if running; then
    local pid; pid="$(cat "$PIDFILE")"
    mariadb-admin --no-defaults --socket="$SOCKET" -u "$(id -un)" shutdown >/dev/null 2>&1 || kill "$pid" 2>/dev/null || true
    for _ in $(seq 1 80); do kill -0 "$pid" 2>/dev/null || break; sleep 0.25; done
    kill -0 "$pid" 2>/dev/null && kill -9 "$pid" 2>/dev/null || true
    say "MariaDB stopped (data in ${DATADIR#$ROOT/} kept)"
  else
    say "no MariaDB running for ${DATADIR#$ROOT/}"
  fi
}

case "${1:-}" in
  up) up ;;
  stop) stop ;;
  reset-database) reset_database ;;
  status) if running; then echo "running (pid $(cat "$PIDFILE"), port $DB_PORT)"; else echo "stopped"; fi ;;
  *) die "usage: scripts/db.sh up|stop|status|reset-database" ;;
esac
