#!/usr/bin/env bash
# Shared helpers for scripts/start.sh, scripts/test.sh and scripts/db.sh. Sourced, not run.
set -euo pipefail

ROOT="$(cd "$(dirname "${BASH_SOURCE[0]}")/.." && pwd)"
export PATH="$ROOT/node_modules/.bin:/usr/sbin:/usr/local/sbin:/sbin:$PATH"

say() { printf 'phaseloom: %s\n' "$*" >&2; }
die() { printf 'phaseloom: error: %s\n' "$*" >&2; exit 1; }

# Runs a command as root: directly when we are root, through sudo when it works without a prompt.
as_root() {
  if [ "$(id -u)" = "0" ]; then "$@"
  elif command -v sudo >/dev/null 2>&1 && sudo -n true 2>/dev/null; then sudo "$@"
  else return 99
  fi
}

# npm packages: install when node_modules is missing or older than package-lock.json.
ensure_node_modules() {
  if [ ! -d "$ROOT/node_modules" ] || [ "$ROOT/package-lock.json" -nt "$ROOT/node_modules/.package-lock.json" ]; then
    say "installing npm packages (npm ci)…"
    (cd "$ROOT" && npm ci --no-audit --no-fund --loglevel=error) || die "npm ci failed; see the messages above"
  fi
}

# Debian packages: install with apt-get when a command is missing.
# usage: ensure_debian_command COMMAND PACKAGE...
ensure_debian_command() {
  local cmd="$1"; shift
  if command -v "$cmd" >/dev/null 2>&1; then return 0; fi
  say "'$cmd' is missing; installing Debian's $* with apt-get…"
  if ! as_root true; then
    die "'$cmd' is missing and this user cannot use apt-get; run: sudo apt-get update && sudo apt-get install -y $*"
  fi
  as_root env DEBIAN_FRONTEND=noninteractive apt-get update -qq >/dev/null \
    || die "apt-get update failed; run: sudo apt-get update && sudo apt-get install -y $*"
  as_root env DEBIAN_FRONTEND=noninteractive apt-get install -y -qq --no-install-recommends "$@" >/dev/null \
    || die "apt-get install failed; run: sudo apt-get install -y $*"
  command -v "$cmd" >/dev/null 2>&1 || die "'$cmd' is still missing after installing $*"
}

# True when something listens on 127.0.0.1:PORT.
port_in_use() {
  node -e '
    const s = require("net").connect({ host: "127.0.0.1", port: Number(process.argv[1]) });
    s.on("connect", () => { s.destroy(); process.exit(0); });
    s.on("error", () => process.exit(1));
  ' "$1"
}
