#!/usr/bin/env bash
# npm test: the same set-up as npm start (against the test database), then lint → typecheck →
# build → every test (unit, database, API over HTTP, end-to-end in headless Chromium).
set -euo pipefail
cd "$(dirname "$0")/.."
export PG_FAST=1
source scripts/lib.sh

export DATABASE_URL="postgres://postgres@127.0.0.1:${PGPORT}/${DB_TEST_NAME:-hearthcast_test}"
export NODE_ENV=production

ensure_node_modules
bash scripts/db.sh
npx tsx scripts/migrate.ts

if ! command -v chromium >/dev/null 2>&1 && [ ! -x /usr/bin/chromium ]; then
  if [ "$(id -u)" -eq 0 ]; then
    echo "[test] installing Debian's chromium for the end-to-end tests…"
    DEBIAN_FRONTEND=noninteractive apt-get update -qq && DEBIAN_FRONTEND=noninteractive apt-get install -y -qq --no-install-recommends chromium >/dev/null
  else
    echo "[test] chromium is missing and this user cannot install it (apt-get install chromium)" >&2; exit 1
  fi
fi

echo "[test] lint"; npx eslint .
echo "[test] typecheck"; npx tsc --noEmit -p .
ensure_build
echo "[test] vitest"; NODE_ENV=test npx vitest run "$@"
