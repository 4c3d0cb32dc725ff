#!/usr/bin/env bash
# Throwaway PostgreSQL cluster on loopback for tests; never touches the demo data in .pgdata/.
#   eval "$(scripts/pg-temp.sh start)"   # prints: export TAULINE_TEST_PG_DIR=... TAULINE_TEST_PG_URL=...
#   scripts/pg-temp.sh stop DIR          # stops the server and deletes the folder
set -euo pipefail
. "$(dirname "$0")/lib.sh"

start() {
  ensure_pg_installed
  local bin user tmp port ok=""
  bin=$(find_pg_bin); user=$(pg_run_user)
  tmp=$(mktemp -d /tmp/tauline-pgtest.XXXXXX)
  trap 'rm -rf "$tmp"' ERR
  mkdir -p "$tmp/data" "$tmp/log"
  chmod 755 "$tmp"
  chown "$user": "$tmp/data" "$tmp/log"
  chmod 700 "$tmp/data"
  as_pg "$bin/initdb" -D "$tmp/data" -U postgres --auth=trust -E UTF8 --locale=C.UTF-8 >"$tmp/initdb.log" 2>&1 \
    || { cat "$tmp/initdb.log" >&2; exit 1; }
  for _ in 1 2 3; do   # a port can be taken between free_port and bind: retry
    port=$(free_port)
    if as_pg "$bin/pg_ctl" -D "$tmp/data" -l "$tmp/log/server.log" -w -t 60 start -o \
        "-c listen_addresses=127.0.0.1 -p $port -c unix_socket_directories='' -c fsync=off -c synchronous_commit=off -c full_page_writes=off -c max_connections=200" >&2
    then ok=1; break; fi
    tail -n 5 "$tmp/log/server.log" >&2
  done
  [ -n "$ok" ] || { rm -rf "$tmp"; die "test PostgreSQL did not start"; }
  trap - ERR
  echo "export TAULINE_TEST_PG_DIR=$tmp"
  echo "export TAULINE_TEST_PG_URL=postgres://postgres@127.0.0.1:$port/postgres"
}

stop() {
  local tmp=${1:?pass the folder printed by start}
  [ -d "$tmp/data" ] || return 0
  local bin; bin=$(find_pg_bin)
  as_pg "$bin/pg_ctl" -D "$tmp/data" -m fast -w -t 30 stop >/dev/null 2>&1 \
    || as_pg "$bin/pg_ctl" -D "$tmp/data" -m immediate -w -t 30 stop >/dev/null 2>&1 || true
  rm -rf "$tmp"
}

case "${1:-}" in
  start) start ;;
  stop) stop "${2:-}" ;;
  *) echo "usage: $0 start | stop DIR" >&2; exit 2 ;;
esac
