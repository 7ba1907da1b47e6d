#!/usr/bin/env bash
# npm start: set everything up on a fresh machine and serve Scribeline with its demo data on :3000.
set -euo pipefail
source "$(dirname "$0")/common.sh"
cd "$ROOT"

apt_install mariadb-server curl
npm_install

PIDS=()
APP_PID=
cleanup() {
  trap - INT TERM EXIT
  echo; echo "› Stopping…"
  # The app first, and wait for it: it finishes the requests in flight, lets the mail worker finish its
  # message and closes its database connections (lib/server/lifecycle.ts); then the services it used.
  if [ -n "$APP_PID" ]; then kill -TERM "$APP_PID" 2>/dev/null || true; wait "$APP_PID" 2>/dev/null || true; fi
  for pid in "${PIDS[@]}"; do kill "$pid" 2>/dev/null || true; done
  wait 2>/dev/null || true
  bash db/mariadb.sh stop || true
}
trap cleanup INT TERM EXIT

bash db/mariadb.sh start
export DB_NAME=scribeline
export NODE_ENV=production
export PORT="${PORT:-3000}"
export NEXTAUTH_URL="http://127.0.0.1:$PORT"
export NEXTAUTH_SECRET="$(auth_secret)"

start_upload_service "${UPLOADS_PORT:-3100}" "$PORT" "$DATA_DIR/uploads"
PIDS+=("$UPLOAD_PID")
start_mail_service "${MAIL_SMTP_PORT:-2525}" "${MAIL_HTTP_PORT:-2580}" "$DATA_DIR/mail"
PIDS+=("$MAIL_PID")

npx tsx db/migrate.ts up
npx tsx db/seeders/seed.ts >/dev/null
echo "› Building the app (about a minute)…"
node node_modules/next/dist/bin/next build >"$DATA_DIR/build.log" 2>&1 || { tail -40 "$DATA_DIR/build.log"; exit 1; }

node node_modules/next/dist/bin/next start -H 127.0.0.1 -p "$PORT" &
APP_PID=$!
wait_for_http "http://127.0.0.1:$PORT/api/health"

echo
echo "Scribeline is running at http://127.0.0.1:$PORT"
echo "E-mail it sends is caught locally: http://127.0.0.1:$PORT/dev/mailbox (switched on for this demo by SCRIBELINE_DEV_MAILBOX=1; sign in as the admin to read it)"
npx tsx db/seeders/seed.ts --print | tail -n +2
echo
echo "Press Ctrl-C to stop everything."
wait "$APP_PID"
