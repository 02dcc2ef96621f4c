#!/usr/bin/env bash
# Installs and starts everything on this machine: PostgreSQL on loopback, migrations, demo data,
# the fake Stripe and mail servers, and a production build of the app. Safe to run again.
set -euo pipefail
ROOT=$(cd "$(dirname "$0")/../.." && pwd)
cd "$ROOT"
RUN=$ROOT/.run
mkdir -p "$RUN"
APP_PORT=${APP_PORT:-3100}
export FAKE_STRIPE_PORT=${FAKE_STRIPE_PORT:-12111} FAKE_SMTP_PORT=${FAKE_SMTP_PORT:-1025} FAKE_MAIL_WEB_PORT=${FAKE_MAIL_WEB_PORT:-1080}
started=$(date +%s)

need_apt=()
command -v node >/dev/null || { echo "Node.js 20 or newer is needed first (https://nodejs.org)."; exit 1; }
[ -x /usr/lib/postgresql/*/bin/initdb ] 2>/dev/null || need_apt+=(postgresql)
if [ ${#need_apt[@]} -gt 0 ]; then
  echo "Installing ${need_apt[*]} from Debian's packages…"
  SUDO=; [ "$(id -u)" = 0 ] || SUDO=sudo
  $SUDO apt-get update -q >/dev/null && $SUDO env DEBIAN_FRONTEND=noninteractive apt-get install -y -q "${need_apt[@]}" >/dev/null
fi

if [ ! -d node_modules ] || [ package-lock.json -nt node_modules/.package-lock.json ]; then
  echo "Installing npm packages…"; npm ci --no-audit --no-fund --loglevel=error
fi

# Local secrets and URLs, written once; edit .env.local to change them.
if [ ! -f .env.local ]; then
  cat > .env.local <<ENV
NEXTAUTH_SECRET=$(node -e "console.log(require('crypto').randomBytes(32).toString('base64url'))")
NEXTAUTH_URL=http://127.0.0.1:$APP_PORT
APP_URL=http://127.0.0.1:$APP_PORT
STRIPE_SECRET_KEY=sk_test_combtrace_local
STRIPE_API_HOST=127.0.0.1
STRIPE_API_PORT=$FAKE_STRIPE_PORT
STRIPE_API_PROTOCOL=http
STRIPE_WEBHOOK_SECRET=whsec_combtrace_local
SMTP_PORT=$FAKE_SMTP_PORT
ENV
fi
set -a; . ./.env.local; set +a

bash lib/db/pg.sh start
npx tsx lib/db/migrate.ts up
npx tsx lib/db/migrate.ts seed

stop_pidfile() { [ -f "$1" ] && kill -- -"$(cat "$1")" 2>/dev/null || true; rm -f "$1"; }
stop_pidfile "$RUN/app.pid"; stop_pidfile "$RUN/fakes.pid"

echo "Building the app (about a minute)…"
NEXT_TELEMETRY_DISABLED=1 node node_modules/next/dist/bin/next build > "$RUN/build.log" 2>&1 || { tail -40 "$RUN/build.log"; exit 1; }

export STRIPE_WEBHOOK_URL=http://127.0.0.1:$APP_PORT/api/stripe/webhook
# Migrations and the seed above ran as the owner (postgres). The app connects as its own role,
# combtrace_app, which may read and write rows but not change the schema or the append-only
# records (lib/db/config.ts: APP_DATABASE_URL, else DATABASE_URL as given, else the local cluster).
APP_DB_ROLE=$(node node_modules/tsx/dist/cli.mjs -e "import('./lib/db/config.ts').then(({appDatabaseUrl})=>console.log(decodeURIComponent(new URL(appDatabaseUrl()).username)))")
setsid node node_modules/tsx/dist/cli.mjs fakes/run.ts > "$RUN/fakes.log" 2>&1 < /dev/null & echo $! > "$RUN/fakes.pid"
NODE_ENV=production setsid node node_modules/next/dist/bin/next start -H 127.0.0.1 -p "$APP_PORT" > "$RUN/app.log" 2>&1 < /dev/null & echo $! > "$RUN/app.pid"

for _ in $(seq 1 120); do
  curl -fsS "http://127.0.0.1:$APP_PORT/api/health" >/dev/null 2>&1 && break; sleep 0.5
done
curl -fsS "http://127.0.0.1:$APP_PORT/api/health" >/dev/null || { echo "The app did not start; see .run/app.log"; tail -20 "$RUN/app.log"; exit 1; }

cat <<TXT

Combtrace is running ($(( $(date +%s) - started )) s).
  Shop and back office  http://127.0.0.1:$APP_PORT        (back office at /admin)
  Fake Stripe           http://127.0.0.1:$FAKE_STRIPE_PORT   (sessions and webhook deliveries)
  Fake mail inbox       http://127.0.0.1:$FAKE_MAIL_WEB_PORT    (every e-mail the app sends)
  Database role         $APP_DB_ROLE (migrations and demo data: the owner)

Demo sign-ins (invented business: Hollowmere Apiaries):
TXT
node node_modules/tsx/dist/cli.mjs -e "import('./seeders/demo-accounts.ts').then(({DEMO_ACCOUNTS})=>{for(const a of DEMO_ACCOUNTS) console.log('  '+a.role.padEnd(9)+a.email.padEnd(28)+a.password)})"
echo
echo "Stop everything with: npm run down"
