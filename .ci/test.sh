#!/usr/bin/env bash
# The whole test suite: lint and formatting, types, unit tests, integration tests against a throw-away PostgreSQL,
# and browser tests in Chromium against a production build with the fakes.
set -euo pipefail
ROOT=$(cd "$(dirname "$0")/.." && pwd)
cd "$ROOT"
export TEST_PGPORT=${TEST_PGPORT:-54340} TEST_PGDATA=${TEST_PGDATA:-$ROOT/.pg-test/data}
stop_pg() { PGPORT=$TEST_PGPORT PGDATA=$TEST_PGDATA DATABASE_URL= bash lib/db/pg.sh stop >/dev/null 2>&1 || true; }
trap stop_pg EXIT
t0=$(date +%s)
echo "== lint"; npm run --silent lint
echo "== format"; npm run --silent format:check
echo "== types"; npx tsc --noEmit -p .
echo "== unit"; npx vitest run --project unit
echo "== integration (PostgreSQL)"; npx vitest run --project db
echo "== browser (Chromium)"; npx vitest run --project e2e
echo "All tests passed in $(( $(date +%s) - t0 )) s."
