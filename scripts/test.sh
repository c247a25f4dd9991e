#!/usr/bin/env bash
# npm test: the same set-up as npm start on a throwaway database, mail folder and ports; then type check,
# lint (ESLint) and format check (Prettier), unit and server tests (Vitest), a fresh build, the fault suite
# (tests/fault: the built server through a PostgreSQL outage, on a database of its own) and the browser
# tests (Playwright + Debian's chromium).
# Ends with one line "N passed, M failed" (totals of all runs: Vitest twice, Playwright, plus lint and format as one check
# each); exits non-zero on any failure.
# Leaves nothing running and nothing behind.
set -euo pipefail
cd "$(dirname "$0")/.."
source scripts/lib.sh

ensure_node_modules
ensure_chromium

TMP=$(mktemp -d -t paneray-test.XXXXXX)
chmod 755 "$TMP"   # mktemp makes 0700; the postgres user must be able to enter
SMTP_PID=""
cleanup() {
  trap - EXIT INT TERM
  [ -n "$SMTP_PID" ] && kill "$SMTP_PID" 2>/dev/null && wait "$SMTP_PID" 2>/dev/null
  scripts/pg.sh down "$TMP/pg"
  rm -rf "$TMP"
}
trap cleanup EXIT
trap 'exit 130' INT
trap 'exit 143' TERM

PGPORT=$(free_port)
BIN=$(PG_FSYNC=off scripts/pg.sh up "$TMP/pg" "$PGPORT")
"$BIN/createdb" -h 127.0.0.1 -p "$PGPORT" -U postgres paneray_test
export DATABASE_URL="postgres://postgres@127.0.0.1:$PGPORT/paneray_test"
E2E_PORT=$(free_port)
BETTER_AUTH_SECRET=$(new_secret)
export BETTER_AUTH_SECRET E2E_PORT BETTER_AUTH_URL="http://127.0.0.1:$E2E_PORT" ASTRO_TELEMETRY_DISABLED=1
export AUTH_RATE_LIMIT=off   # the browser tests sign in many times from one address
start_smtp_fake "$TMP/mail"

node scripts/migrate.mjs
npx tsx scripts/seed.ts

log "type check (astro check)…"
npx astro check --minimumSeverity error >&2

status=0
checks_passed=0 checks_failed=0
check() {   # check NAME CMD…: runs CMD and counts it as one passed or failed check
  local name=$1; shift
  log "$name…"
  if "$@" >&2; then checks_passed=$((checks_passed + 1)); else log "$name failed"; checks_failed=$((checks_failed + 1)); status=1; fi
}
check "lint (eslint)" npx eslint .
check "format (prettier --check)" npx prettier --check --log-level warn .

log "unit and server tests (vitest)…"
npx vitest run --reporter=default --reporter=json --outputFile.json="$TMP/vitest.json" || status=1

log "building…"
npx astro build >"$TMP/build.log" 2>&1 || { cat "$TMP/build.log" >&2; exit 1; }

log "fault tests (database outage against the built server)…"
npx vitest run --config vitest.fault.config.ts --reporter=default --reporter=json --outputFile.json="$TMP/fault.json" || status=1

log "browser tests (playwright)…"
CI_REPORT_JSON="$TMP/playwright.json" npx playwright test || status=1

node -e '
  const fs = require("fs");
  const read = (f) => { try { return JSON.parse(fs.readFileSync(f, "utf8")); } catch { return null; } };
  const v = read(process.argv[1]), p = read(process.argv[2]);   // argv 3, 4: lint and format checks passed, failed
  const f = read(process.argv[5]);   // the fault suite (a second Vitest run)
  let passed = Number(process.argv[3]), failed = Number(process.argv[4]), skipped = 0;
  for (const r of [v, f]) {
    if (r) {
      passed += r.numPassedTests; failed += r.numFailedTests; skipped += r.numPendingTests + (r.numTodoTests || 0);
      // A test file that failed to load or crashed outside its tests counts as one failure.
      failed += (r.testResults || []).filter((t) => t.status === "failed" && !(t.assertionResults || []).some((a) => a.status === "failed")).length;
    }
    else failed += 1;   // the runner produced no report: count it as a failure
  }
  // Errors outside any test (a spec that does not load, a duplicate title, a web server that does not start) count too.
  if (p) { passed += p.stats.expected + p.stats.flaky; failed += p.stats.unexpected + (p.errors || []).length; skipped += p.stats.skipped; }
  else failed += 1;
  console.log(`${passed} passed, ${failed} failed` + (skipped ? `, ${skipped} skipped` : ""));
  if (failed) process.exitCode = 1;
' "$TMP/vitest.json" "$TMP/playwright.json" "$checks_passed" "$checks_failed" "$TMP/fault.json" || status=1
exit $status
