#!/usr/bin/env bash
# npm start: install what is missing, start PostgreSQL, migrate, load the demo, start the fakes,
# the worker and the web server. Ctrl-C stops everything it started.
set -euo pipefail
cd "$(dirname "$0")/.."
source scripts/lib.sh

export HEARTHCAST_DEMO="${HEARTHCAST_DEMO:-1}"
export DATABASE_URL="${DATABASE_URL:-postgres://postgres@127.0.0.1:${PGPORT}/hearthcast}"
export PORT="${PORT:-3000}"
export APP_URL="${APP_URL:-http://127.0.0.1:${PORT}}"
export NODE_ENV=production

ensure_node_modules
# A session secret made on first start and kept (git-ignored), unless one is given.
if [ -z "${SESSION_SECRET:-}" ]; then
  mkdir -p .var
  [ -s .var/session-secret ] || node -e "process.stdout.write(require('crypto').randomBytes(32).toString('base64url'))" > .var/session-secret
  SESSION_SECRET=$(cat .var/session-secret); export SESSION_SECRET
fi
bash scripts/db.sh
npx tsx scripts/migrate.ts
if [ "$HEARTHCAST_DEMO" = "1" ]; then npx tsx scripts/seed.ts; fi
ensure_build

# Job control: each background service gets its own process group, so stopping start.sh (Ctrl-C or a
# plain kill) stops the services and the node processes npx starts under them, leaving nothing behind.
set -m
pids=()
cleanup() {
  trap - EXIT INT TERM
  for p in "${pids[@]}"; do kill -TERM -- "-$p" 2>/dev/null || true; done
  wait 2>/dev/null || true
}
trap cleanup EXIT INT TERM

if [ "${START_FAKES:-1}" = "1" ]; then
  export FORECAST_FAKE_PORT="${FORECAST_FAKE_PORT:-4011}"
  export FORECAST_URL="${FORECAST_URL:-http://127.0.0.1:${FORECAST_FAKE_PORT}}"
  # The push fake makes a self-signed certificate at start; the web server and worker trust it (only it).
  export PUSH_FAKE_CA="${PUSH_FAKE_CA:-$(pwd)/.var/push-tls/cert.pem}"
  npx tsx scripts/fakes.ts & pids+=($!)
  # The worker fetches every kitchen's forecast as it starts: let the forecast fake listen first (≤ 15 s).
  for _ in $(seq 1 75); do (exec 3<>"/dev/tcp/127.0.0.1/${FORECAST_FAKE_PORT}") 2>/dev/null && break; sleep 0.2; done
fi
npx tsx scripts/worker.ts & pids+=($!)
npx next start -H 127.0.0.1 -p "$PORT" & pids+=($!)
echo "[start] Hearthcast on ${APP_URL} (sign in with a demo account from the README)"
wait -n "${pids[@]}"
