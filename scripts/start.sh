#!/usr/bin/env bash
# npm start: everything Sightward needs, from a fresh clone, then the app on http://127.0.0.1:3000.
# PostgreSQL (cluster in .data/postgres, port $PGPORT, default 5544), database `sightward`
# migrated and seeded when empty, the mail fake (port $SMTP_PORT, default 2525), the built app
# (port $PORT, default 3000). Ctrl-C stops everything this script started.
set -euo pipefail
SIGHTWARD_COMMAND=start
source "$(dirname "${BASH_SOURCE[0]}")/lib/common.sh"
source "$ROOT/scripts/lib/postgres.sh"
source "$ROOT/scripts/lib/app.sh"
cd "$ROOT"
install_cleanup_trap

export PORT=${PORT:-3000}
export SMTP_HOST=127.0.0.1
export SMTP_PORT=${SMTP_PORT:-2525}
export MAIL_DIR=${MAIL_DIR:-$ROOT/.data/mail}
export NEXTAUTH_URL=${NEXTAUTH_URL:-http://127.0.0.1:$PORT}
export NEXT_TELEMETRY_DISABLED=1

mkdir -p "$ROOT/.data/logs"
reap_orphan "app-$PORT" "the app"
reap_orphan "mail-fake-$SMTP_PORT" "the mail fake"
ensure_node_modules
# Check the ports first, so a clash is reported before anything starts.
require_free_port "$PORT" PORT "the app"
require_free_port "$SMTP_PORT" SMTP_PORT "the mail fake"

pg_start
pg_create_database sightward
export DATABASE_URL=$(pg_url sightward)
NEXTAUTH_SECRET=$(ensure_secret)
export NEXTAUTH_SECRET

db_prepare --if-empty
mail_fake_start

if [ "${SIGHTWARD_REBUILD:-0}" != 1 ] && build_is_current; then
  say "the build in ${SIGHTWARD_DIST_DIR:-.next} is newer than every source file; skipping next build (SIGHTWARD_REBUILD=1 forces one)"
else
  next_build
fi
require_free_port "$PORT" PORT "the app"
next_serve "$PORT"

cat >&2 <<MSG

  Sightward is running: http://127.0.0.1:$PORT

  Demo sign-ins (password for all: sightward-demo; demo only, change it outside a demo):
    admin@example.org        admin
    operations@example.org   operations
    curator@example.org      curator
    guard@example.org        guard

  PostgreSQL  127.0.0.1:$PGPORT, database sightward (data in $PGDATA_DIR)
  Mail fake   127.0.0.1:$SMTP_PORT, caught messages in $MAIL_DIR
  Press Ctrl-C to stop everything.

MSG

set +e
wait "$APP_PID"
rc=$?
set -e
say "the app exited (status $rc)"
exit "$rc"
