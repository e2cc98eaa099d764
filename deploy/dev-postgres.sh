#!/usr/bin/env bash
# A throwaway PostgreSQL with PostGIS on a loopback port, for the storage tests and local runs.
#   deploy/dev-postgres.sh start   installs PostGIS if missing, creates a cluster in a temp folder, starts it,
#                                  and prints the export line for SAFETYMIRROR_TEST_POSTGRES
#   deploy/dev-postgres.sh stop    stops the cluster and deletes its folder
# Folder: SAFETYMIRROR_PG_DIR (/tmp/safetymirror-postgres). Port: SAFETYMIRROR_PG_PORT, else the first free one
# from 55432 (the machine may be shared).
set -euo pipefail

dir=${SAFETYMIRROR_PG_DIR:-/tmp/safetymirror-postgres}
bin=$(ls -d /usr/lib/postgresql/*/bin 2>/dev/null | sort -V | tail -1)
user=safetymirror password=safetymirror database=safetymirror_test

free_port() {
  local port
  for port in $(seq 55432 55532); do
    (echo >"/dev/tcp/127.0.0.1/$port") 2>/dev/null || { echo "$port"; return; }
  done
  echo "no free port in 55432-55532" >&2; exit 1
}
connection() { echo "Host=127.0.0.1;Port=$1;Username=$user;Password=$password;Database=$database"; }

# PostgreSQL refuses to run as root: as root, act as the postgres user.
as_owner() { if [ "$(id -u)" = 0 ]; then runuser -u postgres -- "$@"; else "$@"; fi; }

start() {
  if [ -z "$bin" ] || ! ls /usr/share/postgresql/*/extension/postgis.control >/dev/null 2>&1; then
    [ "$(id -u)" = 0 ] || { echo "PostgreSQL 15 with PostGIS is missing: sudo apt-get install -y postgresql-15-postgis-3" >&2; exit 1; }
    apt-get update -qq
    DEBIAN_FRONTEND=noninteractive apt-get install -y -qq --no-install-recommends postgresql-15-postgis-3 >/dev/null
    bin=$(ls -d /usr/lib/postgresql/*/bin | sort -V | tail -1)
  fi
  if [ -f "$dir/data/postmaster.pid" ] && as_owner "$bin/pg_ctl" -D "$dir/data" status >/dev/null; then
    echo "already running in $dir" >&2
    echo "export SAFETYMIRROR_TEST_POSTGRES='$(connection "$(cat "$dir/port")")'"
    return
  fi
  local port=${SAFETYMIRROR_PG_PORT:-$(free_port)}
  rm -rf "$dir" && mkdir -p "$dir"
  echo "$port" > "$dir/port"
  [ "$(id -u)" = 0 ] && chown postgres: "$dir"
  local pwfile="$dir/password"
  echo "$password" > "$pwfile"
  as_owner "$bin/initdb" -D "$dir/data" -U "$user" --pwfile="$pwfile" -A scram-sha-256 -E UTF8 --locale=C.UTF-8 >/dev/null
  as_owner "$bin/pg_ctl" -D "$dir/data" -l "$dir/log" -w start \
    -o "-c listen_addresses=127.0.0.1 -p $port -k $dir" >/dev/null
  PGPASSWORD=$password "$bin/psql" -h 127.0.0.1 -p "$port" -U "$user" -d postgres -q -v ON_ERROR_STOP=1 \
    -c "CREATE DATABASE $database" >/dev/null
  PGPASSWORD=$password "$bin/psql" -h 127.0.0.1 -p "$port" -U "$user" -d "$database" -q -v ON_ERROR_STOP=1 \
    -c "CREATE EXTENSION postgis" >/dev/null
  echo "export SAFETYMIRROR_TEST_POSTGRES='$(connection "$port")'"
}

stop() {
  if [ -f "$dir/data/postmaster.pid" ]; then as_owner "$bin/pg_ctl" -D "$dir/data" -m fast -w stop >/dev/null || true; fi
  rm -rf "$dir"
}

case "${1:-}" in
  start) start ;;
  stop) stop ;;
  *) echo "usage: $0 start|stop" >&2; exit 2 ;;
esac
