#!/usr/bin/env bash
# npm run bench:pages: the reading benchmark. Seeds the scale data set into its own database, builds and
# serves the app, measures (tests/bench/pages.bench.ts), stops everything it started, writes .data/bench-pages.json.
# BENCH_DB, BENCH_PORT, BENCH_UPLOADS_PORT, BENCH_SMTP_PORT, BENCH_MAIL_HTTP_PORT, BENCH_DIST_DIR change where it runs;
# BENCH_DURATION (seconds per page, default 8), BENCH_WARMUP (seconds of load on each page before it is measured, default 3); BENCH_SKIP_BUILD=1 reuses an earlier build in BENCH_DIST_DIR;
# BENCH_SOURCE=tree measures the working tree with its uncommitted changes instead of the last commit.
set -uo pipefail
source "$(dirname "$0")/../../scripts/common.sh"
cd "$ROOT"

BENCH_DB="${BENCH_DB:-scribeline_bench}"
case "$BENCH_DB" in
  scribeline | scribeline_test | *_test) echo "Refusing to benchmark against $BENCH_DB: the benchmark has its own database." >&2; exit 2 ;;
  *_bench) ;;
  *) echo "BENCH_DB must end in _bench" >&2; exit 2 ;;
esac
APP_PORT="${BENCH_PORT:-3408}"
DIST="${BENCH_DIST_DIR:-.next-bench}"

set -e
apt_install mariadb-server chromium curl rsync
npm_install
set +e

stop_on_exit

export DB_DATABASES="scribeline scribeline_test $BENCH_DB"
start_database || exit 1
# mariadb.sh creates databases only when it starts the server: make sure ours exists (its data is kept between runs).
mariadb --no-defaults -S "${SCRIBELINE_DATA_DIR:-$DATA_DIR}/run/mariadb.sock" -uroot -e \
  "CREATE DATABASE IF NOT EXISTS \`$BENCH_DB\` CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci; GRANT ALL PRIVILEGES ON \`$BENCH_DB\`.* TO '$DB_USER'@'127.0.0.1';" || exit 1

export DB_NAME="$BENCH_DB"
export NEXTAUTH_SECRET="bench-secret-$(auth_secret)"
export NEXTAUTH_URL="http://127.0.0.1:$APP_PORT"
# The clip's file stays in this folder as long as the database keeps its row: both are kept between runs.
start_local_services "$APP_PORT" "${BENCH_UPLOADS_PORT:-3418}" "${BENCH_SMTP_PORT:-2548}" "${BENCH_MAIL_HTTP_PORT:-2558}" "$BENCH_DB" || exit 1

echo "› Migrating and seeding $BENCH_DB"
migrate_and_seed || exit 1
npx tsx tests/bench/scale-seed.ts || exit 1

# The app is built and served from a copy in .data/bench-src: by default of the last commit (BENCH_SOURCE=head), or
# with BENCH_SOURCE=tree of the working tree, uncommitted changes included. Either way edits made during the build
# cannot mix into it, other build folders' generated types are not type-checked with it, and the working tree's
# tsconfig.json is left alone (the copy gets the committed one).
SRC="$DATA_DIR/bench-src"
mkdir -p "$SRC"
# BENCH_SKIP_BUILD=1 with a build there: the copy is left as it was built (its source would not match the build).
REUSE=0
[ "${BENCH_SKIP_BUILD:-0}" = 1 ] && [ -f "$SRC/$DIST/BUILD_ID" ] && REUSE=1
if [ "$REUSE" = 1 ]; then
  echo "› Benchmarking the last build, $(cat "$SRC/.bench-source" 2>/dev/null || echo 'source not recorded') (copy left as it was built)"
elif [ "${BENCH_SOURCE:-head}" = tree ]; then
  rsync -a --delete --exclude '/.git' --exclude '/node_modules' --exclude '/.data' --exclude '/.next*' --exclude '/test-results*' ./ "$SRC/" || exit 1
else
  EXPORT="$DATA_DIR/bench-export"
  rm -rf "$EXPORT" && mkdir -p "$EXPORT" && git archive HEAD | tar -x -C "$EXPORT" || exit 1
  rsync -a --delete --exclude '/node_modules' --exclude '/.next*' "$EXPORT/" "$SRC/" || exit 1
  rm -rf "$EXPORT"
  echo "› Benchmarking commit $(git rev-parse --short HEAD)"
fi
if [ "$REUSE" = 0 ]; then
  if [ "${BENCH_SOURCE:-head}" = tree ]; then echo "working tree on $(git rev-parse --short HEAD)"; else echo "commit $(git rev-parse --short HEAD)"; fi >"$SRC/.bench-source"
  git show HEAD:tsconfig.json >"$SRC/tsconfig.json" 2>/dev/null || true
fi
if ! cmp -s node_modules/.package-lock.json "$SRC/node_modules/.package-lock.json"; then
  rm -rf "$SRC/node_modules" && cp -al node_modules "$SRC/node_modules" || exit 1 # hard links: Turbopack will not build through a symlink
fi
export NEXT_DIST_DIR="$DIST"
if [ "$REUSE" = 1 ]; then
  echo "› Reusing the build in $SRC/$DIST"
else
  echo "› Building the app into $SRC/$DIST (log: .data/build-$BENCH_DB.log)"
  (cd "$SRC" && NODE_ENV=production node node_modules/next/dist/bin/next build) >"$DATA_DIR/build-$BENCH_DB.log" 2>&1 || { tail -60 "$DATA_DIR/build-$BENCH_DB.log"; exit 1; }
fi

SQL_LOG="$DATA_DIR/bench-sql.log"
: >"$SQL_LOG"
# The static file the pages are measured against is the heavy entry's own HTML, served as a file from the build's
# static folder: the same bytes, so the ratio shows what the page costs beyond sending them. Next lists that folder
# when it starts, so a first server renders the page for the copy and a second one serves both (it keeps no page
# between runs, so the benchmark's first request still renders the entry).
ENTRY_COPY="$SRC/$DIST/static/bench/entry-copy.html"
ENTRY_PATH=$(node -p 'const m = require("./.data/bench-scale.json"); `/logs/${m.projectSlug}/entries/${m.entryId}`') || exit 1
echo "› Copying the heavy entry's HTML ($ENTRY_PATH) to serve it as a static file"
MAIL_WORKER=off serve_app "$APP_PORT" "$DATA_DIR/bench-server.log" "$SRC" || exit 1
mkdir -p "$(dirname "$ENTRY_COPY")"
curl -sf "http://127.0.0.1:$APP_PORT$ENTRY_PATH" -o "$ENTRY_COPY" || { echo "Could not read $ENTRY_PATH" >&2; exit 1; }
COPY_SERVER=${STARTED_PIDS[-1]}
kill "$COPY_SERVER" && wait "$COPY_SERVER" 2>/dev/null

echo "› Serving on 127.0.0.1:$APP_PORT (SQL log, mail worker off)"
SCRIBELINE_SQL_LOG="$SQL_LOG" MAIL_WORKER=off serve_app "$APP_PORT" "$DATA_DIR/bench-server.log" "$SRC" || exit 1

echo "› Measuring"
BENCH_BASE_URL="http://127.0.0.1:$APP_PORT" BENCH_SQL_LOG="$SQL_LOG" BENCH_DIST_DIR="$SRC/$DIST" BENCH_OUT="$DATA_DIR/bench-pages.json" BENCH_STATIC_PATH=/_next/static/bench/entry-copy.html \
  npx tsx tests/bench/pages.bench.ts
