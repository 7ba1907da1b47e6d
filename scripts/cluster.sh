#!/usr/bin/env bash
# npm run cluster: Scribeline past one machine, on loopback — a MariaDB primary and a GTID replica, Redis for
# the shared cache, two app servers behind nginx, the upload and mail services — with the demo data.
# Ctrl-C stops everything. `npm run test:cluster` (CLUSTER_TEST=1) starts the same shape and runs
# tests/cluster/cluster-checks.ts, which starts and kills the app servers itself. See README, "Past one machine".
set -euo pipefail
source "$(dirname "$0")/common.sh"
cd "$ROOT"

# Debian's nginx and redis-server start a service of their own when installed (nginx on :80, Redis on :6379);
# the cluster runs its own, so a service this run installed is stopped again. One that was there before is left alone.
FRESH=()
for pkg in nginx redis-server; do dpkg -s "$pkg" >/dev/null 2>&1 || FRESH+=("$pkg"); done
apt_install mariadb-server nginx redis-server curl
for svc in "${FRESH[@]}"; do as_root invoke-rc.d "$svc" stop >/dev/null 2>&1 || true; done
npm_install

# Ports (CLUSTER_* to move them): nginx, two app servers, primary, replica, Redis, uploads, mail.
export CLUSTER_NGINX_PORT="${CLUSTER_NGINX_PORT:-3380}"
export CLUSTER_APP_PORTS="${CLUSTER_APP_PORTS:-3371 3372}"
PRIMARY_PORT="${CLUSTER_PRIMARY_PORT:-3391}"
REPLICA_PORT="${CLUSTER_REPLICA_PORT:-3392}"
REDIS_PORT="${CLUSTER_REDIS_PORT:-3393}"
UPLOADS_PORT="${CLUSTER_UPLOADS_PORT:-3394}"
MAIL_SMTP="${CLUSTER_MAIL_SMTP_PORT:-3395}"
MAIL_HTTP="${CLUSTER_MAIL_HTTP_PORT:-3396}"
C="$DATA_DIR/cluster"
RUN="$C/run"
mkdir -p "$RUN" && rm -f "$RUN"/app-*.pid # left by a run that was killed outright
export CLUSTER_DIR="$C"

find_bin() { command -v "$1" 2>/dev/null || { [ -x "/usr/sbin/$1" ] && echo "/usr/sbin/$1"; } || echo "/usr/bin/$1"; }

PIDS=()
APP_PIDS=()
NGINX_PID=
CHECKS_PID=
BUILD_PID=
# alive PID: running (an exited child not yet waited for is not).
alive() { local st; st=$(ps -o stat= -p "$1" 2>/dev/null) && [[ $st != Z* ]]; }
# stop_pid PID [SECONDS]: SIGTERM, then SIGKILL if it is still running after SECONDS (default 20).
stop_pid() {
  local pid=$1 tries=$((${2:-20} * 4))
  kill -TERM "$pid" 2>/dev/null || return 0
  while alive "$pid" && [ $tries -gt 0 ]; do sleep 0.25; tries=$((tries - 1)); done
  alive "$pid" && kill -KILL "$pid" 2>/dev/null
  return 0
}
cleanup() {
  local status=$?
  trap - INT TERM EXIT
  echo; echo "› Stopping the cluster…"
  # The checks first: they stop the app servers they started.
  [ -n "$CHECKS_PID" ] && stop_pid "$CHECKS_PID" 30
  [ -n "$BUILD_PID" ] && stop_pid "$BUILD_PID" 10
  # App servers next (they finish requests in flight, the mail worker its message, and close their pools); the
  # pid files also name servers the checks started, should the checks have died without stopping them.
  local pids=("${APP_PIDS[@]}") stoppers=() pid
  for f in "$RUN"/app-*.pid; do
    [ -s "$f" ] || continue
    pid=$(cat "$f"); rm -f "$f"
    grep -qs 'next' "/proc/$pid/cmdline" && pids+=("$pid")
  done
  for pid in "${pids[@]}"; do stop_pid "$pid" 20 & stoppers+=($!); done
  [ ${#stoppers[@]} -gt 0 ] && wait "${stoppers[@]}" 2>/dev/null
  [ -n "$NGINX_PID" ] && kill -QUIT "$NGINX_PID" 2>/dev/null || true
  for pid in "${PIDS[@]}"; do kill "$pid" 2>/dev/null || true; done
  for name in replica primary; do
    [ -S "$RUN/$name.sock" ] && "$(find_bin mariadb-admin)" --no-defaults -S "$RUN/$name.sock" -uroot shutdown >/dev/null 2>&1 || true
  done
  wait 2>/dev/null || true
  exit "$status"
}
trap cleanup EXIT
trap 'exit 130' INT
trap 'exit 143' TERM

# ── MariaDB: a fresh primary (binary log, GTID) and a replica that follows it from its first transaction ──
start_mariadb() { # name port server-id extra-args...
  local name=$1 port=$2 id=$3; shift 3
  local dir="$C/$name"
  rm -rf "$dir"; mkdir -p "$dir" "$RUN"
  "$(find_bin mariadb-install-db)" --no-defaults --user="$(id -un)" --datadir="$dir" \
    --auth-root-authentication-method=socket --skip-test-db --skip-name-resolve >"$C/$name-init.log" 2>&1
  rm -f "$RUN/$name.sock"
  setsid "$(find_bin mariadbd)" --no-defaults --user="$(id -un)" --datadir="$dir" --socket="$RUN/$name.sock" \
    --pid-file="$RUN/$name.pid" --port="$port" --bind-address=127.0.0.1 --skip-name-resolve \
    --character-set-server=utf8mb4 --collation-server=utf8mb4_unicode_ci --server-id="$id" \
    --log-error="$C/$name.log" "$@" </dev/null >/dev/null 2>&1 &
  for _ in $(seq 1 120); do
    "$(find_bin mariadb-admin)" --no-defaults -S "$RUN/$name.sock" -uroot ping >/dev/null 2>&1 && return 0
    sleep 0.25
  done
  echo "MariaDB ($name) did not start; see $C/$name.log" >&2; tail -20 "$C/$name.log" >&2; return 1
}
sql() { "$(find_bin mariadb)" --no-defaults -S "$RUN/$1.sock" -uroot -e "$2"; }

echo "› MariaDB primary on :$PRIMARY_PORT and replica on :$REPLICA_PORT (data in $C)"
REPL_PASSWORD="$(node -e "process.stdout.write(require('crypto').randomBytes(18).toString('base64url'))")"
start_mariadb primary "$PRIMARY_PORT" 1 --log-bin=primary-bin --binlog-format=ROW --log-slave-updates
# read_only keeps every account without SUPER (the app's) from writing here; replication still applies.
start_mariadb replica "$REPLICA_PORT" 2 --read-only --relay-log=replica-relay --skip-log-bin
export DB_NAME=scribeline_cluster
# Created on the primary, so they reach the replica through replication like everything after them.
sql primary "CREATE USER 'replication'@'127.0.0.1' IDENTIFIED BY '$REPL_PASSWORD';
  GRANT REPLICATION SLAVE ON *.* TO 'replication'@'127.0.0.1';
  CREATE USER '$DB_USER'@'127.0.0.1' IDENTIFIED BY '$DB_PASSWORD';
  CREATE DATABASE \`$DB_NAME\` CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci;
  GRANT ALL PRIVILEGES ON \`$DB_NAME\`.* TO '$DB_USER'@'127.0.0.1';
  GRANT SLAVE MONITOR ON *.* TO '$DB_USER'@'127.0.0.1';"
sql replica "CHANGE MASTER TO MASTER_HOST='127.0.0.1', MASTER_PORT=$PRIMARY_PORT, MASTER_USER='replication',
  MASTER_PASSWORD='$REPL_PASSWORD', MASTER_USE_GTID=slave_pos, MASTER_CONNECT_RETRY=1; START SLAVE;"
export DB_HOST=127.0.0.1 DB_PORT="$PRIMARY_PORT" DB_REPLICAS="127.0.0.1:$REPLICA_PORT"
export CLUSTER_PRIMARY_SOCK="$RUN/primary.sock" CLUSTER_REPLICA_SOCK="$RUN/replica.sock" CLUSTER_REPLICA_PORT="$REPLICA_PORT"

# ── Redis: the shared cache. Nothing saved to disk; the oldest-read entries go first when it is full ──
echo "› Redis on :$REDIS_PORT"
mkdir -p "$C/redis"
"$(find_bin redis-server)" --port "$REDIS_PORT" --bind 127.0.0.1 --save '' --appendonly no --dir "$C/redis" \
  --maxmemory 256mb --maxmemory-policy allkeys-lru --logfile "$C/redis.log" --daemonize no &
PIDS+=($!)
wait_for_port "$REDIS_PORT"
export REDIS_URL="redis://127.0.0.1:$REDIS_PORT"

# ── The app's settings, the same on every server ──
export NODE_ENV=production
export NEXTAUTH_URL="http://127.0.0.1:$CLUSTER_NGINX_PORT"
export NEXTAUTH_SECRET="$(auth_secret)"
# Server actions' closures are encrypted with this key: every server must hold the same one.
[ -s "$DATA_DIR/actions-key" ] || node -e "process.stdout.write(require('crypto').randomBytes(32).toString('base64'))" >"$DATA_DIR/actions-key"
export NEXT_SERVER_ACTIONS_ENCRYPTION_KEY="$(cat "$DATA_DIR/actions-key")"
export TRUSTED_PROXIES=127.0.0.1
export NEXT_DIST_DIR="${CLUSTER_DIST_DIR:-.next-cluster}"

start_upload_service "$UPLOADS_PORT" "$CLUSTER_NGINX_PORT" "$C/uploads"
PIDS+=("$UPLOAD_PID")
rm -rf "$C/mail"
start_mail_service "$MAIL_SMTP" "$MAIL_HTTP" "$C/mail"
PIDS+=("$MAIL_PID")

echo "› Migrations and the demo data (on the primary)"
DB_REPLICAS= npx tsx db/migrate.ts up >/dev/null
DB_REPLICAS= npx tsx db/seeders/seed.ts >/dev/null

# CLUSTER_SOURCE=head builds and serves a copy of the last commit (.data/cluster-src), so edits being made in a
# shared working tree cannot break or mix into the build; by default the working tree itself, like npm start.
export CLUSTER_APP_DIR="$ROOT"
# npm run test:cluster defaults to the copy (like the benchmark and the soak run), unless it is told to reuse a
# build (CLUSTER_SKIP_BUILD=1 with CLUSTER_DIST_DIR, as CI does with npm test's): that one is in the working tree.
if [ "${CLUSTER_TEST:-0}" = 1 ] && [ "${CLUSTER_SKIP_BUILD:-0}" != 1 ]; then CLUSTER_SOURCE="${CLUSTER_SOURCE:-head}"; fi
if [ "${CLUSTER_SOURCE:-tree}" = head ]; then
  CLUSTER_APP_DIR="$DATA_DIR/cluster-src"
  # The servers need no tests (the checks run from the working tree), so the copy's build type-checks only the app.
  rm -rf "$CLUSTER_APP_DIR.new" && mkdir -p "$CLUSTER_APP_DIR.new" && git archive HEAD -- . ':(exclude)tests' | tar -x -C "$CLUSTER_APP_DIR.new"
  mkdir -p "$CLUSTER_APP_DIR"
  rsync -a --delete --exclude '/node_modules' --exclude '/.next*' "$CLUSTER_APP_DIR.new/" "$CLUSTER_APP_DIR/" && rm -rf "$CLUSTER_APP_DIR.new"
  if ! cmp -s node_modules/.package-lock.json "$CLUSTER_APP_DIR/node_modules/.package-lock.json"; then
    rm -rf "$CLUSTER_APP_DIR/node_modules" && cp -al node_modules "$CLUSTER_APP_DIR/node_modules" # Turbopack will not build through a symlink
  fi
  echo "› Serving commit $(git rev-parse --short HEAD) from $CLUSTER_APP_DIR"
fi
if [ "${CLUSTER_SKIP_BUILD:-0}" != 1 ] || [ ! -f "$CLUSTER_APP_DIR/$NEXT_DIST_DIR/BUILD_ID" ]; then
  echo "› Building the app into $NEXT_DIST_DIR (a few minutes; load average $(cut -d' ' -f1-3 /proc/loadavg))…"
  BUILD_START=$SECONDS
  # In the background, so a signal to this script is handled at once.
  (cd "$CLUSTER_APP_DIR" && exec node node_modules/next/dist/bin/next build) >"$C/build.log" 2>&1 &
  BUILD_PID=$!
  wait "$BUILD_PID" || { tail -40 "$C/build.log"; exit 1; }
  BUILD_PID=
  echo "› Built in $((SECONDS - BUILD_START)) s"
fi

# ── nginx: the balancer. Passive checks (max_fails) plus the active check below; a request is tried on the
# other server only when nothing was sent yet or it is idempotent (nginx never retries POST/PATCH by itself) ──
mkdir -p "$C/nginx/tmp"
write_upstream() { # the app ports that are ready
  {
    echo "upstream scribeline {"
    local any=0
    for port in $CLUSTER_APP_PORTS; do
      if [[ " $* " == *" $port "* ]]; then echo "  server 127.0.0.1:$port max_fails=2 fail_timeout=5s;"; any=1
      else echo "  server 127.0.0.1:$port down;"; fi
    done
    # nginx needs one server that is not down; with none ready, keep trying them all.
    [ $any = 1 ] || for port in $CLUSTER_APP_PORTS; do echo "  server 127.0.0.1:$port backup;"; done
    echo "  keepalive 32;"
    echo "}"
  } >"$C/nginx/upstream.conf.new"
  mv "$C/nginx/upstream.conf.new" "$C/nginx/upstream.conf"
}
cat >"$C/nginx/nginx.conf" <<EOF
daemon off;
worker_processes 1;
pid $C/nginx/nginx.pid;
error_log $C/nginx/error.log warn;
events { worker_connections 1024; }
http {
  # When each request ended, and the app servers it was tried on in turn (the checks read it).
  log_format upstream '\$msec \$request_method \$status \$upstream_addr';
  access_log $C/nginx/upstream.log upstream;
  client_body_temp_path $C/nginx/tmp/body;
  proxy_temp_path $C/nginx/tmp/proxy;
  fastcgi_temp_path $C/nginx/tmp/fastcgi;
  uwsgi_temp_path $C/nginx/tmp/uwsgi;
  scgi_temp_path $C/nginx/tmp/scgi;
  client_max_body_size 2m;
  include $C/nginx/upstream.conf;
  server {
    listen 127.0.0.1:$CLUSTER_NGINX_PORT;
    location / {
      proxy_pass http://scribeline;
      proxy_http_version 1.1;
      proxy_set_header Connection "";
      proxy_set_header Host \$http_host;
      proxy_set_header X-Forwarded-For \$proxy_add_x_forwarded_for;
      proxy_set_header X-Forwarded-Proto \$scheme;
      proxy_connect_timeout 2s;
      proxy_read_timeout 60s;
      # Another server gets the request when this one refused the connection, timed out or answered 502-504;
      # nginx does this only for idempotent methods unless told otherwise (it is not told).
      proxy_next_upstream error timeout http_502 http_503 http_504;
      proxy_next_upstream_tries 2;
    }
  }
}
EOF
write_upstream $CLUSTER_APP_PORTS

start_app() { # port
  (cd "$CLUSTER_APP_DIR" && exec node node_modules/next/dist/bin/next start -H 127.0.0.1 -p "$1") >"$C/app-$1.log" 2>&1 &
  APP_PIDS+=($!)
  echo $! >"$RUN/app-$1.pid"
}

# The active health check: every 2 s each server's readiness (/api/health); a server that is not ready
# (stopping, or without its database) is marked down in nginx until it answers 200 again.
health_loop() {
  local last=""
  while sleep 2; do
    local ready=()
    for port in $CLUSTER_APP_PORTS; do
      curl -fsS -m 2 -o /dev/null "http://127.0.0.1:$port/api/health" 2>/dev/null && ready+=("$port")
    done
    if [ "${ready[*]}" != "$last" ]; then
      write_upstream "${ready[@]}"
      kill -HUP "$(cat "$C/nginx/nginx.pid")" 2>/dev/null || true
      echo "[balancer] ready: ${ready[*]:-none}" >>"$C/balancer.log"
      last="${ready[*]}"
    fi
  done
}

if [ "${CLUSTER_TEST:-0}" = 1 ]; then
  "$(find_bin nginx)" -c "$C/nginx/nginx.conf" -p "$C/nginx" >"$C/nginx/stdout.log" 2>&1 &
  NGINX_PID=$!
  PIDS+=("$NGINX_PID")
  health_loop &
  PIDS+=($!)
  echo "› Cluster checks (tests/cluster/cluster-checks.ts; load average $(cut -d' ' -f1-3 /proc/loadavg))"
  CHECKS_START=$SECONDS
  set +e
  # In the background, so a signal to this script is handled at once (cleanup stops the checks and their servers).
  node node_modules/tsx/dist/cli.mjs tests/cluster/cluster-checks.ts &
  CHECKS_PID=$!
  wait "$CHECKS_PID"
  STATUS=$?
  CHECKS_PID=
  echo "› Checks took $((SECONDS - CHECKS_START)) s (load average $(cut -d' ' -f1-3 /proc/loadavg)); $SECONDS s in all"
  exit $STATUS
fi

for port in $CLUSTER_APP_PORTS; do start_app "$port"; done
"$(find_bin nginx)" -c "$C/nginx/nginx.conf" -p "$C/nginx" >"$C/nginx/stdout.log" 2>&1 &
NGINX_PID=$!
PIDS+=("$NGINX_PID")
for port in $CLUSTER_APP_PORTS; do wait_for_http "http://127.0.0.1:$port/api/health" || { tail -30 "$C/app-$port.log"; exit 1; }; done
health_loop &
PIDS+=($!)
wait_for_http "http://127.0.0.1:$CLUSTER_NGINX_PORT/api/health"

echo
echo "Scribeline (two app servers behind nginx) is running at http://127.0.0.1:$CLUSTER_NGINX_PORT"
echo "  app servers :${CLUSTER_APP_PORTS// /, :} · MariaDB primary :$PRIMARY_PORT, replica :$REPLICA_PORT · Redis :$REDIS_PORT · uploads :$UPLOADS_PORT · mail :$MAIL_SMTP (read it at /dev/mailbox as the admin)"
echo "  logs and data in $C"
DB_REPLICAS= npx tsx db/seeders/seed.ts --print | tail -n +2
echo
echo "Press Ctrl-C to stop everything."
wait "${APP_PIDS[@]}"
