#!/usr/bin/env bash
# Private PostgreSQL cluster for Tauline on 127.0.0.1, data folder inside the repo (.pgdata/).
#   scripts/pg.sh start    start (or reuse) the cluster and create the database; idempotent
#   scripts/pg.sh stop     stop it cleanly
#   scripts/pg.sh status   say whether it runs
#   scripts/pg.sh url      print the DATABASE_URL the app should use
# When DATABASE_URL is set, nothing is started: that server is used as it is.
set -euo pipefail
. "$(dirname "$0")/lib.sh"
load_env

DATA_DIR=${TAULINE_PG_DATA_DIR:-$TAULINE_ROOT/.pgdata}
PORT=${TAULINE_PG_PORT:-54329}
DB_NAME=${TAULINE_PG_DATABASE:-tauline}
URL="postgres://postgres@127.0.0.1:$PORT/$DB_NAME"

# Running means: the postmaster of our data folder is alive AND answers on our port.
pg_running() {
  local bin; bin=$(find_pg_bin)
  [ -f "$DATA_DIR/data/postmaster.pid" ] || return 1
  pid_alive "$(head -n1 "$DATA_DIR/data/postmaster.pid")" || return 1
  "$bin/pg_isready" -q -h 127.0.0.1 -p "$PORT" -t 5
}

# A live (not zombie) PostgreSQL process with this PID.
pid_alive() {
  local stat comm
  stat=$(ps -p "$1" -o stat= 2>/dev/null) || return 1
  comm=$(ps -p "$1" -o comm= 2>/dev/null)
  [[ "$stat" != Z* ]] && [[ "$comm" == postgres* ]]
}

start() {
  if [ -n "${DATABASE_URL:-}" ]; then
    log "DATABASE_URL is set: using that server, starting nothing"
    return 0
  fi
  ensure_pg_installed
  local bin user; bin=$(find_pg_bin); user=$(pg_run_user)
  if pg_running; then
    log "PostgreSQL already running on 127.0.0.1:$PORT (data in $DATA_DIR)"
  else
    mkdir -p "$DATA_DIR/log"
    grant_traverse "$DATA_DIR"
    chown "$user": "$DATA_DIR" "$DATA_DIR/log"
    if [ ! -f "$DATA_DIR/data/PG_VERSION" ]; then
      log "initialising a new cluster in $DATA_DIR/data"
      rm -rf "$DATA_DIR/data"; mkdir -p "$DATA_DIR/data"; chown "$user": "$DATA_DIR/data"; chmod 700 "$DATA_DIR/data"
      as_pg "$bin/initdb" -D "$DATA_DIR/data" -U postgres --auth=trust -E UTF8 --locale=C.UTF-8 \
        >"$DATA_DIR/log/initdb.log" 2>&1 || { cat "$DATA_DIR/log/initdb.log" >&2; die "initdb failed"; }
    fi
    # A postmaster.pid left by a killed server: PostgreSQL checks the PID itself, but a reused PID
    # of an unrelated process would block it, so remove the file when no postgres owns that PID.
    if [ -f "$DATA_DIR/data/postmaster.pid" ]; then
      local pid; pid=$(head -n1 "$DATA_DIR/data/postmaster.pid")
      if pid_alive "$pid"; then
        die "a PostgreSQL (PID $pid) holds $DATA_DIR but does not answer on port $PORT; stop it or fix TAULINE_PG_PORT"
      else
        log "removing stale postmaster.pid (PID $pid is not a running PostgreSQL)"
        rm -f "$DATA_DIR/data/postmaster.pid"
      fi
    fi
    log "starting PostgreSQL on 127.0.0.1:$PORT"
    as_pg "$bin/pg_ctl" -D "$DATA_DIR/data" -l "$DATA_DIR/log/server.log" -w -t 60 start -o \
      "-c listen_addresses=127.0.0.1 -p $PORT -c unix_socket_directories='' -c max_connections=100" >&2 \
      || { tail -n 20 "$DATA_DIR/log/server.log" >&2; die "PostgreSQL did not start (is port $PORT taken? set TAULINE_PG_PORT in .env)"; }
  fi
  if ! "$bin/psql" -h 127.0.0.1 -p "$PORT" -U postgres -d postgres -tAc \
      "SELECT 1 FROM pg_database WHERE datname = '$DB_NAME'" | grep -q 1; then
    "$bin/psql" -h 127.0.0.1 -p "$PORT" -U postgres -d postgres -v ON_ERROR_STOP=1 -qc "CREATE DATABASE \"$DB_NAME\"" >/dev/null
    log "created database $DB_NAME"
  fi
}

stop() {
  [ -n "${DATABASE_URL:-}" ] && { log "DATABASE_URL is set: nothing of ours to stop"; return 0; }
  local bin; bin=$(find_pg_bin)
  [ -n "$bin" ] || return 0
  if [ -f "$DATA_DIR/data/postmaster.pid" ] && pid_alive "$(head -n1 "$DATA_DIR/data/postmaster.pid")"; then
    as_pg "$bin/pg_ctl" -D "$DATA_DIR/data" -m fast -w -t 30 stop >/dev/null 2>&1 \
      || as_pg "$bin/pg_ctl" -D "$DATA_DIR/data" -m immediate -w -t 30 stop >/dev/null 2>&1 || true
    log "PostgreSQL stopped"
  else
    log "PostgreSQL is not running"
  fi
}

case "${1:-}" in
  start) start ;;
  stop) stop ;;
  status) if pg_running; then echo "running on 127.0.0.1:$PORT"; else echo "stopped"; exit 3; fi ;;
  url) echo "${DATABASE_URL:-$URL}" ;;
  *) echo "usage: $0 start | stop | status | url" >&2; exit 2 ;;
esac
