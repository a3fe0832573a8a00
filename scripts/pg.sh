#!/usr/bin/env bash
# Project-local PostgreSQL 15 on 127.0.0.1:$PGPORT, data under .data/pg.
# Usage: scripts/pg.sh start|stop|status|url|datadir|reset-db NAME
# Idempotent. Runs the server as 'postgres' when invoked as root (initdb/pg_ctl refuse root).
set -euo pipefail
REPO=$(cd "$(dirname "$0")/.." && pwd)
PGBIN=${PGBIN:-/usr/lib/postgresql/15/bin}
PGPORT=${SIGMATAIL_PGPORT:-55432}
PGHOST_ADDR=127.0.0.1
PGSOCK=${SIGMATAIL_PGSOCK:-/tmp}
DB=${SIGMATAIL_DB:-sigmatail}
# Test runs may ask for a faster, non-durable cluster (SIGMATAIL_PG_FAST=1) when they start it.
EXTRA=""
[ "${SIGMATAIL_PG_FAST:-0}" = 1 ] && EXTRA="-c fsync=off -c synchronous_commit=off -c full_page_writes=off"

if [ ! -x "$PGBIN/pg_ctl" ]; then
  if [ "$(id -u)" = 0 ]; then
    echo "pg.sh: PostgreSQL 15 not found; installing it from Debian (one time)..." >&2
    mkdir -p /etc/postgresql-common
    echo "create_main_cluster = false" > /etc/postgresql-common/createcluster.conf
    apt-get update -qq && DEBIAN_FRONTEND=noninteractive apt-get install -y -qq postgresql-15 >/dev/null
  else
    echo "pg.sh: $PGBIN missing; run: sudo apt-get install -y postgresql-15" >&2; exit 1
  fi
fi
if [ "$(id -u)" = 0 ]; then
  id postgres >/dev/null 2>&1 || useradd --system --home /var/lib/postgresql --shell /bin/bash postgres
  AS=(runuser -u postgres --)
else
  AS=()
fi
# The data directory. SIGMATAIL_PGDATA wins; else .data/pg in the checkout, where it already exists
# or where the database user can reach it. As root the server runs as 'postgres', which cannot
# enter a checkout under a mode-700 directory (/root, mktemp -d): then the data lives in a
# directory that user owns, one per checkout (named after the checkout's path), and we say so.
pick_pgdata() {
  local local_dir="$REPO/.data/pg"
  if [ -n "${SIGMATAIL_PGDATA:-}" ]; then echo "$SIGMATAIL_PGDATA"; return; fi
  if [ -s "$local_dir/PG_VERSION" ] || [ "$(id -u)" != 0 ] || "${AS[@]}" test -x "$REPO"; then
    echo "$local_dir"; return
  fi
  local tag
  tag="$(basename "$REPO" | tr -c 'A-Za-z0-9_.\n-' _)-$(printf %s "$REPO" | sha256sum | cut -c1-10)"
  echo "${SIGMATAIL_PGROOT:-/var/lib/postgresql/sigmatail}/$tag/pg"
}
PGDATA=$(pick_pgdata)
if [ "$PGDATA" != "$REPO/.data/pg" ] && [ -z "${SIGMATAIL_PGDATA:-}" ] && [ "${1:-start}" = start ] \
  && [ ! -s "$PGDATA/PG_VERSION" ]; then
  echo "pg.sh: the database user 'postgres' cannot enter $REPO; keeping this checkout's data in $PGDATA" >&2
fi

ready() { "$PGBIN/pg_isready" -q -h "$PGHOST_ADDR" -p "$PGPORT"; }
psql_() { PGOPTIONS="-c client_min_messages=warning" "$PGBIN/psql" -h "$PGHOST_ADDR" -p "$PGPORT" -U postgres -v ON_ERROR_STOP=1 -qtA "$@"; }

case "${1:-start}" in
  start)
    if [ ! -s "$PGDATA/PG_VERSION" ]; then
      mkdir -p "$PGDATA"
      [ "$(id -u)" = 0 ] && chown postgres:postgres "$PGDATA"
      chmod 700 "$PGDATA"
      "${AS[@]}" "$PGBIN/initdb" -D "$PGDATA" -U postgres --auth=trust -E UTF8 --no-locale >/dev/null
    fi
    if ! "${AS[@]}" "$PGBIN/pg_ctl" -D "$PGDATA" status >/dev/null 2>&1; then
      if ready 2>/dev/null; then
        echo "pg.sh: port $PGPORT on $PGHOST_ADDR is already taken by another server; set SIGMATAIL_PGPORT" >&2; exit 1
      fi
      "${AS[@]}" "$PGBIN/pg_ctl" -D "$PGDATA" -l "$PGDATA/server.log" -w -t 60 \
        -o "-p $PGPORT -k $PGSOCK -c listen_addresses=$PGHOST_ADDR -c max_connections=200 $EXTRA" start >/dev/null \
        || { echo "pg.sh: PostgreSQL did not start; see $PGDATA/server.log" >&2; tail -5 "$PGDATA/server.log" >&2; exit 1; }
    fi
    for _ in $(seq 1 60); do ready && break; sleep 0.5; done
    ready || { echo "pg.sh: not ready; see $PGDATA/server.log" >&2; exit 1; }
    if [ "$(psql_ -c "select 1 from pg_database where datname='$DB'")" != 1 ]; then
      "$PGBIN/createdb" -h "$PGHOST_ADDR" -p "$PGPORT" -U postgres "$DB"
    fi
    echo "postgres://postgres@$PGHOST_ADDR:$PGPORT/$DB" ;;
  reset-db)
    name=${2:?reset-db needs a database name}
    psql_ -c "drop database if exists \"$name\" with (force)" >/dev/null
    "$PGBIN/createdb" -h "$PGHOST_ADDR" -p "$PGPORT" -U postgres "$name"
    echo "postgres://postgres@$PGHOST_ADDR:$PGPORT/$name" ;;
  stop)
    if [ -s "$PGDATA/PG_VERSION" ] && "${AS[@]}" "$PGBIN/pg_ctl" -D "$PGDATA" status >/dev/null 2>&1; then
      "${AS[@]}" "$PGBIN/pg_ctl" -D "$PGDATA" -m fast -w stop >/dev/null
    fi
    echo "PostgreSQL stopped" ;;
  status) if ready; then echo "running on $PGHOST_ADDR:$PGPORT"; else echo "not running"; exit 3; fi ;;
  url) echo "postgres://postgres@$PGHOST_ADDR:$PGPORT/$DB" ;;
  datadir) echo "$PGDATA" ;;
  *) echo "usage: $0 start|stop|status|url|datadir|reset-db NAME" >&2; exit 2 ;;
esac
