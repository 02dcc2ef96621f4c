#!/usr/bin/env bash
# Local PostgreSQL for Combtrace: a private cluster in a git-ignored folder, on loopback only.
#   lib/db/pg.sh start|stop|status|url
# Env: PGPORT (default 54329), PGDATA (default <project>/.pg/data), PGDATABASE (default combtrace).
# When DATABASE_URL is set, this script does nothing: that PostgreSQL is managed elsewhere.
set -euo pipefail
ROOT=$(cd "$(dirname "$0")/../.." && pwd)
PGPORT=${PGPORT:-54329}
PGDATA=${PGDATA:-$ROOT/.pg/data}
PGDATABASE=${PGDATABASE:-combtrace}
RUNDIR=$(dirname "$PGDATA")
PGVER=$(ls /usr/lib/postgresql 2>/dev/null | sort -n | tail -1 || true)
PGBIN=/usr/lib/postgresql/${PGVER:-15}/bin
cmd=${1:-start}

if [ -n "${DATABASE_URL:-}" ] && [ "$cmd" != url ]; then
  echo "DATABASE_URL is set; not managing a local PostgreSQL."; exit 0
fi

# PostgreSQL refuses to run as root, so the cluster belongs to an unprivileged system user.
if [ "$(id -u)" = 0 ]; then
  PGUSER_OS=postgres
  id -u "$PGUSER_OS" >/dev/null 2>&1 || useradd --system --home-dir /var/lib/postgresql --shell /usr/sbin/nologin "$PGUSER_OS"
  AS=(runuser -u "$PGUSER_OS" --)
else
  AS=()
fi

install_server() {
  if [ ! -x "$PGBIN/initdb" ]; then
    echo "Installing PostgreSQL from Debian's packages…"
    if [ "$(id -u)" = 0 ]; then apt-get update -q && DEBIAN_FRONTEND=noninteractive apt-get install -y -q postgresql >/dev/null
    else sudo apt-get update -q && sudo DEBIAN_FRONTEND=noninteractive apt-get install -y -q postgresql >/dev/null; fi
    PGVER=$(ls /usr/lib/postgresql | sort -n | tail -1); PGBIN=/usr/lib/postgresql/$PGVER/bin
  fi
}

case "$cmd" in
  start)
    install_server
    mkdir -p "$RUNDIR"
    [ "$(id -u)" = 0 ] && chown "$PGUSER_OS:" "$RUNDIR"
    # Every parent must be traversable by the postgres user, or initdb cannot reach $PGDATA ("Permission denied").
    d=$RUNDIR; while [ "$d" != / ]; do [ "$(id -u)" = 0 ] && chmod o+x "$d" 2>/dev/null || true; d=$(dirname "$d"); done
    if [ ! -s "$PGDATA/PG_VERSION" ]; then
      "${AS[@]}" "$PGBIN/initdb" -D "$PGDATA" -U postgres --auth=trust -E UTF8 --locale=C.UTF-8 >/dev/null
    fi
    if ! "${AS[@]}" "$PGBIN/pg_ctl" -D "$PGDATA" status >/dev/null 2>&1; then
      "${AS[@]}" "$PGBIN/pg_ctl" -D "$PGDATA" -l "$RUNDIR/server.log" -w -t 60 \
        -o "-c listen_addresses=127.0.0.1 -p $PGPORT -c unix_socket_directories='' ${PG_EXTRA_OPTS:-}" start >/dev/null
    fi
    if ! psql -h 127.0.0.1 -p "$PGPORT" -U postgres -d postgres -tAc "select 1 from pg_database where datname='$PGDATABASE'" | grep -q 1; then
      psql -h 127.0.0.1 -p "$PGPORT" -U postgres -d postgres -qc "create database \"$PGDATABASE\"" >/dev/null
    fi
    echo "PostgreSQL ready on 127.0.0.1:$PGPORT (database $PGDATABASE)"
    ;;
  stop)
    if [ -x "$PGBIN/pg_ctl" ] && [ -s "$PGDATA/PG_VERSION" ] && "${AS[@]}" "$PGBIN/pg_ctl" -D "$PGDATA" status >/dev/null 2>&1; then
      "${AS[@]}" "$PGBIN/pg_ctl" -D "$PGDATA" -m fast -w stop >/dev/null && echo "PostgreSQL stopped."
    else
      echo "PostgreSQL was not running."
    fi
    ;;
  status)
    "${AS[@]}" "$PGBIN/pg_ctl" -D "$PGDATA" status ;;
  url)
    echo "${DATABASE_URL:-postgres://postgres@127.0.0.1:$PGPORT/$PGDATABASE}" ;;
  *) echo "usage: $0 start|stop|status|url" >&2; exit 2 ;;
esac
