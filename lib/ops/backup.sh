#!/usr/bin/env bash
# npm run db:backup [file]   — pg_dump in custom format to backups/combtrace-<UTC timestamp>.dump
# npm run db:restore <file> [database] — restores into the given (new or emptied) database
set -euo pipefail
ROOT=$(cd "$(dirname "$0")/../.." && pwd)
cmd=${1:?usage: backup.sh backup [file] | restore <file> [database]}
URL=${DATABASE_URL:-$(bash "$ROOT/lib/db/pg.sh" url)}
PGBIN=/usr/lib/postgresql/$(ls /usr/lib/postgresql | sort -n | tail -1)/bin
case "$cmd" in
  backup)
    out=${2:-$ROOT/backups/combtrace-$(date -u +%Y%m%dT%H%M%SZ).dump}
    mkdir -p "$(dirname "$out")"
    "$PGBIN/pg_dump" --format=custom --no-owner --no-privileges --file="$out" "$URL"
    echo "Backup written: $out ($(du -h "$out" | cut -f1))"
    ;;
  restore)
    file=${2:?which backup file?}
    target=${3:-}
    if [ -n "$target" ]; then
      # Restore into a fresh database beside the live one, then point DATABASE_URL at it.
      base=${URL%/*}
      "$PGBIN/psql" "$base/postgres" -qc "CREATE DATABASE \"$target\"" >/dev/null
      URL="$base/$target"
    fi
    "$PGBIN/pg_restore" --no-owner --no-privileges --clean --if-exists --exit-on-error --dbname="$URL" "$file"
    echo "Restored $file into ${URL##*/}"
    ;;
  *) echo "usage: backup.sh backup [file] | restore <file> [database]" >&2; exit 2 ;;
esac
