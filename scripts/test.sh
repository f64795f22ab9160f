#!/usr/bin/env bash
# npm test: installs what is missing, starts PostgreSQL and the fakes on loopback, runs unit,
# integration and browser tests, stops what it started. Exits non-zero on any failure.
set -euo pipefail
source "$(dirname "${BASH_SOURCE[0]}")/lib.sh"
source scripts/env.sh test

ensure_node_modules
ensure_chromium

db_was_running=0
bash scripts/db.sh status >/dev/null 2>&1 && db_was_running=1
bash scripts/db.sh start
cleanup() {
  stop_bg
  [ "$db_was_running" = 1 ] || bash scripts/db.sh stop || true
}
trap cleanup EXIT

say "fresh test database"
bash scripts/db.sh recreate test
migrate
rm -rf ".data/test"
mkdir -p ".data/test"
start_fakes test

say "unit and integration tests (vitest)"
node_modules/.bin/vitest run "$@"

# The browser tests get a fresh database too: leftover jobs and outbox events of the integration
# tests would otherwise be picked up by the app's own workers while the browser tests run.
say "fresh test database for the browser tests"
bash scripts/db.sh recreate test
migrate

say "building the app for browser tests"
node_modules/.bin/next build >".data/test/build.log" 2>&1 || { tail -50 .data/test/build.log; exit 1; }
say "browser tests (playwright, Debian chromium)"
node_modules/.bin/playwright test
