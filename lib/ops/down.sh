#!/usr/bin/env bash
# Stops the app, the fakes and the local PostgreSQL started by lib/ops/up.sh.
set -uo pipefail
ROOT=$(cd "$(dirname "$0")/../.." && pwd)
for f in app fakes; do
  p=$ROOT/.run/$f.pid
  if [ -f "$p" ]; then kill -- -"$(cat "$p")" 2>/dev/null && echo "Stopped $f."; rm -f "$p"; fi
done
bash "$ROOT/lib/db/pg.sh" stop
