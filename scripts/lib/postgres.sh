# The project's own PostgreSQL cluster (sourced after common.sh).
#
# Where: .data/postgres in the checkout, owned by the `postgres` user (initdb and postgres refuse
# to run as root). When that user cannot reach the checkout (e.g. a clone inside a mode-700 temp
# folder owned by root), the cluster lives in /tmp/sightward-pg-<hash of the checkout path>.
# How: 127.0.0.1:$PGPORT only, trust authentication (a local development cluster: anyone on this
# machine may connect; never expose it). Role `sightward` owns the project's databases.
# Lifetime: each npm start / npm test registers itself as a user of the running server; the last
# one to leave stops it (by the pid in postmaster.pid). A server left by a run that was killed
# is adopted and stopped by the next run that finishes.

export PGPORT=${PGPORT:-5544}
PG_ROLE=sightward

pg_bindir() {
  local dir
  dir=$(ls -d /usr/lib/postgresql/*/bin 2>/dev/null | sort -V | tail -n1)
  [ -n "$dir" ] && [ -x "$dir/postgres" ] && printf '%s' "$dir"
}

pg_ensure_installed() {
  if ! compgen -G "/usr/lib/postgresql/*/bin/postgres" >/dev/null; then
    apt_install postgresql
  fi
  PG_BIN=$(pg_bindir) || die "PostgreSQL server binaries not found under /usr/lib/postgresql after installing"
  id postgres >/dev/null 2>&1 || die "the postgres system user is missing (it comes with Debian's postgresql package)"
}

# Run a PostgreSQL program as the cluster owner, from / (the owner may not reach the checkout).
as_pg_owner() {
  if is_root; then
    (cd / && runuser -u postgres -- "$@")
  else
    "$@"
  fi
}

# Choose PG_HOME (holds postgres/ = the cluster, and run/ = who uses it).
pg_choose_home() {
  mkdir -p "$ROOT/.data"
  if ! is_root; then
    PG_HOME="$ROOT/.data"
  elif runuser -u postgres -- test -x "$ROOT/.data"; then
    PG_HOME="$ROOT/.data"
  else
    local hash
    hash=$(printf '%s' "$ROOT" | sha256sum | cut -c1-12)
    PG_HOME="/tmp/sightward-pg-$hash"
    mkdir -p "$PG_HOME"
    chmod 755 "$PG_HOME"
    printf '%s\n' "$ROOT" >"$PG_HOME/checkout"
    say "the postgres user cannot reach $ROOT; the cluster lives in $PG_HOME instead"
  fi
  PGDATA_DIR="$PG_HOME/postgres"
  PG_RUN="$PG_HOME/pg-run"
  mkdir -p "$PG_RUN/users"
  # Unix sockets have a ~107-byte path limit; we connect over TCP anyway, so use the data folder
  # when the path is short and no socket at all otherwise.
  if [ ${#PGDATA_DIR} -lt 80 ]; then PG_SOCKET_DIR=$PGDATA_DIR; else PG_SOCKET_DIR=""; fi
}

pg_initdb() {
  [ -s "$PGDATA_DIR/PG_VERSION" ] && return 0
  say "creating the PostgreSQL cluster in $PGDATA_DIR"
  mkdir -p "$PGDATA_DIR"
  is_root && chown postgres:postgres "$PGDATA_DIR"
  chmod 700 "$PGDATA_DIR"
  as_pg_owner "$PG_BIN/initdb" -D "$PGDATA_DIR" -U postgres --auth=trust -E UTF8 --locale=C.UTF-8 \
    >"$PG_HOME/initdb.log" 2>&1 || { cat "$PG_HOME/initdb.log" >&2; die "initdb failed (log above)"; }
}

# The pid of the server running on our data folder, if any.
pg_running_pid() {
  local pid
  pid=$(head -n1 "$PGDATA_DIR/postmaster.pid" 2>/dev/null || true)
  [ -n "$pid" ] && pid_alive "$pid" && grep -q postgres "/proc/$pid/comm" 2>/dev/null && printf '%s' "$pid"
}

pg_running_port() { sed -n 4p "$PGDATA_DIR/postmaster.pid" 2>/dev/null; }

pg_live_users() {
  local file count=0
  for file in "$PG_RUN"/users/*; do
    [ -e "$file" ] || continue
    if pid_alive "$(basename "$file")"; then count=$((count + 1)); else rm -f "$file"; fi
  done
  printf '%s' "$count"
}

pg_stop_server() {
  local pid
  pid=$(pg_running_pid) || return 0
  say "stopping PostgreSQL (pid $pid)"
  # SIGINT = PostgreSQL's fast shutdown: ends sessions, writes a checkpoint.
  stop_pid "$pid" "PostgreSQL" INT single
}

pg_is_ready() {
  psql_admin -tAc 'select 1' >/dev/null 2>&1
}

psql_admin() {
  psql -X -q -v ON_ERROR_STOP=1 -h 127.0.0.1 -p "$PGPORT" -U postgres -d postgres "$@"
}

# Start (or reuse) the server; register this run as a user; stop on exit when last.
pg_start() {
  pg_ensure_installed
  pg_choose_home
  exec 8>"$PG_RUN/lock"
  flock 8
  pg_initdb
  local pid
  if pid=$(pg_running_pid); then
    local port
    port=$(pg_running_port)
    if [ "$port" != "$PGPORT" ]; then
      if [ "$(pg_live_users)" -gt 0 ]; then
        flock -u 8
        die "our PostgreSQL already runs on port $port for another npm start/test; use PGPORT=$port or stop that run first"
      fi
      say "our PostgreSQL from an earlier run listens on port $port, not $PGPORT; restarting it"
      pg_stop_server
    elif ! pg_is_ready; then
      say "our PostgreSQL from an earlier run (pid $pid) does not answer; restarting it"
      pg_stop_server
    else
      say "reusing PostgreSQL already running on 127.0.0.1:$PGPORT (pid $pid)"
    fi
  fi
  if ! pid=$(pg_running_pid); then
    require_free_port "$PGPORT" PGPORT "PostgreSQL"
    say "starting PostgreSQL on 127.0.0.1:$PGPORT (data in $PGDATA_DIR)"
    if ! as_pg_owner "$PG_BIN/pg_ctl" -D "$PGDATA_DIR" -l "$PGDATA_DIR/server.log" -w -t 60 start \
      -o "-p $PGPORT -c listen_addresses=127.0.0.1 -k '$PG_SOCKET_DIR'" >/dev/null; then
      tail -n 20 "$PGDATA_DIR/server.log" >&2
      flock -u 8
      die "PostgreSQL did not start (log: $PGDATA_DIR/server.log)"
    fi
    pid=$(pg_running_pid) || die "PostgreSQL started but wrote no postmaster.pid"
  fi
  PG_PID=$pid
  : >"$PG_RUN/users/$$"
  flock -u 8
  on_cleanup pg_release
  local tries=0
  until pg_is_ready; do
    tries=$((tries + 1))
    [ $tries -gt 60 ] && die "PostgreSQL on port $PGPORT does not accept connections (log: $PGDATA_DIR/server.log)"
    sleep 0.5
  done
  psql_admin -tAc "select 1 from pg_roles where rolname = '$PG_ROLE'" | grep -q 1 ||
    psql_admin -c "create role $PG_ROLE login createdb"
}

# Exit hook: unregister; stop the server when no other run uses it.
pg_release() {
  exec 8>"$PG_RUN/lock"
  flock 8
  [ -n "${SIGHTWARD_DEBUG:-}" ] && say "release by $$; users: $(ls "$PG_RUN/users" | tr "\n" " ")"
  rm -f "$PG_RUN/users/$$"
  if [ "$(pg_live_users)" -eq 0 ]; then
    pg_stop_server
  else
    say "PostgreSQL stays up: another npm start/test in this checkout still uses it"
  fi
  flock -u 8
}

pg_database_exists() {
  psql_admin -tAc "select 1 from pg_database where datname = '$1'" | grep -q 1
}

pg_create_database() {
  pg_database_exists "$1" || { say "creating database $1"; psql_admin -c "create database \"$1\" owner $PG_ROLE"; }
}

pg_recreate_database() {
  say "recreating database $1"
  psql_admin -c "drop database if exists \"$1\" with (force)"
  psql_admin -c "create database \"$1\" owner $PG_ROLE"
}

pg_url() { printf 'postgres://%s@127.0.0.1:%s/%s' "$PG_ROLE" "$PGPORT" "$1"; }
