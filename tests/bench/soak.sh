#!/usr/bin/env bash
# npm run soak: builds the app (SOAK_DIST_DIR, default .next-soak; SOAK_SKIP_BUILD=1 reuses it) and runs tests/bench/soak.ts
# against a stack of its own (MariaDB in .data/soak on port 3516, services and app on 3517–3520).
set -euo pipefail
source "$(dirname "$0")/../../scripts/common.sh"
cd "$ROOT"
apt_install mariadb-server curl
npm_install
export SOAK_DIST_DIR="${SOAK_DIST_DIR:-.next-soak}"
if [ "${SOAK_SKIP_BUILD:-0}" != 1 ] || [ ! -f "$SOAK_DIST_DIR/BUILD_ID" ]; then
  echo "› Building the app for the soak run ($SOAK_DIST_DIR)"
  NEXT_DIST_DIR="$SOAK_DIST_DIR" UPLOADS_FILE_ORIGINS="http://localhost:${SOAK_UPLOADS_PORT:-3518}" NODE_ENV=production \
    node node_modules/next/dist/bin/next build >"$DATA_DIR/build-soak.log" 2>&1 || { tail -60 "$DATA_DIR/build-soak.log"; exit 1; }
fi
exec node node_modules/tsx/dist/cli.mjs tests/bench/soak.ts
