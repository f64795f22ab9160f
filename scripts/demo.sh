#!/usr/bin/env bash
# npm run demo: installs what is missing, starts PostgreSQL, the fakes and the app with demo data.
set -euo pipefail
source "$(dirname "${BASH_SOURCE[0]}")/lib.sh"
source scripts/env.sh demo

ensure_node_modules
bash scripts/db.sh start
migrate
trap stop_bg EXIT
mkdir -p .data/demo
start_fakes demo
say "seeding the demo lab"
node_modules/.bin/tsx scripts/seed-demo.ts
say "screening the demo spectra (uploaded through the same path as a user's file)"
node_modules/.bin/tsx scripts/seed-spectra.ts
if [ ! -f .next/BUILD_ID ] || [ -n "$(find app components lib entities -newer .next/BUILD_ID -print -quit 2>/dev/null)" ]; then
  say "building the app"
  node_modules/.bin/next build >.data/demo/build.log 2>&1 || { tail -50 .data/demo/build.log; exit 1; }
fi
say "Branchwise is starting on $APP_URL (Ctrl-C stops it)"

exec_app() { node node_modules/next/dist/bin/next start -H 127.0.0.1 -p "$APP_PORT"; }
exec_app
