#!/usr/bin/env bash
# npm run soak: builds the app (SOAK_DIST_DIR, default .next-soak; SOAK_SKIP_BUILD=1 reuses it) and runs tests/bench/soak.ts
# against a stack of its own (MariaDB in .data/soak on port 3516, services and app on 3517–3520; SOAK_DB_PORT,
# SOAK_APP_PORT, SOAK_UPLOADS_PORT, SOAK_SMTP_PORT, SOAK_MAIL_HTTP_PORT move them).
# Like bench:pages it builds and runs a copy in .data/soak-src of the last commit (SOAK_SOURCE=tree: of the working
# tree, uncommitted changes included), so edits made meanwhile in a shared tree neither break nor mix into the run.
set -euo pipefail
source "$(dirname "$0")/../../scripts/common.sh"
cd "$ROOT"
apt_install mariadb-server curl rsync
npm_install
export SOAK_DIST_DIR="${SOAK_DIST_DIR:-.next-soak}"

SRC="$DATA_DIR/soak-src"
mkdir -p "$SRC"
if [ "${SOAK_SKIP_BUILD:-0}" = 1 ] && [ -f "$SRC/$SOAK_DIST_DIR/BUILD_ID" ]; then
  echo "› Soak run of the last build in $SRC (copy left as it was built)"
elif [ "${SOAK_SOURCE:-head}" = tree ]; then
  rsync -a --delete --exclude '/.git' --exclude '/node_modules' --exclude '/.data' --exclude '/.next*' --exclude '/test-results*' ./ "$SRC/"
  echo "› Soak run of the working tree"
else
  EXPORT="$DATA_DIR/soak-export"
  rm -rf "$EXPORT" && mkdir -p "$EXPORT" && git archive HEAD | tar -x -C "$EXPORT"
  rsync -a --delete --exclude '/node_modules' --exclude '/.data' --exclude '/.next*' "$EXPORT/" "$SRC/"
  rm -rf "$EXPORT"
  echo "› Soak run of commit $(git rev-parse --short HEAD)"
fi
[ "${SOAK_SKIP_BUILD:-0}" = 1 ] && [ -f "$SRC/$SOAK_DIST_DIR/BUILD_ID" ] || git show HEAD:tsconfig.json >"$SRC/tsconfig.json" 2>/dev/null || true
# The build type-checks the app, not the tests: a test someone is still changing must not stop a benchmark.
node -e 'const f=process.argv[1], c=JSON.parse(require("fs").readFileSync(f,"utf8")); c.exclude=[...new Set([...(c.exclude||[]),"tests"])]; require("fs").writeFileSync(f, JSON.stringify(c, null, 2))' "$SRC/tsconfig.json"
if ! cmp -s node_modules/.package-lock.json "$SRC/node_modules/.package-lock.json"; then
  rm -rf "$SRC/node_modules" && cp -al node_modules "$SRC/node_modules" # hard links: Turbopack will not build through a symlink
fi
# The copy's stack, logs and report live in this tree's .data (.data/soak).
export STACK_DATA_ROOT="$DATA_DIR"

cd "$SRC"
if [ "${SOAK_SKIP_BUILD:-0}" != 1 ] || [ ! -f "$SOAK_DIST_DIR/BUILD_ID" ]; then
  echo "› Building the app for the soak run ($SRC/$SOAK_DIST_DIR, log: .data/build-soak.log)"
  NEXT_DIST_DIR="$SOAK_DIST_DIR" UPLOADS_FILE_ORIGINS="http://localhost:${SOAK_UPLOADS_PORT:-3518}" NODE_ENV=production \
    node node_modules/next/dist/bin/next build >"$DATA_DIR/build-soak.log" 2>&1 || { tail -60 "$DATA_DIR/build-soak.log"; exit 1; }
fi
exec node node_modules/tsx/dist/cli.mjs tests/bench/soak.ts
