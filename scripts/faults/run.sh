#!/usr/bin/env bash
# npm run test:faults: builds the app (into FAULTS_DIST_DIR, default .next-faults) and runs the fault scenarios
# in tests/faults against a stack of their own: a MariaDB in .data/faults (port FAULTS_DB_PORT, default 3506),
# the upload and mail services and the app on ports 3507–3510 (FAULTS_*_PORT). The shared database on 3406 is
# never touched. FAULTS_SKIP_BUILD=1 reuses a build that is already there.
set -euo pipefail
source "$(dirname "$0")/../common.sh"
cd "$ROOT"
apt_install mariadb-server curl
npm_install

export FAULTS_DIST_DIR="${FAULTS_DIST_DIR:-.next-faults}"
if [ "${FAULTS_DB_PORT:-3506}" = 3406 ]; then echo "FAULTS_DB_PORT must not be the shared database's port" >&2; exit 2; fi
if [ "${FAULTS_SKIP_BUILD:-0}" != 1 ] || [ ! -f "$FAULTS_DIST_DIR/BUILD_ID" ]; then
  echo "› Building the app for the fault scenarios ($FAULTS_DIST_DIR)"
  # The upload origin is read at build time (the pages' CSP); these scenarios drive the API only.
  NEXT_DIST_DIR="$FAULTS_DIST_DIR" UPLOADS_FILE_ORIGINS="http://localhost:${FAULTS_UPLOADS_PORT:-3508}" NODE_ENV=production \
    node node_modules/next/dist/bin/next build >"$DATA_DIR/build-faults.log" 2>&1 || { tail -60 "$DATA_DIR/build-faults.log"; exit 1; }
fi
echo "› Fault scenarios (tests/faults)"
NODE_ENV=test node_modules/.bin/vitest run --config tests/faults/vitest.config.ts --reporter=default "$@"
