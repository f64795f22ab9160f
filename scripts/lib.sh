# Shared helpers for demo.sh and test.sh.
ROOT="$(cd "$(dirname "${BASH_SOURCE[0]}")/.." && pwd)"
cd "$ROOT"
say() { printf '\033[1m[branchwise]\033[0m %s\n' "$*" >&2; }

ensure_node_modules() {
  # Reinstall when node_modules is missing or older than the lock.
  if [ ! -d node_modules ] || [ package-lock.json -nt node_modules/.package-lock.json ]; then
    say "installing npm packages (npm ci)"
    npm ci --no-audit --no-fund --loglevel=error
  fi
}

ensure_chromium() {
  if [ ! -x /usr/bin/chromium ]; then
    say "installing Debian's chromium for browser tests"
    apt-get update -qq
    DEBIAN_FRONTEND=noninteractive apt-get install -y -qq --no-install-recommends chromium fonts-dejavu-core >/dev/null
  fi
}

PIDS=()
start_bg() { # name, log file, command...
  local name=$1 logf=$2; shift 2
  mkdir -p "$(dirname "$logf")"
  "$@" >"$logf" 2>&1 &
  PIDS+=("$!")
  say "started $name (pid $!, log $logf)"
}
stop_bg() {
  local p
  for p in "${PIDS[@]:-}"; do [ -n "$p" ] && kill "$p" 2>/dev/null || true; done
  for p in "${PIDS[@]:-}"; do [ -n "$p" ] && wait "$p" 2>/dev/null || true; done
  PIDS=()
}
wait_port() { # port, seconds
  local i
  for ((i = 0; i < ${2:-30} * 10; i++)); do
    (echo >"/dev/tcp/127.0.0.1/$1") 2>/dev/null && return 0
    sleep 0.1
  done
  say "nothing listening on port $1"; return 1
}

start_fakes() { # mode
  start_bg "SMTP fake :$SMTP_PORT" ".data/$1/smtp.log" node_modules/.bin/tsx fakes/smtp/server.ts
  start_bg "upload fake :$FAKE_UPLOADS_PORT" ".data/$1/uploads.log" node_modules/.bin/tsx fakes/uploads/server.ts
  wait_port "$SMTP_PORT" 30 && wait_port "$FAKE_UPLOADS_PORT" 30
}

migrate() { node_modules/.bin/tsx ./node_modules/@mikro-orm/cli/cli migration:up >/dev/null; }
