#!/usr/bin/env bash
# npm run bench:archive: memory of the project archive against its size. Seeds two projects (1x and
# ARCHIVE_BENCH_SCALE x, default 4) into their own database with media through the local upload service, then
# streams each one's archive in a fresh process and prints the archive's size beside its peak RSS and heap.
# ARCHIVE_BENCH_DB (default archive_bench) and ARCHIVE_BENCH_UPLOADS_PORT change where it runs; the data is kept
# between runs (a second run only measures).
set -uo pipefail
source "$(dirname "$0")/../../scripts/common.sh"
cd "$ROOT"

BENCH_DB="${ARCHIVE_BENCH_DB:-archive_bench}"
case "$BENCH_DB" in
  *_bench) ;;
  *) echo "ARCHIVE_BENCH_DB must end in _bench" >&2; exit 2 ;;
esac

set -e
apt_install mariadb-server curl
npm_install
set +e

stop_on_exit
export DB_DATABASES="scribeline scribeline_test $BENCH_DB"
start_database || exit 1
mariadb --no-defaults -S "${SCRIBELINE_DATA_DIR:-$DATA_DIR}/run/mariadb.sock" -uroot -e \
  "CREATE DATABASE IF NOT EXISTS \`$BENCH_DB\` CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci; GRANT ALL PRIVILEGES ON \`$BENCH_DB\`.* TO '$DB_USER'@'127.0.0.1';" || exit 1
export DB_NAME="$BENCH_DB"
export NEXTAUTH_SECRET="bench-secret-$(auth_secret)"
# No app runs: the upload service's callback address is never called by server-side uploads.
start_upload_service "${ARCHIVE_BENCH_UPLOADS_PORT:-3438}" 3439 "$DATA_DIR/uploads-$BENCH_DB" || exit 1
track_pid "$UPLOAD_PID"

echo "› Migrating and seeding $BENCH_DB"
npx tsx db/migrate.ts up >/dev/null || exit 1
RUN=(node --expose-gc --conditions=react-server --import tsx tests/bench/archive.bench.ts)
IDS=$("${RUN[@]}" seed) || exit 1

echo "› Streaming each archive in a fresh process (MB)"
printf 'project\tsessions\tmedia\tarchive\tseconds\trss before\trss peak\trss growth\theap before\theap peak\theap growth\tkept after gc\tkept growth\n'
for id in $IDS; do
  "${RUN[@]}" measure "$id" || exit 1
done
