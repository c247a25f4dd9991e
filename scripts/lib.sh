# Shared set-up steps for scripts/start.sh and scripts/test.sh (sourced, not run).
# Everything here is idempotent and needs only the npm registry and Debian's packages.

log() { printf '\033[1;36m[paneray]\033[0m %s\n' "$*" >&2; }

# npm ci when node_modules is missing or older than the lock file.
ensure_node_modules() {
  if [ ! -d node_modules ] || [ package-lock.json -nt node_modules/.package-lock.json ]; then
    log "installing npm packages (npm ci)…"
    npm ci --no-audit --no-fund --loglevel=error >&2
  fi
}

apt_install() {
  export DEBIAN_FRONTEND=noninteractive
  if [ "$(id -u)" != 0 ]; then log "need root to apt-get install $*"; return 1; fi
  if [ -z "${PANERAY_APT_UPDATED:-}" ]; then apt-get update -qq >&2; PANERAY_APT_UPDATED=1; fi
  apt-get install -y -qq "$@" >&2
}

ensure_chromium() {
  if [ ! -x "${CHROMIUM_PATH:-/usr/bin/chromium}" ]; then
    log "installing Debian's chromium for the browser tests…"
    apt_install chromium
  fi
}

# Print a free TCP port on 127.0.0.1 (or the preferred one when it is free).
free_port() {
  node -e '
    const net = require("net");
    const want = Number(process.argv[1] || 0);
    const tryPort = (p) => { const s = net.createServer();
      s.once("error", () => tryPort(0));
      s.listen(p, "127.0.0.1", () => { console.log(s.address().port); s.close(); }); };
    tryPort(want);' "${1:-0}"
}

# Wait until a TCP port on 127.0.0.1 accepts connections (max ~$2 seconds).
wait_port() {
  node -e '
    const net = require("net"); const port = Number(process.argv[1]); const until = Date.now() + 1000 * Number(process.argv[2] || 20);
    const go = () => { const c = net.connect(port, "127.0.0.1");
      c.once("connect", () => { c.end(); process.exit(0); });
      c.once("error", () => { if (Date.now() > until) process.exit(1); setTimeout(go, 100); }); };
    go();' "$1" "${2:-20}"
}

new_secret() { node -e 'process.stdout.write(require("crypto").randomBytes(32).toString("hex"))'; }

# Start the local SMTP fake in the background; sets SMTP_URL and SMTP_PID. $1 = mail folder.
start_smtp_fake() {
  local dir=$1 port; port=$(free_port)
  mkdir -p "$dir"
  MAIL_DIR="$dir" SMTP_PORT="$port" node scripts/smtp-fake.mjs &
  SMTP_PID=$!
  wait_port "$port" 15 || { log "the SMTP fake did not start"; return 1; }
  export SMTP_URL="smtp://127.0.0.1:$port" MAIL_DIR="$dir"
}

# Build when dist/ is missing or older than any source that goes into it.
build_if_stale() {
  local entry=dist/server/entry.mjs
  if [ ! -f "$entry" ] || [ -n "$(find src public astro.config.mjs package-lock.json tsconfig.json -newer "$entry" -print -quit 2>/dev/null)" ]; then
    log "building the app (astro build)…"
    ASTRO_TELEMETRY_DISABLED=1 npx astro build >&2
  fi
}
