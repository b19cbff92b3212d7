#!/usr/bin/env bash
# npm run bench: set-up as npm test (test database, production build), then every benchmark.
# Benchmarks print figures; they assert nothing and are not part of npm test.
set -euo pipefail
cd "$(dirname "$0")/.."
source scripts/lib.sh
export DATABASE_URL="postgres://postgres@127.0.0.1:${PGPORT}/${DB_TEST_NAME:-hearthcast_test}"
ensure_node_modules
bash scripts/db.sh
npx tsx scripts/migrate.ts
HEARTHCAST_DEMO=1 npx tsx scripts/seed.ts
ensure_build
for b in tests/bench/*.bench.ts; do
  echo "=== $b"
  npx tsx "$b"
done
