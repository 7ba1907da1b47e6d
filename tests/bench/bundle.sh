#!/usr/bin/env bash
# npm run bench:bundle: first-load JS of every public page, their layout shift on a phone profile and the
# note-to-seek time of the demo's clip (tests/bench/bundle.bench.ts), on the demo data in a database of its
# own: builds once, serves, measures, stops everything it started, writes .data/bench-bundle.json.
# BUNDLE_DB (must end in _bench), BUNDLE_PORT, BUNDLE_UPLOADS_PORT, BUNDLE_SMTP_PORT, BUNDLE_MAIL_HTTP_PORT and
# BUNDLE_DIST_DIR change where it runs; BUNDLE_SKIP_BUILD=1 reuses the last build; BENCH_SOURCE=tree measures the
# working tree with its uncommitted changes instead of the last commit; BUNDLE_TYPECHECK=0 leaves type checking
# out of the build (run tsc on its own); BUNDLE_PHONE=0 measures first-load JS only; BUNDLE_DETAIL=1 lists scripts.
set -uo pipefail
source "$(dirname "$0")/../../scripts/common.sh"
cd "$ROOT"

BUNDLE_DB="${BUNDLE_DB:-scribeline_bundle_bench}"
case "$BUNDLE_DB" in
  *_bench) ;;
  *) echo "BUNDLE_DB must end in _bench: it is emptied and seeded with the demo on every run" >&2; exit 2 ;;
esac
APP_PORT="${BUNDLE_PORT:-3409}"
DIST="${BUNDLE_DIST_DIR:-.next-bundle}"

set -e
apt_install mariadb-server chromium curl rsync
npm_install
set +e

stop_on_exit

export DB_DATABASES="scribeline scribeline_test $BUNDLE_DB"
start_database || exit 1
bash db/mariadb.sh reset "$BUNDLE_DB" || exit 1

export DB_NAME="$BUNDLE_DB"
export NEXTAUTH_SECRET="bench-secret-$(auth_secret)"
export NEXTAUTH_URL="http://127.0.0.1:$APP_PORT"
rm -rf "$DATA_DIR/uploads-$BUNDLE_DB"
start_local_services "$APP_PORT" "${BUNDLE_UPLOADS_PORT:-3419}" "${BUNDLE_SMTP_PORT:-2549}" "${BUNDLE_MAIL_HTTP_PORT:-2559}" "$BUNDLE_DB" || exit 1

echo "› Migrating and seeding $BUNDLE_DB with the demo"
migrate_and_seed >/dev/null || exit 1

# Built and served from a copy (as npm run bench:pages does): the last commit, or with BENCH_SOURCE=tree the
# working tree; the committed tsconfig.json, so other build folders' generated types stay out.
SRC="$DATA_DIR/bundle-src"
mkdir -p "$SRC"
if [ "${BENCH_SOURCE:-head}" = tree ]; then
  rsync -a --delete --exclude '/.git' --exclude '/node_modules' --exclude '/.data' --exclude '/.next*' --exclude '/test-results*' ./ "$SRC/" || exit 1
else
  EXPORT="$DATA_DIR/bundle-export"
  rm -rf "$EXPORT" && mkdir -p "$EXPORT" && git archive HEAD | tar -x -C "$EXPORT" || exit 1
  rsync -a --delete --exclude '/node_modules' --exclude '/.next*' "$EXPORT/" "$SRC/" || exit 1
  rm -rf "$EXPORT"
  echo "› Measuring commit $(git rev-parse --short HEAD)"
fi
git show HEAD:tsconfig.json >"$SRC/tsconfig.json" 2>/dev/null || true
if [ "${BUNDLE_TYPECHECK:-1}" = 0 ]; then
  mv "$SRC/next.config.mjs" "$SRC/next.config.base.mjs"
  printf "import base from './next.config.base.mjs';\nexport default { ...base, typescript: { ignoreBuildErrors: true } };\n" >"$SRC/next.config.mjs"
fi
if ! cmp -s node_modules/.package-lock.json "$SRC/node_modules/.package-lock.json"; then
  rm -rf "$SRC/node_modules" && cp -al node_modules "$SRC/node_modules" || exit 1 # hard links: Turbopack will not build through a symlink
fi
export NEXT_DIST_DIR="$DIST"
if [ "${BUNDLE_SKIP_BUILD:-0}" = 1 ] && [ -f "$SRC/$DIST/BUILD_ID" ]; then
  echo "› Reusing the build in $SRC/$DIST"
else
  echo "› Building the app into $SRC/$DIST (log: .data/build-$BUNDLE_DB.log)"
  (cd "$SRC" && NODE_ENV=production node node_modules/next/dist/bin/next build) >"$DATA_DIR/build-$BUNDLE_DB.log" 2>&1 || { tail -60 "$DATA_DIR/build-$BUNDLE_DB.log"; exit 1; }
fi

echo "› Serving on 127.0.0.1:$APP_PORT (mail worker off)"
MAIL_WORKER=off serve_app "$APP_PORT" "$DATA_DIR/bundle-server.log" "$SRC" || exit 1

echo "› Measuring"
BENCH_BASE_URL="http://127.0.0.1:$APP_PORT" BENCH_OUT="$DATA_DIR/bench-bundle.json" npx tsx tests/bench/bundle.bench.ts
