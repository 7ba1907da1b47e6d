# Shared by start.sh and test.sh: installs what is missing, from Debian's and npm's registries only.
ROOT=$(cd "$(dirname "${BASH_SOURCE[0]}")/.." && pwd)
DATA_DIR="$ROOT/.data"
mkdir -p "$DATA_DIR"

as_root() { if [ "$(id -u)" = 0 ]; then "$@"; else sudo "$@"; fi; }

apt_install() {
  local missing=()
  for pkg in "$@"; do dpkg -s "$pkg" >/dev/null 2>&1 || missing+=("$pkg"); done
  [ ${#missing[@]} -eq 0 ] && return 0
  echo "› Installing ${missing[*]} from Debian's packages…"
  as_root env DEBIAN_FRONTEND=noninteractive apt-get update -qq
  as_root env DEBIAN_FRONTEND=noninteractive apt-get install -y -qq "${missing[@]}" >/dev/null
}

npm_install() {
  # Reinstall when node_modules is missing or older than the lock file.
  if [ ! -d "$ROOT/node_modules/.bin" ] || [ "$ROOT/package-lock.json" -nt "$ROOT/node_modules/.package-lock.json" ]; then
    echo "› Installing npm dependencies…"
    (cd "$ROOT" && npm ci --no-audit --no-fund --loglevel=error)
  fi
}

auth_secret() {
  local f="$DATA_DIR/auth-secret"
  [ -s "$f" ] || node -e "process.stdout.write(require('crypto').randomBytes(32).toString('base64url'))" >"$f"
  cat "$f"
}

wait_for_http() {
  local url=$1 tries=${2:-120}
  for _ in $(seq 1 "$tries"); do
    if curl -fsS -o /dev/null "$url" 2>/dev/null; then return 0; fi
    sleep 0.5
  done
  echo "Timed out waiting for $url" >&2
  return 1
}

export NEXT_TELEMETRY_DISABLED=1
export DB_HOST=127.0.0.1
export DB_PORT="${DB_PORT:-3406}"
export DB_USER="${DB_USER:-scribeline}"
export DB_PASSWORD="${DB_PASSWORD:-scribeline-local}"

# The local upload service: the app's upload SDK is pointed at it by these settings alone.
# Its key signs upload callbacks and private-file URLs, so it is generated once per data folder (like the
# auth secret) and never published; a hosted service would get its real token here.
upload_token() {
  local f="$DATA_DIR/upload-token"
  [ -s "$f" ] || node -e "const c=require('crypto');process.stdout.write(Buffer.from(JSON.stringify({apiKey:'sk_'+c.randomBytes(32).toString('base64url'),appId:'scribeline-'+c.randomBytes(6).toString('hex'),regions:['local']})).toString('base64'))" >"$f"
  chmod 600 "$f"
  cat "$f"
}
export UPLOADTHING_TOKEN="${UPLOADTHING_TOKEN:-$(upload_token)}"

# start_upload_service PORT APP_PORT DIR: starts uploads-fake in the background and exports the SDK's settings.
start_upload_service() {
  local port=$1 app_port=$2 dir=$3
  export UPLOADTHING_INGEST_URL="http://127.0.0.1:$port"
  export UPLOADTHING_API_URL="http://127.0.0.1:$port"
  export UPLOADTHING_CALLBACK_URL="http://127.0.0.1:$app_port/api/uploadthing"
  # Signed read URLs for private files (UTApi.generateSignedURL) point at the local service: the SDK
  # uses http for a host containing "local", and puts the app id in the path.
  export UPLOADTHING_UFS_HOST="localhost:$port"
  export UPLOADTHING_UFS_APP_ID_LOCATION=path
  # The pages' Content-Security-Policy lets photos and clips load from there (read when the app is built).
  export UPLOADS_FILE_ORIGINS="http://localhost:$port"
  export UPLOADTHING_IS_DEV=false
  export UPLOADTHING_LOG_LEVEL=Error
  UPLOADS_FAKE_PORT=$port UPLOADS_FAKE_DIR="$dir" node "$ROOT/node_modules/tsx/dist/cli.mjs" "$ROOT/uploads-fake/server.ts" >"$DATA_DIR/uploads-$port.log" 2>&1 &
  UPLOAD_PID=$!
  wait_for_port "$port" || { tail -20 "$DATA_DIR/uploads-$port.log"; return 1; }
}

# start_mail_service SMTP_PORT HTTP_PORT DIR: starts the local mail service (scripts/mail-service) in the
# background and points the app's mail settings at it. It catches every message; nothing is relayed.
start_mail_service() {
  local smtp_port=$1 http_port=$2 dir=$3
  export SMTP_HOST=127.0.0.1
  export SMTP_PORT="$smtp_port"
  export SMTP_SECURE=false
  export MAIL_FROM="Scribeline <no-reply@scribeline.test>"
  export MAILBOX_URL="http://127.0.0.1:$http_port"
  # The dev mailbox (/dev/mailbox, admins only) is switched on for npm start and npm test; elsewhere it is a 404.
  export SCRIBELINE_DEV_MAILBOX=1
  MAIL_SMTP_PORT=$smtp_port MAIL_HTTP_PORT=$http_port MAIL_DIR="$dir" node "$ROOT/node_modules/tsx/dist/cli.mjs" "$ROOT/scripts/mail-service/server.ts" >"$DATA_DIR/mail-$smtp_port.log" 2>&1 &
  MAIL_PID=$!
  { wait_for_port "$smtp_port" && wait_for_port "$http_port"; } || { tail -20 "$DATA_DIR/mail-$smtp_port.log"; return 1; }
}

wait_for_port() {
  local port=$1
  for _ in $(seq 1 60); do
    if (exec 3<>"/dev/tcp/127.0.0.1/$port") 2>/dev/null; then return 0; fi
    sleep 0.25
  done
  echo "Nothing answered on port $port" >&2
  return 1
}

# ---- what a run starts, and stops again when it ends (scripts/test.sh, tests/bench/pages.sh) ----------
STARTED_PIDS=()
STARTED_DB=0

# track_pid PID: stopped by stop_started when the script ends.
track_pid() { STARTED_PIDS+=("$1"); }

# stop_started: stops every tracked process, and MariaDB if this run started it.
stop_started() {
  for pid in "${STARTED_PIDS[@]}"; do kill "$pid" 2>/dev/null || true; done
  wait 2>/dev/null || true
  if [ "$STARTED_DB" = 1 ]; then bash "$ROOT/db/mariadb.sh" stop >/dev/null || true; fi
}

# stop_on_exit: runs stop_started however the script ends (Ctrl-C included).
stop_on_exit() {
  trap stop_started EXIT
  trap 'exit 130' INT TERM
}

# start_database: starts MariaDB unless it is running (DB_DATABASES names the databases it creates),
# remembering whether this run started it.
start_database() {
  bash "$ROOT/db/mariadb.sh" status >/dev/null 2>&1 || STARTED_DB=1
  bash "$ROOT/db/mariadb.sh" start
}

# start_local_services APP_PORT UPLOADS_PORT SMTP_PORT MAIL_HTTP_PORT NAME: the upload service (files kept in
# .data/uploads-NAME) and the mail service (.data/mail-NAME, emptied first), both tracked.
start_local_services() {
  local app_port=$1 uploads_port=$2 smtp_port=$3 http_port=$4 name=$5
  start_upload_service "$uploads_port" "$app_port" "$DATA_DIR/uploads-$name" || return 1
  track_pid "$UPLOAD_PID"
  rm -rf "$DATA_DIR/mail-$name"
  start_mail_service "$smtp_port" "$http_port" "$DATA_DIR/mail-$name" || return 1
  track_pid "$MAIL_PID"
}

# migrate_and_seed: brings DB_NAME's schema up to date and loads the demo data.
migrate_and_seed() {
  (cd "$ROOT" && npx tsx db/migrate.ts up >/dev/null && npx tsx db/seeders/seed.ts)
}

# serve_app PORT LOG [DIR]: a built app (NEXT_DIST_DIR) served from DIR (default the checkout) on 127.0.0.1:PORT
# in the background, tracked; returns once it answers /api/health (the log's tail when it never does).
serve_app() {
  local port=$1 log=$2 dir=${3:-$ROOT}
  (cd "$dir" && NODE_ENV=production exec node node_modules/next/dist/bin/next start -H 127.0.0.1 -p "$port") >"$log" 2>&1 &
  track_pid $!
  wait_for_http "http://127.0.0.1:$port/api/health" || { tail -40 "$log"; return 1; }
}
