#!/usr/bin/env bash
# scripts/pg.sh up DATADIR PORT   -> PostgreSQL on 127.0.0.1:PORT (initialised on first use); prints its bin dir
# scripts/pg.sh down DATADIR [MODE] -> shutdown: fast and clean by default; MODE immediate aborts (crash-like, recovery on next start)
# scripts/pg.sh status DATADIR    -> prints "PID PORT" and exits 0 when a PostgreSQL runs on DATADIR, else exits 3
# `up` refuses (exit 3) when a PostgreSQL already runs on DATADIR: two servers never share a data folder, and
# the caller must not stop a server it did not start.
# Installs Debian's postgresql when its server binaries are missing. initdb/pg_ctl refuse to run
# as root, so as root they run as the postgres user that the Debian package creates.
set -euo pipefail
pgbin() { ls -d /usr/lib/postgresql/*/bin 2>/dev/null | sort -V | tail -n 1; }
BIN=$(pgbin)
if [ -z "$BIN" ] || [ ! -x "$BIN/pg_ctl" ]; then
  echo "[paneray] installing Debian's postgresql…" >&2
  export DEBIAN_FRONTEND=noninteractive
  apt-get update -qq >&2 && apt-get install -y -qq postgresql >&2
  BIN=$(pgbin)
fi
AS=(); if [ "$(id -u)" = 0 ]; then AS=(runuser -u postgres --); fi
DATA=${2:?data dir}
# "PID PORT" of the PostgreSQL running on $DATA (pg_ctl status checks the pid in postmaster.pid is alive).
running() {
  [ -f "$DATA/postmaster.pid" ] || return 1
  "${AS[@]}" "$BIN/pg_ctl" -D "$DATA" status >/dev/null 2>&1 || return 1
  local pid port
  pid=$(sed -n 1p "$DATA/postmaster.pid" 2>/dev/null || true)
  port=$(sed -n 4p "$DATA/postmaster.pid" 2>/dev/null || true)
  echo "${pid:-?} ${port:-?}"
}
case "$1" in
  status)
    running || exit 3 ;;
  up)
    PORT=${3:?port}
    if info=$(running); then
      read -r rpid rport <<<"$info"
      echo "pg.sh: PostgreSQL is already running on $DATA (pid $rpid on port $rport); not starting a second one" >&2
      exit 3
    fi
    mkdir -p "$DATA"
    if [ "$(id -u)" = 0 ]; then chown postgres: "$DATA"; chmod 700 "$DATA"; fi
    "${AS[@]}" test -w "$DATA" || { echo "pg.sh: the postgres user cannot write $DATA (parent folders must be traversable)" >&2; exit 1; }
    [ -f "$DATA/PG_VERSION" ] || "${AS[@]}" "$BIN/initdb" -D "$DATA" -U postgres -A trust -E UTF8 --locale=C.UTF-8 >/dev/null
    "${AS[@]}" mkdir -p "$DATA/sock"
    # A previous run killed hard leaves a stale pid file; pg_ctl handles that itself.
    "${AS[@]}" "$BIN/pg_ctl" -D "$DATA" -l "$DATA/server.log" -w -t 60 \
      -o "-h 127.0.0.1 -p $PORT -k $DATA/sock -c fsync=${PG_FSYNC:-on}" start >/dev/null
    echo "$BIN" ;;
  down)
    if [ -f "$DATA/postmaster.pid" ]; then "${AS[@]}" "$BIN/pg_ctl" -D "$DATA" -m "${3:-fast}" -w stop >/dev/null || true; fi ;;
  *) echo "usage: pg.sh up DATADIR PORT | pg.sh down DATADIR [fast|immediate] | pg.sh status DATADIR" >&2; exit 2 ;;
esac
