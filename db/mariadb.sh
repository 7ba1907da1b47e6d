#!/usr/bin/env bash
# Scribeline's own MariaDB: installed from Debian's packages if missing, data kept in .data/mariadb,
# listening on 127.0.0.1 only, at a port of its own. Usage: db/mariadb.sh install|start|stop|status
set -euo pipefail

ROOT=$(cd "$(dirname "$0")/.." && pwd)
DATA_ROOT="${SCRIBELINE_DATA_DIR:-$ROOT/.data}"
DB_DIR="$DATA_ROOT/mariadb"
RUN_DIR="$DATA_ROOT/run"
SOCK="$RUN_DIR/mariadb.sock"
PID_FILE="$RUN_DIR/mariadb.pid"
LOG_FILE="$DATA_ROOT/mariadb.log"
PORT="${DB_PORT:-3406}"
DB_USER="${DB_USER:-scribeline}"
DB_PASSWORD="${DB_PASSWORD:-scribeline-local}"
DATABASES="${DB_DATABASES:-scribeline scribeline_test}"

find_bin() { command -v "$1" 2>/dev/null || { [ -x "/usr/sbin/$1" ] && echo "/usr/sbin/$1"; } || { [ -x "/usr/bin/$1" ] && echo "/usr/bin/$1"; } || true; }

as_root() { if [ "$(id -u)" = 0 ]; then "$@"; else sudo "$@"; fi; }

install() {
  if [ -n "$(find_bin mariadbd)" ]; then return 0; fi
  echo "MariaDB is not installed: installing mariadb-server from Debian's packages (about a minute)…"
  as_root env DEBIAN_FRONTEND=noninteractive apt-get update -qq
  as_root env DEBIAN_FRONTEND=noninteractive apt-get install -y -qq mariadb-server >/dev/null
}

admin() { "$(find_bin mariadb-admin)" --no-defaults -S "$SOCK" -uroot "$@"; }
client() { "$(find_bin mariadb)" --no-defaults -S "$SOCK" -uroot "$@"; }
running() { [ -S "$SOCK" ] && admin ping >/dev/null 2>&1; }

start() {
  install
  mkdir -p "$RUN_DIR"
  if running; then echo "MariaDB already running on 127.0.0.1:$PORT"; return 0; fi
  if [ ! -d "$DB_DIR/mysql" ]; then
    mkdir -p "$DB_DIR"
    "$(find_bin mariadb-install-db)" --no-defaults --user="$(id -un)" --datadir="$DB_DIR" \
      --auth-root-authentication-method=socket --skip-test-db --skip-name-resolve >"$DATA_ROOT/mariadb-init.log" 2>&1
  fi
  rm -f "$SOCK"
  # setsid: the server must not die with the terminal's Ctrl-C before we shut it down cleanly.
  setsid "$(find_bin mariadbd)" --no-defaults --user="$(id -un)" --datadir="$DB_DIR" --socket="$SOCK" \
    --pid-file="$PID_FILE" --port="$PORT" --bind-address=127.0.0.1 --skip-name-resolve --skip-log-bin \
    --character-set-server=utf8mb4 --collation-server=utf8mb4_unicode_ci \
    --log-error="$LOG_FILE" </dev/null >/dev/null 2>&1 &
  for _ in $(seq 1 120); do
    if running; then break; fi
    sleep 0.25
  done
  if ! running; then echo "MariaDB did not start; see $LOG_FILE" >&2; tail -20 "$LOG_FILE" >&2 || true; exit 1; fi
  local sql="CREATE USER IF NOT EXISTS '$DB_USER'@'127.0.0.1' IDENTIFIED BY '$DB_PASSWORD';"
  for db in $DATABASES; do
    sql+="CREATE DATABASE IF NOT EXISTS \`$db\` CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci;"
    sql+="GRANT ALL PRIVILEGES ON \`$db\`.* TO '$DB_USER'@'127.0.0.1';"
  done
  client -e "$sql FLUSH PRIVILEGES;"
  echo "MariaDB running on 127.0.0.1:$PORT (data in $DB_DIR)"
}

stop() {
  if running; then
    admin shutdown >/dev/null 2>&1 || true
    for _ in $(seq 1 80); do [ -S "$SOCK" ] || break; sleep 0.25; done
    echo "MariaDB stopped"
  fi
}

# Drops and recreates one database (the test database), keeping the grants.
reset() {
  local db=$1
  case " $DATABASES " in *" $db "*) ;; *) echo "refusing to reset unknown database $db" >&2; exit 2 ;; esac
  client -e "DROP DATABASE IF EXISTS \`$db\`; CREATE DATABASE \`$db\` CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci; GRANT ALL PRIVILEGES ON \`$db\`.* TO '$DB_USER'@'127.0.0.1';"
}

case "${1:-}" in
  install) install ;;
  start) start ;;
  stop) stop ;;
  reset) reset "${2:?database name}" ;;
  status) if running; then echo "running on 127.0.0.1:$PORT"; else echo "stopped"; exit 1; fi ;;
  *) echo "usage: $0 install|start|stop|status|reset DB" >&2; exit 2 ;;
esac
