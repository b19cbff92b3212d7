#!/usr/bin/env bash
# Project-local PostgreSQL on loopback: install Debian's server if missing, create the cluster once,
# start it idempotently, create the app and test databases. Safe to run any number of times.
set -euo pipefail
cd "$(dirname "$0")/.."
ROOT=$(pwd)
PGPORT="${PGPORT:-54329}"
DB_NAME="${DB_NAME:-hearthcast}"
DB_TEST_NAME="${DB_TEST_NAME:-hearthcast_test}"

log() { echo "[db] $*"; }

find_pg_bin() {
  local d
  for d in $(ls -d /usr/lib/postgresql/*/bin 2>/dev/null | sort -V -r); do
    [ -x "$d/initdb" ] && { echo "$d"; return 0; }
  done
  return 1
}

if ! PGBIN=$(find_pg_bin); then
  log "PostgreSQL server not found: installing Debian's postgresql (apt-get, non-interactive)…"
  if [ "$(id -u)" -ne 0 ]; then echo "[db] need root to apt-get install postgresql; install it and re-run" >&2; exit 1; fi
  export DEBIAN_FRONTEND=noninteractive
  apt-get update -qq
  apt-get install -y -qq --no-install-recommends postgresql >/dev/null
  # Debian's package creates and starts a default cluster on 5432; it is not ours, leave it alone.
  PGBIN=$(find_pg_bin) || { echo "[db] postgresql installed but initdb not found under /usr/lib/postgresql" >&2; exit 1; }
fi

as_pg() {
  if [ "$(id -u)" -eq 0 ]; then runuser -u postgres -- "$@"; else "$@"; fi
}

# The data folder's parent must be reachable by the postgres user; a clone under a mode-700
# folder (e.g. mktemp -d) is not, so fall back to /var/tmp keyed by the project path.
if [ -n "${PGDATA_DIR:-}" ]; then
  DATA="$PGDATA_DIR"
elif [ "$(id -u)" -ne 0 ] || runuser -u postgres -- test -x "$ROOT" 2>/dev/null; then
  DATA="$ROOT/.data/pg"
else
  DATA="/var/tmp/hearthcast-$(printf '%s' "$ROOT" | md5sum | cut -c1-10)/pg"
  log "project folder $ROOT is not traversable by the postgres user; using $DATA"
fi
mkdir -p "$(dirname "$DATA")"
[ "$(id -u)" -eq 0 ] && chown postgres:postgres "$(dirname "$DATA")"

if [ ! -f "$DATA/PG_VERSION" ]; then
  log "creating cluster in $DATA"
  as_pg "$PGBIN/initdb" -D "$DATA" -U postgres --auth=trust -E UTF8 --locale=C.UTF-8 >/dev/null
  {
    echo "listen_addresses = '127.0.0.1'"
    echo "port = $PGPORT"
    echo "unix_socket_directories = ''"
    echo "max_connections = 100"
    [ "${PG_FAST:-}" = "1" ] && echo "fsync = off" && echo "synchronous_commit = off"
  } >> "$DATA/postgresql.conf"
fi

ready() { "$PGBIN/pg_isready" -q -h 127.0.0.1 -p "$PGPORT"; }

if ready; then
  log "already running on 127.0.0.1:$PGPORT"
else
  for attempt in 1 2 3 4 5; do
    # A stale pid file after a kill -9 can make pg_ctl think it runs; it settles within a moment.
    if as_pg "$PGBIN/pg_ctl" -D "$DATA" -l "$DATA/../postgres.log" -w -t 60 start >/dev/null 2>&1; then break; fi
    ready && break
    log "start attempt $attempt failed; retrying"
    sleep 1
  done
  ready || { echo "[db] PostgreSQL did not start; see $DATA/../postgres.log" >&2; exit 1; }
  log "started on 127.0.0.1:$PGPORT"
fi

for db in "$DB_NAME" "$DB_TEST_NAME"; do
  exists=$("$PGBIN/psql" -h 127.0.0.1 -p "$PGPORT" -U postgres -tAc "select 1 from pg_database where datname='$db'")
  if [ "$exists" != "1" ]; then
    "$PGBIN/createdb" -h 127.0.0.1 -p "$PGPORT" -U postgres "$db"
    log "created database $db"
  fi
done
