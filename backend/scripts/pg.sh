#!/usr/bin/env bash
# PostgreSQL from Debian's packages, on loopback, with its data folder inside the project.
# usage: pg.sh start|stop|status|url|psql|recreate|reset
#   env: PGPORT (54329), PGDB (amberline), PGDATA_DIR (.data/pg)
set -euo pipefail
ROOT="$(cd "$(dirname "${BASH_SOURCE[0]}")/../.." && pwd)"
PGPORT="${PGPORT:-54329}"
DB="${PGDB:-amberline}"
DATA="${PGDATA_DIR:-$ROOT/.data/pg}"
SOCK="${PGSOCK_DIR:-/tmp/amberline-pg-$PGPORT}"

PGBIN="${PGBIN:-}"
if [ -z "$PGBIN" ]; then
  if command -v pg_config >/dev/null 2>&1 && [ -x "$(pg_config --bindir)/initdb" ]; then PGBIN="$(pg_config --bindir)"
  else PGBIN="$(ls -d /usr/lib/postgresql/*/bin 2>/dev/null | sort -V | tail -1)"; fi
fi
if [ -z "$PGBIN" ] || [ ! -x "$PGBIN/initdb" ]; then
  echo "PostgreSQL server binaries not found. Install them with: apt-get install -y postgresql" >&2
  exit 1
fi

if [ "$(id -u)" = 0 ]; then
  # PostgreSQL refuses to run as root: run it as the postgres user.
  id postgres >/dev/null 2>&1 || useradd --system --home-dir /var/lib/postgresql --shell /bin/bash postgres
  if ! runuser -u postgres -- test -x "$ROOT"; then
    # the postgres user cannot reach the checkout (e.g. a clone under /root): keep the data under /tmp
    DATA="${PGDATA_DIR:-/tmp/amberline-pg-$PGPORT-data}"
  fi
  as_pg() { (cd / && runuser -u postgres -- "$@"); }
  prep() { mkdir -p "$DATA" "$SOCK"; chown postgres:postgres "$DATA" "$SOCK"; chmod 700 "$DATA"; }
else
  as_pg() { "$@"; }
  prep() { mkdir -p "$DATA" "$SOCK"; chmod 700 "$DATA"; }
fi
running() { as_pg "$PGBIN/pg_ctl" -D "$DATA" status >/dev/null 2>&1; }

case "${1:-}" in
  start)
    prep
    [ -f "$DATA/PG_VERSION" ] || as_pg "$PGBIN/initdb" -D "$DATA" -U postgres --auth=trust --encoding=UTF8 --locale=C.UTF-8 >/dev/null
    running || as_pg "$PGBIN/pg_ctl" -D "$DATA" -l "$DATA/server.log" -w -t 60 start \
      -o "-h 127.0.0.1 -p $PGPORT -k $SOCK -c fsync=off -c synchronous_commit=off -c full_page_writes=off ${PG_EXTRA_OPTS:-}" >/dev/null
    [ "$(as_pg "$PGBIN/psql" -h "$SOCK" -p "$PGPORT" -U postgres -d postgres -tAc \
        "select 1 from pg_database where datname='$DB'")" = 1 ] || as_pg "$PGBIN/createdb" -h "$SOCK" -p "$PGPORT" -U postgres "$DB"
    echo "postgres://postgres@127.0.0.1:$PGPORT/$DB" ;;
  stop)   if running; then as_pg "$PGBIN/pg_ctl" -D "$DATA" -m fast -w stop >/dev/null; fi ;;
  status) as_pg "$PGBIN/pg_ctl" -D "$DATA" status ;;
  url)    echo "postgres://postgres@127.0.0.1:$PGPORT/$DB" ;;
  psql)   shift; as_pg "$PGBIN/psql" -h "$SOCK" -p "$PGPORT" -U postgres -d "$DB" "$@" ;;
  recreate) # drop and create the database: a clean slate for a test run
    as_pg "$PGBIN/dropdb" -h "$SOCK" -p "$PGPORT" -U postgres --if-exists --force "$DB"
    as_pg "$PGBIN/createdb" -h "$SOCK" -p "$PGPORT" -U postgres "$DB" ;;
  reset)  "$0" stop; rm -rf "$DATA" ;;
  *) echo "usage: $0 start|stop|status|url|psql|recreate|reset" >&2; exit 2 ;;
esac
