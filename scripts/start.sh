#!/usr/bin/env bash
# npm start: installs what is missing, starts PostgreSQL (unless DATABASE_URL is given) and the local
# SMTP fake (unless SMTP_URL is given), migrates, seeds the demo, builds when stale, and serves the app.
# npm run dev (scripts/start.sh --dev): the same set-up, then `astro dev` (reloads on change) instead
# of the built server.
# Ctrl-C / SIGTERM stops the server, the SMTP fake and PostgreSQL cleanly (only the PostgreSQL this start started).
# A second start in the same data folder refuses while the first runs.
set -euo pipefail
cd "$(dirname "$0")/.."
source scripts/lib.sh

DEV=""
case "${1:-}" in
  "") ;;
  --dev) DEV=1 ;;
  *) echo "usage: scripts/start.sh [--dev]" >&2; exit 2 ;;
esac

DATA=${PANERAY_DATA:-$PWD/.data}
if [ -z "${DATABASE_URL:-}" ] && running=$(scripts/pg.sh status "$DATA/pg" 2>/dev/null); then
  read -r rpid rport <<<"$running"
  log "Paneray is already running from this folder (PostgreSQL pid $rpid on port $rport); stop it first or set PANERAY_DATA to another folder"
  exit 3
fi
mkdir -p "$DATA"
export HOST=${HOST:-127.0.0.1} PORT=${PORT:-4321}
export BETTER_AUTH_URL=${BETTER_AUTH_URL:-http://$HOST:$PORT}
export ASTRO_TELEMETRY_DISABLED=1
# localhost and 127.0.0.1 are different origins to the browser; accept both for local use.
export TRUSTED_ORIGINS=${TRUSTED_ORIGINS:-http://localhost:$PORT,http://127.0.0.1:$PORT}
if [ -z "${BETTER_AUTH_SECRET:-}" ]; then
  [ -s "$DATA/auth-secret" ] || (umask 077; new_secret > "$DATA/auth-secret")
  BETTER_AUTH_SECRET=$(cat "$DATA/auth-secret"); export BETTER_AUTH_SECRET
fi

ensure_node_modules

PIDS=()
# Set only once this start has started PostgreSQL itself: cleanup never stops a server it did not start.
PGDIR=""
cleanup() {
  trap - EXIT INT TERM
  for p in "${PIDS[@]}"; do kill "$p" 2>/dev/null || true; done
  for p in "${PIDS[@]}"; do wait "$p" 2>/dev/null || true; done
  if [ -n "$PGDIR" ]; then log "stopping PostgreSQL…"; scripts/pg.sh down "$PGDIR"; fi
}
trap cleanup EXIT
trap 'exit 130' INT
trap 'exit 143' TERM

if [ -z "${DATABASE_URL:-}" ]; then
  PGPORT=$(free_port "${PGPORT:-5433}")
  BIN=$(scripts/pg.sh up "$DATA/pg" "$PGPORT") || {
    log "PostgreSQL did not start on $DATA/pg; if another Paneray runs from this folder, stop it first or set PANERAY_DATA to another folder"
    exit 1
  }
  PGDIR="$DATA/pg"
  log "PostgreSQL on 127.0.0.1:$PGPORT (data in $PGDIR)"
  "$BIN/psql" -h 127.0.0.1 -p "$PGPORT" -U postgres -tAc "select 1 from pg_database where datname='paneray'" | grep -q 1 \
    || "$BIN/createdb" -h 127.0.0.1 -p "$PGPORT" -U postgres paneray
  export DATABASE_URL="postgres://postgres@127.0.0.1:$PGPORT/paneray"
else
  log "using the database at DATABASE_URL"
fi

node scripts/migrate.mjs
npx tsx scripts/seed.ts

if [ -z "${SMTP_URL:-}" ]; then
  start_smtp_fake "$DATA/mail"
  PIDS+=("$SMTP_PID")
  log "outgoing mail goes to the local SMTP fake; messages are stored in $DATA/mail"
fi

if [ -n "$DEV" ]; then
  # astro dev has no startup hook of ours: the job worker (e-mail deliveries) runs beside it from the sources.
  # shellcheck disable=SC2046 # the flags are words
  node_modules/.bin/tsx $(cat scripts/server-node-flags) scripts/worker.ts &
  PIDS+=("$!")
  node_modules/.bin/astro dev --host "$HOST" --port "$PORT" &
  MODE=" (development server: reloads on change)"
else
  build_if_stale
  # shellcheck disable=SC2046 # the flags are words
  NODE_ENV=production node $(cat scripts/server-node-flags) scripts/server.mjs &
  MODE=""
fi
PIDS+=("$!")
SERVER=$!
wait_port "$PORT" 60 || { log "the server did not start"; exit 1; }
cat >&2 <<MSG

  Paneray is running at $BETTER_AUTH_URL$MODE
  Demo sign-in (password: paneray-demo-2026):
    owner       ines.halden@halden-facades.example
    consultant  tomas.reis@halden-facades.example
    architect   mara.okafor@orla-kemp.example
    client      jonah.pell@cordage-dev.example
  Ctrl-C stops it.

MSG
wait "$SERVER"
