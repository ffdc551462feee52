# Shared helpers for scripts/start.sh and scripts/test.sh (sourced, not run).
# Sets ROOT (the checkout), logging, port checks, and a registry of processes this run started,
# so the exit trap stops exactly those, by pid.

ROOT=${ROOT:-$(cd "$(dirname "${BASH_SOURCE[0]}")/../.." && pwd)}
export ROOT

say() { printf '%s\n' "[sightward] ${SIGHTWARD_DEBUG:+$(date +%T) $$ }$*" >&2; }
die() { say "error: $*"; exit 1; }

is_root() { [ "$(id -u)" -eq 0 ]; }

# 0 when something accepts TCP connections on 127.0.0.1:PORT.
port_in_use() {
  (exec 3<>"/dev/tcp/127.0.0.1/$1") 2>/dev/null
}

# Who holds a TCP port, for messages ("pid 123 (node)"), when ss can tell.
port_holder() {
  local line
  line=$(ss -ltnpH "sport = :$1" 2>/dev/null | head -n1 || true)
  if [[ $line =~ pid=([0-9]+) ]]; then
    local pid=${BASH_REMATCH[1]}
    printf 'pid %s (%s)' "$pid" "$(tr '\0' ' ' <"/proc/$pid/cmdline" 2>/dev/null | cut -c1-60 | sed 's/ *$//')"
  else
    printf 'another program'
  fi
}

# Fail with a message naming the port and the variable that moves it.
require_free_port() {
  local port=$1 variable=$2 what=$3
  if port_in_use "$port"; then
    die "port $port (for $what) is already in use by $(port_holder "$port"). Stop that program, or choose another port: $variable=<port> npm ${SIGHTWARD_COMMAND:-start}"
  fi
}

pid_alive() { [ -n "${1:-}" ] && kill -0 "$1" 2>/dev/null; }

# Stop one process by pid: SIGNAL (default TERM), wait up to 30 s, then KILL. With scope "group"
# (the default) a process that leads its own process group is stopped with its children.
stop_pid() {
  local pid=$1 name=$2 signal=${3:-TERM} scope=${4:-group} waited=0
  pid_alive "$pid" || return 0
  if [ "$scope" = group ] && [ "$(ps -o pgid= -p "$pid" 2>/dev/null | tr -d ' ')" = "$pid" ]; then
    kill "-$signal" -- "-$pid" 2>/dev/null || true
  else
    kill "-$signal" "$pid" 2>/dev/null || true
  fi
  while pid_alive "$pid" && [ $waited -lt 150 ]; do sleep 0.2; waited=$((waited + 1)); done
  if pid_alive "$pid"; then
    say "$name (pid $pid) did not stop in 30 s; killing it"
    if [ "$scope" = group ]; then kill -KILL -- "-$pid" 2>/dev/null || true; fi
    kill -KILL "$pid" 2>/dev/null || true
  fi
  # Reap it when it is our child, so no zombie lingers.
  wait "$pid" 2>/dev/null || true
}

# Processes this run started, stopped in reverse order on exit.
STARTED_PIDS=()
STARTED_NAMES=()
remember_pid() { STARTED_PIDS+=("$1"); STARTED_NAMES+=("$2"); }

CLEANUP_HOOKS=()
on_cleanup() { CLEANUP_HOOKS+=("$1"); }

cleanup_done=0
cleanup() {
  [ "$cleanup_done" = 1 ] && return 0
  cleanup_done=1
  local i
  for ((i = ${#STARTED_PIDS[@]} - 1; i >= 0; i--)); do
    if pid_alive "${STARTED_PIDS[$i]}"; then
      say "stopping ${STARTED_NAMES[$i]} (pid ${STARTED_PIDS[$i]})"
      stop_pid "${STARTED_PIDS[$i]}" "${STARTED_NAMES[$i]}"
    fi
  done
  for ((i = ${#CLEANUP_HOOKS[@]} - 1; i >= 0; i--)); do
    "${CLEANUP_HOOKS[$i]}" || true
  done
}

install_cleanup_trap() {
  trap 'rc=$?; cleanup; exit $rc' EXIT
  trap 'say "interrupted"; exit 130' INT
  trap 'say "terminated"; exit 143' TERM
  trap 'exit 129' HUP
}

# Start a background service in its own process group (so stopping it stops its children too),
# logging to a file (or to the terminal when LOG is "-"); sets SERVICE_PID. KEY names its pid
# file in .data/run, so a later run can stop it if this script is killed outright.
start_service() {
  local name=$1 key=$2 log=$3
  shift 3
  if [ "$log" = "-" ]; then
    setsid "$@" </dev/null &
  else
    setsid "$@" >>"$log" 2>&1 </dev/null &
  fi
  SERVICE_PID=$!
  remember_pid "$SERVICE_PID" "$name"
  mkdir -p "$ROOT/.data/run"
  printf '%s %s\n' "$SERVICE_PID" "$$" >"$ROOT/.data/run/$key.pid"
}

# A service left running by an earlier run of ours that was killed outright (its starter is gone)
# holds the port we need: stop it, by the pid we recorded.
reap_orphan() {
  local key=$1 name=$2 file="$ROOT/.data/run/$1.pid" pid owner
  [ -f "$file" ] || return 0
  read -r pid owner <"$file" || true
  if pid_alive "$pid" && ! pid_alive "$owner" && grep -qF "$ROOT" "/proc/$pid/cmdline" "/proc/$pid/environ" 2>/dev/null; then
    say "stopping $name (pid $pid) left running by an earlier run that was killed"
    stop_pid "$pid" "$name"
  fi
  pid_alive "$pid" || rm -f "$file"
}

# Wait until URL answers any HTTP status (curl, else node fetch), or the pid dies, or timeout.
wait_for_http() {
  local url=$1 pid=$2 name=$3 timeout=${4:-120} start=$SECONDS
  while :; do
    if node -e 'fetch(process.argv[1],{signal:AbortSignal.timeout(2000)}).then(()=>process.exit(0),()=>process.exit(1))' "$url" 2>/dev/null; then
      return 0
    fi
    pid_alive "$pid" || { say "$name exited before answering at $url"; return 1; }
    [ $((SECONDS - start)) -ge "$timeout" ] && { say "$name did not answer at $url within $timeout s"; return 1; }
    sleep 0.5
  done
}

# Wait until something listens on 127.0.0.1:PORT.
wait_for_port() {
  local port=$1 pid=$2 name=$3 timeout=${4:-30} start=$SECONDS
  until port_in_use "$port"; do
    pid_alive "$pid" || { say "$name exited before listening on port $port"; return 1; }
    [ $((SECONDS - start)) -ge "$timeout" ] && { say "$name did not listen on port $port within $timeout s"; return 1; }
    sleep 0.2
  done
}

# npm ci when node_modules is missing (a fresh clone).
ensure_node_modules() {
  if [ ! -d "$ROOT/node_modules" ] || [ ! -x "$ROOT/node_modules/.bin/next" ]; then
    say "installing npm packages (npm ci)"
    (cd "$ROOT" && npm ci --no-audit --no-fund) || die "npm ci failed"
  fi
}

# apt-get install, only as root and non-interactive.
apt_install() {
  is_root || die "$* is missing and installing it needs root: sudo apt-get install -y $*"
  say "installing $* with apt-get"
  export DEBIAN_FRONTEND=noninteractive
  if [ "${APT_UPDATED:-0}" != 1 ]; then
    apt-get update -q >&2 || die "apt-get update failed"
    APT_UPDATED=1
  fi
  apt-get install -y -q "$@" >&2 || die "apt-get install $* failed"
}

# The secret next-auth signs sessions with: generated once, kept in .data/secret.
ensure_secret() {
  local file="$ROOT/.data/secret"
  if [ ! -s "$file" ]; then
    (umask 077 && node -e 'process.stdout.write(require("crypto").randomBytes(32).toString("base64url"))' >"$file")
  fi
  cat "$file"
}
