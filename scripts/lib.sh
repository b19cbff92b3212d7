# Shared steps of start.sh and test.sh (sourced).
set -euo pipefail
export NEXT_TELEMETRY_DISABLED=1
export PGPORT="${PGPORT:-54329}"

ensure_node_modules() {
  # Install from the lock when node_modules is missing or older than the lock file.
  if [ ! -d node_modules ] || [ ! -f node_modules/.package-lock.json ] || [ package-lock.json -nt node_modules/.package-lock.json ]; then
    echo "[setup] installing npm packages from package-lock.json…"
    # --include=dev: the build and the tests need devDependencies even when NODE_ENV=production.
    npm ci --include=dev --no-audit --no-fund --loglevel=error
  fi
}

# Builds the production bundle when it is missing or older than any source file.
ensure_build() {
  if [ -f .next/BUILD_ID ] && [ -z "$(find app components lib entities public next.config.mjs tailwind.config.ts package-lock.json -newer .next/BUILD_ID -type f 2>/dev/null | head -1)" ]; then
    echo "[setup] production build is up to date"
  else
    echo "[setup] building the app (next build)…"
    npx next build
  fi
  # The planner thread's bundle (lib/planner/thread.ts): under a second, so made every time.
  node scripts/build-planner-thread.mjs
}
