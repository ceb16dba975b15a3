#!/usr/bin/env bash
# `npm test`: the whole suite on a fresh machine. Brings up its own MariaDB (port 3309, data in
# .data/mariadb-test, database phaseloom_test created fresh per run), installs Debian's chromium when
# missing, then runs: type check, lint, unit tests, API tests, client build, browser tests.
# Stops what it started. Ends with one line "N passed, N failed".
source "$(dirname "${BASH_SOURCE[0]}")/lib.sh"
cd "$ROOT"

export NODE_ENV=test
export PHASELOOM_DB_PORT="${PHASELOOM_TEST_DB_PORT:-3309}"
export PHASELOOM_DB_DATADIR=".data/mariadb-test"
export PHASELOOM_DB_NAME="phaseloom_test"
export PHASELOOM_STORAGE_DIR=".data/storage-test"
export PHASELOOM_SMTP_PORT="${PHASELOOM_TEST_SMTP_PORT:-2526}"
export PHASELOOM_OUTBOX_DIR=".data/outbox-test"
export LOG_LEVEL="${LOG_LEVEL:-silent}"

ensure_node_modules
ensure_debian_command chromium chromium

db_was_running=0
if bash scripts/db.sh status | grep -q '^running'; then db_was_running=1; fi
catcher_pid=""
cleanup() {
  trap - INT TERM EXIT
  if [ -n "$catcher_pid" ] && kill -0 "$catcher_pid" 2>/dev/null; then kill -TERM "$catcher_pid" 2>/dev/null || true; fi
  if [ "$db_was_running" = "0" ]; then bash scripts/db.sh stop || true; fi
}
trap cleanup INT TERM EXIT
bash scripts/db.sh up
bash scripts/db.sh reset-database
rm -rf "$PHASELOOM_STORAGE_DIR" "$PHASELOOM_OUTBOX_DIR"
# the local SMTP catcher (tests that read mail also start their own on a free port)
if ! port_in_use "$PHASELOOM_SMTP_PORT"; then
  tsx scripts/mail-catcher.ts &
  catcher_pid=$!
fi

results_dir="$ROOT/.data/test-results"
rm -rf "$results_dir"; mkdir -p "$results_dir"
failed_steps=()

step() {
  local name="$1"; shift
  printf '\n== %s\n' "$name" >&2
  if ! "$@"; then failed_steps+=("$name"); fi
}

step "type check (tsc)" tsc --noEmit -p tsconfig.json
step "lint (eslint)" eslint --config scripts/eslint.config.js --max-warnings=0 .
step "unit tests" vitest run --project unit --reporter=default --reporter=json --outputFile="$results_dir/unit.json"
step "API tests" vitest run --project api --reporter=default --reporter=json --outputFile="$results_dir/api.json"
step "client build" vite build --logLevel warn
step "migrate for browser tests" tsx scripts/migrate.ts
step "browser tests" vitest run --project e2e --reporter=default --reporter=json --outputFile="$results_dir/e2e.json"

node scripts/test-summary.mjs "$results_dir" "${#failed_steps[@]}" "${failed_steps[@]:-}"
[ "${#failed_steps[@]}" = "0" ]
