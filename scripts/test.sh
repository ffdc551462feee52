#!/usr/bin/env bash
# npm test: the npm start set-up against a fresh `sightward_test` database, then
#   1. unit and integration tests (vitest; integration tests use the real PostgreSQL),
#   2. next build into .next-test (SIGHTWARD_DIST_DIR, read by next.config.mjs), served on 127.0.0.1:3100,
#   3. browser tests (vitest.e2e.config.ts: playwright-core driving Debian's chromium).
# Fails fast; always stops what it started. Works with CI=true, no stdin, as root.
set -euo pipefail
SIGHTWARD_COMMAND=test
source "$(dirname "${BASH_SOURCE[0]}")/lib/common.sh"
source "$ROOT/scripts/lib/postgres.sh"
source "$ROOT/scripts/lib/app.sh"
cd "$ROOT"
install_cleanup_trap
exec </dev/null

TEST_PORT=${TEST_PORT:-3100}
export SMTP_HOST=127.0.0.1
export SMTP_PORT=${TEST_SMTP_PORT:-2526}
export MAIL_DIR=$ROOT/.data/mail-test
export NEXTAUTH_URL=http://127.0.0.1:$TEST_PORT
export NEXTAUTH_SECRET=sightward-test-secret-not-for-production-use
export E2E_BASE_URL=http://127.0.0.1:$TEST_PORT
export CHROMIUM_PATH=${CHROMIUM_PATH:-/usr/bin/chromium}
export NEXT_TELEMETRY_DISABLED=1
export CI=${CI:-true}
# Our own build folder: an npm start serving .next in this checkout keeps running undisturbed.
# Exported, so the e2e test that starts a second copy of the app serves this build too.
export SIGHTWARD_DIST_DIR=.next-test

PHASES=()
phase_start=$SECONDS
phase() {
  local now=$SECONDS
  [ ${#PHASES[@]} -gt 0 ] && PHASES[-1]="${PHASES[-1]} ($((now - phase_start)) s)"
  phase_start=$now
  PHASES+=("$1")
  say "── $1"
}
summary() {
  [ ${#PHASES[@]} -gt 0 ] && PHASES[-1]="${PHASES[-1]} ($((SECONDS - phase_start)) s)"
  local line
  for line in "${PHASES[@]}"; do say "   $line"; done
  if [ "${rc:-0}" -ne 0 ] && [ ${#PHASES[@]} -gt 0 ]; then
    say "npm test FAILED (exit $rc) in: ${PHASES[-1]}"
  fi
  say "total $SECONDS s"
}
on_cleanup summary

mkdir -p "$ROOT/.data/logs"
reap_orphan "app-$TEST_PORT" "the app under test"
reap_orphan "mail-fake-$SMTP_PORT" "the test mail fake"
phase "set-up: packages, chromium, PostgreSQL, database sightward_test, mail fake"
ensure_node_modules
if [ ! -x "$CHROMIUM_PATH" ]; then
  apt_install chromium
  [ -x "$CHROMIUM_PATH" ] || die "chromium installed but $CHROMIUM_PATH is missing; set CHROMIUM_PATH"
fi
require_free_port "$TEST_PORT" TEST_PORT "the app under test"
require_free_port "$SMTP_PORT" TEST_SMTP_PORT "the test mail fake"
pg_start
pg_recreate_database sightward_test
export DATABASE_URL=$(pg_url sightward_test)
rm -rf "$MAIL_DIR"
mkdir -p "$MAIL_DIR"
db_prepare
mail_fake_start

# For work on one part: UNIT_TESTS / E2E_TESTS narrow a phase to the vitest filters they hold
# (e.g. UNIT_TESTS=tests/integration/rosters E2E_TESTS=none); "none" skips the phase. CI sets neither.
UNIT_TESTS=${UNIT_TESTS:-}
E2E_TESTS=${E2E_TESTS:-}
if [ "$UNIT_TESTS" != none ]; then
  phase "unit and integration tests (vitest)"
  # shellcheck disable=SC2086
  "$ROOT/node_modules/.bin/vitest" run $UNIT_TESTS
fi

if [ "$E2E_TESTS" = none ]; then
  say "E2E_TESTS=none: no build, no browser tests"
else
  phase "build (next build)"
  next_build

  phase "serve the build on 127.0.0.1:$TEST_PORT"
  next_serve "$TEST_PORT" "$ROOT/.data/logs/app-test.log"
  say "the app answers at $E2E_BASE_URL (log: .data/logs/app-test.log)"

  if [ -f "$ROOT/vitest.e2e.config.ts" ]; then
    phase "browser tests (vitest --config vitest.e2e.config.ts)"
    # shellcheck disable=SC2086
    "$ROOT/node_modules/.bin/vitest" run --config vitest.e2e.config.ts $E2E_TESTS
  else
    say "no vitest.e2e.config.ts yet: no browser tests to run"
  fi
fi

phase "done"
say "all test phases passed"
