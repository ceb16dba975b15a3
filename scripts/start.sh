#!/usr/bin/env bash
# `npm start`: from a fresh clone to a running Phaseloom on http://127.0.0.1:8080.
# Installs what is missing (npm packages; Debian's mariadb-server), starts the project-local MariaDB,
# migrates, seeds the demo bench, builds the client and serves API + client from one Express process.
# Ctrl-C stops the server and the MariaDB this script started.
source "$(dirname "${BASH_SOURCE[0]}")/lib.sh"
cd "$ROOT"

node -e 'const [a,b]=process.versions.node.split(".").map(Number); process.exit(a>20||(a===20&&b>=19)?0:1)' \
  || die "Node.js 20.19 or newer is needed (found $(node -v))"

export NODE_ENV="${NODE_ENV:-development}"
export PORT="${PORT:-8080}"
export HOST="${HOST:-127.0.0.1}"
export PHASELOOM_DB_PORT="${PHASELOOM_DB_PORT:-3307}"

if port_in_use "$PORT"; then
  die "port $PORT on $HOST is already in use; stop what uses it or set PORT to a free port"
fi

ensure_node_modules

db_was_running=0
if bash scripts/db.sh status | grep -q '^running'; then db_was_running=1; fi
bash scripts/db.sh up

server_pid=""
catcher_pid=""
cleanup() {
  trap - INT TERM EXIT
  if [ -n "$catcher_pid" ] && kill -0 "$catcher_pid" 2>/dev/null; then kill -TERM "$catcher_pid" 2>/dev/null || true; fi
  if [ -n "$server_pid" ] && kill -0 "$server_pid" 2>/dev/null; then
    kill -TERM "$server_pid" 2>/dev/null || true
    wait "$server_pid" 2>/dev/null || true
  fi
  if [ "$db_was_running" = "0" ]; then bash scripts/db.sh stop || true; fi
}
trap cleanup INT TERM EXIT

tsx scripts/migrate.ts
if [ "$NODE_ENV" != "production" ]; then tsx scripts/seed-demo.ts; fi

say "building the client…"
vite build --logLevel error >/dev/null || die "the client build failed; run 'npx vite build' to see why"

# development: a local SMTP catcher keeps every e-mail for the /outbox page (production sends through PHASELOOM_SMTP_*)
if [ "$NODE_ENV" != "production" ]; then
  if port_in_use "${PHASELOOM_SMTP_PORT:-2525}"; then
    say "port ${PHASELOOM_SMTP_PORT:-2525} is in use; using the mail catcher already there"
  else
    tsx scripts/mail-catcher.ts &
    catcher_pid=$!
  fi
fi

node --import tsx server/index.ts &
server_pid=$!

for _ in $(seq 1 120); do
  if port_in_use "$PORT"; then break; fi
  kill -0 "$server_pid" 2>/dev/null || exit 1
  sleep 0.25
done
port_in_use "$PORT" || die "the server did not start listening on $HOST:$PORT"

cat <<MSG

  Phaseloom is running at http://$HOST:$PORT

  Demo sign-ins (password for all three: larchmere-demo-2026)
    owner     mira.kestner@example.org
    analyst   tomas.aalto@example.org
    viewer    ines.vale@example.org

  E-mail (invitations, password resets) is caught locally: http://$HOST:$PORT/outbox

  Ctrl-C stops the server and the database this command started.
  Laser safety: measurement setups involve laser radiation; follow your site's laser-safety rules
  and the classification of your sources (IEC 60825-1).

MSG
wait "$server_pid"
