# Shared shell helpers for Tauline's scripts. Source it; do not run it.
# shellcheck shell=bash

TAULINE_ROOT=$(cd "$(dirname "${BASH_SOURCE[0]}")/.." && pwd)

log() { printf '[tauline] %s\n' "$*" >&2; }
die() { printf '[tauline] error: %s\n' "$*" >&2; exit 1; }

# Load .env (or .env.example when there is no .env) without overriding variables already set.
load_env() {
  local file="$TAULINE_ROOT/.env"
  [ -f "$file" ] || file="$TAULINE_ROOT/.env.example"
  [ -f "$file" ] || return 0
  local line key value
  while IFS= read -r line || [ -n "$line" ]; do
    case "$line" in ''|'#'*) continue ;; esac
    key=${line%%=*}
    value=${line#*=}
    [ -n "${!key+x}" ] || export "$key=$value"
  done < "$file"
}

# Where the PostgreSQL server binaries live (newest installed major version), or empty.
find_pg_bin() {
  local dir
  for dir in $(ls -d /usr/lib/postgresql/*/bin 2>/dev/null | sort -V -r); do
    [ -x "$dir/initdb" ] && { echo "$dir"; return 0; }
  done
  command -v initdb >/dev/null 2>&1 && dirname "$(command -v initdb)"
}

# Install Debian's PostgreSQL server when it is missing (root only), else explain what to run.
ensure_pg_installed() {
  [ -n "$(find_pg_bin)" ] && return 0
  if [ "$(id -u)" -eq 0 ] && command -v apt-get >/dev/null 2>&1; then
    log "PostgreSQL server binaries not found: installing Debian's postgresql package"
    apt-get update -qq >&2 && DEBIAN_FRONTEND=noninteractive apt-get install -y -qq postgresql >&2 \
      || die "apt-get install postgresql failed"
  else
    die "PostgreSQL server binaries not found; run: sudo apt-get install -y postgresql"
  fi
}

# Install Debian's Chromium when it is missing (root only), else explain what to run.
ensure_chromium_installed() {
  [ -x /usr/bin/chromium ] && return 0
  if [ "$(id -u)" -eq 0 ] && command -v apt-get >/dev/null 2>&1; then
    log "Chromium not found: installing Debian's chromium package (for browser tests)"
    apt-get update -qq >&2 && DEBIAN_FRONTEND=noninteractive apt-get install -y -qq chromium >&2 \
      || die "apt-get install chromium failed"
  else
    die "Chromium not found at /usr/bin/chromium; run: sudo apt-get install -y chromium"
  fi
}

# The unprivileged OS user that owns cluster files: 'postgres' when we are root, else ourselves.
pg_run_user() {
  if [ "$(id -u)" -eq 0 ]; then
    id -u postgres >/dev/null 2>&1 \
      || useradd --system --user-group --no-create-home --shell /usr/sbin/nologin postgres
    echo postgres
  else
    id -un
  fi
}

# Run a command as the cluster owner. `cd /` avoids "could not change directory" noise.
as_pg() {
  if [ "$(id -u)" -eq 0 ]; then (cd / && runuser -u postgres -- "$@"); else "$@"; fi
}

# As root, the postgres user must be able to traverse every folder above the data folder.
grant_traverse() {
  [ "$(id -u)" -eq 0 ] || return 0
  local dir=$1
  while [ "$dir" != "/" ]; do
    if ! runuser -u postgres -- test -x "$dir" 2>/dev/null; then
      chmod o+x "$dir" && log "granted traverse permission on $dir to the postgres user"
    fi
    dir=$(dirname "$dir")
  done
}

free_port() {
  node -e 'const s=require("net").createServer();s.listen(0,"127.0.0.1",()=>{console.log(s.address().port);s.close()})'
}
