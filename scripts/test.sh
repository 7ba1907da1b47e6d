#!/usr/bin/env bash
# npm test: set up what the tests need, run every test, leave nothing running.
set -uo pipefail
source "$(dirname "$0")/common.sh"
cd "$ROOT"

set -e
apt_install mariadb-server chromium curl
npm_install
set +e

stop_on_exit

# TEST_DB, TEST_DIST_DIR and the port variables let several checkouts or developers test side by side;
# VITEST_FILES / E2E_FILES (space-separated paths) run a subset, SKIP_E2E=1 skips the browser tests.
TEST_DB="${TEST_DB:-scribeline_test}"
case "$TEST_DB" in *_test) ;; *) echo "TEST_DB must end in _test" >&2; exit 2 ;; esac
export DB_DATABASES="scribeline scribeline_test $TEST_DB"
start_database || exit 1
bash db/mariadb.sh reset "$TEST_DB" || exit 1

export DB_NAME="$TEST_DB"
export SCRIBELINE_TEST_DB=1
export NEXTAUTH_SECRET="test-secret-$(auth_secret)"
E2E_PORT="${E2E_PORT:-3210}"
export NEXTAUTH_URL="http://127.0.0.1:$E2E_PORT"

rm -rf "$DATA_DIR/uploads-$TEST_DB"
start_local_services "$E2E_PORT" "${UPLOADS_PORT:-3110}" "${MAIL_SMTP_PORT:-2535}" "${MAIL_HTTP_PORT:-2590}" "$TEST_DB" || exit 1
migrate_and_seed || exit 1

VITEST_JSON="$DATA_DIR/vitest-$TEST_DB.json"
PLAYWRIGHT_JSON="$DATA_DIR/playwright-$TEST_DB.json"
rm -f "$VITEST_JSON" "$PLAYWRIGHT_JSON"
# Lint and layers (eslint.config.mjs), then no unused file, export or dependency (knip.jsonc): each one that
# fails is named in LINT_FAILED and counted as a failure in the closing line.
LINT_FAILED=""
echo "› Lint and layers (ESLint)"
node_modules/.bin/eslint --max-warnings=0 --cache --cache-location "$DATA_DIR/eslintcache-$TEST_DB" . || LINT_FAILED="$LINT_FAILED eslint"
echo "› Unused files and exports (knip)"
node_modules/.bin/knip --no-progress || LINT_FAILED="$LINT_FAILED knip"
export LINT_FAILED
echo "› Unit and integration tests (Vitest)"
# shellcheck disable=SC2086
NODE_ENV=test node_modules/.bin/vitest run --config tests/vitest.config.ts --reporter=default --reporter=json --outputFile.json="$VITEST_JSON" ${VITEST_FILES:-}
UNIT=$?
if [ "${SKIP_E2E:-0}" = 1 ]; then
  node scripts/test-summary.mjs "$VITEST_JSON"
  [ $UNIT = 0 ] && [ -z "$LINT_FAILED" ]
  exit
fi

echo "› Building the app for the browser tests"
export NEXT_DIST_DIR="${TEST_DIST_DIR:-.next-test}"
if NODE_ENV=production node node_modules/next/dist/bin/next build >"$DATA_DIR/build-$TEST_DB.log" 2>&1; then
  # The browser tests stand in for many people: each new member signs up from an address of their own, passed
  # as X-Forwarded-For (tests/e2e/support/accounts.ts), which the app believes from loopback only here, so the
  # per-client hourly limits on account e-mail and sign-in hold for each of them as for real visitors.
  if TRUSTED_PROXIES=127.0.0.1 serve_app "$E2E_PORT" "$DATA_DIR/e2e-server-$TEST_DB.log"; then
    echo "› Browser tests (Playwright, Debian's Chromium)"
    # shellcheck disable=SC2086
    PLAYWRIGHT_JSON_OUTPUT_NAME="$PLAYWRIGHT_JSON" E2E_BASE_URL="http://127.0.0.1:$E2E_PORT" node_modules/.bin/playwright test --config tests/playwright.config.ts --reporter=list,json ${E2E_FILES:-}
    E2E=$?
  else
    E2E=1
  fi
else
  tail -60 "$DATA_DIR/build-$TEST_DB.log"; E2E=1
fi

echo
echo "Lint: $([ -z "$LINT_FAILED" ] && echo passed || echo "FAILED:$LINT_FAILED") · Vitest: $([ $UNIT = 0 ] && echo passed || echo FAILED) · Playwright: $([ $E2E = 0 ] && echo passed || echo FAILED)"
# One closing line for both runners together.
node scripts/test-summary.mjs "$VITEST_JSON" "$PLAYWRIGHT_JSON"
[ $UNIT = 0 ] && [ $E2E = 0 ] && [ -z "$LINT_FAILED" ]
