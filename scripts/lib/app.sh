# Steps both npm start and npm test take (sourced after common.sh and postgres.sh).

TSX="$ROOT/node_modules/.bin/tsx"
NEXT="$ROOT/node_modules/.bin/next"

# Apply migrations and seed into $DATABASE_URL (seed args: e.g. --if-empty).
db_prepare() {
  "$TSX" "$ROOT/scripts/migrate.ts" || die "migrations failed on $DATABASE_URL"
  "$TSX" "$ROOT/scripts/seed.ts" "$@" || die "seeding the demo museum failed on $DATABASE_URL"
}

# Start the SMTP mail fake on 127.0.0.1:$SMTP_PORT writing to $MAIL_DIR; wait until it listens.
mail_fake_start() {
  mkdir -p "$MAIL_DIR" "$ROOT/.data/logs"
  local log="$ROOT/.data/logs/mail-catcher-$SMTP_PORT.log"
  : >"$log"
  start_service "mail fake" "mail-fake-$SMTP_PORT" "$log" "$TSX" "$ROOT/scripts/mail-catcher.ts"
  MAIL_FAKE_PID=$SERVICE_PID
  wait_for_port "$SMTP_PORT" "$MAIL_FAKE_PID" "the mail fake" 60 || { cat "$log" >&2; die "the mail fake did not start (log: $log)"; }
  say "mail fake on 127.0.0.1:$SMTP_PORT (pid $MAIL_FAKE_PID), messages in $MAIL_DIR"
}

# True when the build folder (SIGHTWARD_DIST_DIR, default .next: next.config.mjs reads the same
# variable) holds a build newer than every source file (so npm start may skip building).
build_is_current() {
  local dist=${SIGHTWARD_DIST_DIR:-.next}
  [ -s "$ROOT/$dist/BUILD_ID" ] || return 1
  local newer
  newer=$(cd "$ROOT" && find app components lib db fonts public styles middleware.ts proxy.ts instrumentation.ts \
    next.config.mjs next.config.ts tailwind.config.ts postcss.config.mjs postcss.config.js tsconfig.json package.json package-lock.json \
    -newer "$dist/BUILD_ID" -type f -print -quit 2>/dev/null || true)
  [ -z "$newer" ]
}

next_build() {
  say "building the app (next build)"
  (cd "$ROOT" && NEXT_TELEMETRY_DISABLED=1 "$NEXT" build) || die "next build failed"
}

# Serve the built app on 127.0.0.1:PORT; sets APP_PID. Output to LOG when given, else the terminal.
next_serve() {
  local port=$1 log=${2:-}
  [ -n "$log" ] && : >"$log"
  start_service "the app (next start)" "app-$port" "${log:--}" "$NEXT" start -H 127.0.0.1 -p "$port"
  APP_PID=$SERVICE_PID
  wait_for_http "http://127.0.0.1:$port/api/health" "$APP_PID" "the app" 120 ||
    { [ -n "$log" ] && tail -n 40 "$log" >&2; die "the app did not start on port $port"; }
}
