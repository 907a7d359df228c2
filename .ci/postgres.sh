#!/usr/bin/env bash
# Starts a private PostgreSQL cluster on loopback for the ledger's PostgreSQL tests and prints the
# environment that points the test suite at it, ready for eval:
#
#   eval "$(bash .ci/postgres.sh)"      # then: mvn -B verify
#   bash .ci/postgres.sh stop            # stops the cluster
#
# Idempotent: installs PostgreSQL from Debian's packages when it is missing, creates the cluster
# once, and starts it when it is not running. The cluster listens on 127.0.0.1 only, on port
# RECKONER_PG_PORT (default 55432), with its files under RECKONER_PG_DIR (default: a folder in the
# temp dir). It is for tests: local connections are trusted and fsync is off.
set -euo pipefail

PORT="${RECKONER_PG_PORT:-55432}"
BASE="${RECKONER_PG_DIR:-${TMPDIR:-/tmp}/reckoner-pg-$PORT}"
DATA="$BASE/data"
DB=reckoner_test

log() { echo "postgres.sh: $*" >&2; }
# No PostgreSQL yet is an answer (empty), not a failure: the glob then matches nothing and ls fails,
# which pipefail would turn into an exit before the install step below.
newest_bin() { { ls -d /usr/lib/postgresql/*/bin 2>/dev/null || true; } | sort -V | tail -n 1; }
fail() { log "$*"; exit 1; }
# initdb and the server refuse to run as root: run them as the postgres user then.
as_owner() {
  if [ "$(id -u)" = 0 ]; then runuser -u postgres -- "$@"; else "$@"; fi
}

BIN="$(newest_bin)"
if [ -z "$BIN" ] || [ ! -x "$BIN/initdb" ]; then
  if [ "$(id -u)" != 0 ]; then
    log "PostgreSQL is not installed and installing it needs root"; exit 1
  fi
  log "installing PostgreSQL from Debian's packages"
  export DEBIAN_FRONTEND=noninteractive
  apt-get update -qq >&2
  apt-get install -y -qq postgresql >&2
  BIN="$(newest_bin)"
  [ -n "$BIN" ] && [ -x "$BIN/initdb" ] || fail "PostgreSQL was installed but no initdb was found under /usr/lib/postgresql"
fi

if [ "${1:-start}" = stop ]; then
  if [ -f "$DATA/postmaster.pid" ]; then as_owner "$BIN/pg_ctl" -D "$DATA" -w -m fast stop >&2; fi
  exit 0
fi

mkdir -p "$BASE"
if [ "$(id -u)" = 0 ]; then chown postgres: "$BASE"; fi

if [ ! -f "$DATA/PG_VERSION" ]; then
  log "creating a cluster in $DATA"
  as_owner "$BIN/initdb" -D "$DATA" -U postgres --auth=trust -E UTF8 >&2
  # Settings live in the cluster, so that a plain pg_ctl start (as the outage test does) brings it
  # back exactly as before.
  cat >> "$DATA/postgresql.conf" <<CONF
port = $PORT
listen_addresses = '127.0.0.1'
unix_socket_directories = '$BASE'
fsync = off
max_connections = 50
CONF
fi

if ! as_owner "$BIN/pg_ctl" -D "$DATA" status >/dev/null 2>&1; then
  log "starting the cluster on 127.0.0.1:$PORT"
  if ! as_owner "$BIN/pg_ctl" -D "$DATA" -l "$BASE/server.log" -w -t 60 start >&2; then
    tail -n 20 "$BASE/server.log" >&2 || true
    fail "the PostgreSQL test cluster did not start (log above: $BASE/server.log)"
  fi
fi

if ! as_owner "$BIN/psql" -h 127.0.0.1 -p "$PORT" -U postgres -tAc "SELECT 1 FROM pg_database WHERE datname = '$DB'" postgres | grep -q 1; then
  as_owner "$BIN/createdb" -h 127.0.0.1 -p "$PORT" -U postgres "$DB" >&2
fi

as_owner "$BIN/psql" -h 127.0.0.1 -p "$PORT" -U postgres -tAc "SELECT 1" "$DB" >/dev/null \
  || fail "the PostgreSQL test cluster on 127.0.0.1:$PORT does not answer queries"
echo "export RECKONER_TEST_PG_URL='jdbc:postgresql://127.0.0.1:$PORT/$DB?user=postgres'"
echo "export RECKONER_TEST_PG_DATA='$DATA'"
echo "export RECKONER_TEST_PG_BIN='$BIN'"
