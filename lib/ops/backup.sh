#!/usr/bin/env bash
# npm run db:backup [file]   — pg_dump in custom format to backups/combtrace-<UTC timestamp>.dump
# npm run db:restore <file> [database] — restores into the given (new or emptied) database
# Privileges travel with the dump: the app's own role (combtrace_app) keeps exactly the rights the
# migrations gave it, including what they revoked. Without them a restored database would be
# unusable for the app, or (restored over the old one) would grant the default rights again.
set -euo pipefail
ROOT=$(cd "$(dirname "$0")/../.." && pwd)
cmd=${1:?usage: backup.sh backup [file] | restore <file> [database]}
URL=${DATABASE_URL:-$(bash "$ROOT/lib/db/pg.sh" url)}
PGBIN=/usr/lib/postgresql/$(ls /usr/lib/postgresql | sort -n | tail -1)/bin
case "$cmd" in
  backup)
    out=${2:-$ROOT/backups/combtrace-$(date -u +%Y%m%dT%H%M%SZ).dump}
    mkdir -p "$(dirname "$out")"
    "$PGBIN/pg_dump" --format=custom --no-owner --file="$out" "$URL"
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
    # Roles belong to the cluster, not the dump: make the app's role here if it is missing (as
    # migrations/20261203000100-app-role.ts does) so its GRANTs can be restored.
    "$PGBIN/psql" "$URL" -qv ON_ERROR_STOP=1 >/dev/null <<'SQL'
DO $$ BEGIN
  IF NOT EXISTS (SELECT 1 FROM pg_roles WHERE rolname = 'combtrace_app')
     AND (SELECT rolsuper OR rolcreaterole FROM pg_roles WHERE rolname = current_user) THEN
    CREATE ROLE combtrace_app LOGIN NOSUPERUSER NOCREATEDB NOCREATEROLE NOREPLICATION NOBYPASSRLS;
    COMMENT ON ROLE combtrace_app IS 'Combtrace app role, created by migration 20261203000100-app-role';
  END IF;
EXCEPTION WHEN duplicate_object OR unique_violation THEN NULL;
END $$;
SQL
    "$PGBIN/pg_restore" --no-owner --clean --if-exists --exit-on-error --dbname="$URL" "$file"
    echo "Restored $file into ${URL##*/}"
    ;;
  *) echo "usage: backup.sh backup [file] | restore <file> [database]" >&2; exit 2 ;;
esac
