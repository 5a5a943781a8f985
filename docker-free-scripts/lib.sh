# shellcheck shell=bash
# Helpers shared by the docker-free scripts (sourced, not executed). Needs only bash, coreutils,
# util-linux (runuser, setsid) and node: no curl, ss, ps or lsof, which a fresh machine may lack.
# Functions are prefixed rl_. Callers source env.sh for a profile before using the service helpers.

RL_SCRIPTS="$(cd "$(dirname "${BASH_SOURCE[0]}")" && pwd)"
RL_ROOT="$(cd "$RL_SCRIPTS/.." && pwd)"
RL_TSX="$RL_ROOT/node_modules/.bin/tsx"
RL_NEXT="$RL_ROOT/node_modules/next/dist/bin/next"
# The build folder (next.config.ts reads NEXT_DIST_DIR; default .next).
RL_DIST="${NEXT_DIST_DIR:-.next}"
RL_DIST="${RL_DIST%/}"

# ------------------------------------------------------------------ progress output
RL_LINE_OPEN=0
RL_STEP_T0=0

# rl_step N TOTAL "Doing something" → prints "[N/TOTAL] Doing something … " and leaves the line open.
rl_step() {
  rl_close_line
  printf '[%s/%s] %s … ' "$1" "$2" "$3"
  RL_LINE_OPEN=1
  RL_STEP_T0=$SECONDS
}

rl_close_line() {
  if [ "$RL_LINE_OPEN" = 1 ]; then
    printf '\n'
    RL_LINE_OPEN=0
  fi
}

# rl_ok [detail] → "ok" (with the elapsed time when the step took 3 s or more).
rl_ok() {
  local took=$((SECONDS - RL_STEP_T0)) extra=""
  [ "$took" -ge 3 ] && extra=" (${took} s)"
  if [ "$RL_LINE_OPEN" = 1 ]; then
    printf 'ok%s%s\n' "${1:+, $1}" "$extra"
  else
    printf '      ok%s%s\n' "${1:+, $1}" "$extra"
  fi
  RL_LINE_OPEN=0
}

# rl_note "text" → an indented line under the current step.
rl_note() {
  rl_close_line
  printf '      %s\n' "$*"
}

rl_warn() {
  rl_close_line
  printf '      warning: %s\n' "$*"
}

# rl_fail "what failed" "how to fix it" [log file] → FAILED, the reason, the tail of the log.
rl_fail() {
  local what="$1" fix="${2:-}" log="${3:-}"
  if [ "$RL_LINE_OPEN" = 1 ]; then printf 'FAILED\n'; RL_LINE_OPEN=0; fi
  {
    printf '\n  ✗ %s\n' "$what"
    if [ -n "$log" ] && [ -s "$log" ]; then
      printf '\n  Last lines of %s:\n' "$(rl_rel "$log")"
      tail -n 30 "$log" | sed 's/^/    | /'
    fi
    if [ -n "$fix" ]; then
      printf '\n  How to fix: %s\n' "$fix"
    fi
    printf '\n'
  } >&2
}

# rl_die "what" "fix" [log] → rl_fail, then exit 1 (traps still run).
rl_die() {
  rl_fail "$@"
  exit 1
}

# Path relative to the repository root, for messages.
rl_rel() {
  case "$1" in
    "$RL_ROOT"/*) printf '%s' "${1#"$RL_ROOT"/}" ;;
    *) printf '%s' "$1" ;;
  esac
}

# ------------------------------------------------------------------ system checks
rl_check_node() {
  if ! command -v node >/dev/null 2>&1 || ! command -v npm >/dev/null 2>&1; then
    rl_die "Node.js and npm were not found on PATH." "install Node.js 20 (or newer) with npm, then run this again."
  fi
  local major
  major="$(node -p 'process.versions.node.split(".")[0]')"
  if [ "$major" -lt 20 ]; then
    rl_die "Node.js $(node -v) is too old." "install Node.js 20 (or newer)."
  fi
}

# True when node_modules is missing or older than package-lock.json.
rl_need_npm_ci() {
  [ ! -d "$RL_ROOT/node_modules" ] && return 0
  [ ! -f "$RL_ROOT/node_modules/.package-lock.json" ] && return 0
  [ "$RL_ROOT/package-lock.json" -nt "$RL_ROOT/node_modules/.package-lock.json" ] && return 0
  [ ! -x "$RL_TSX" ] && return 0
  return 1
}

# rl_npm_ci LOG → runs npm ci in the current directory (the scripts cd to the repository root).
rl_npm_ci() {
  local log="$1"
  rl_run_logged "$log" npm ci --no-audit --no-fund
}

# rl_apt_install LOG PACKAGE… → apt-get update + install, as root or through sudo.
rl_apt_install() {
  local log="$1"
  shift
  local -a sudo=()
  if [ "$(id -u)" != 0 ]; then
    if command -v sudo >/dev/null 2>&1; then
      sudo=(sudo -n)
    else
      rl_fail "Installing $* needs root." "run as root, or install them yourself: apt-get install -y $*"
      return 1
    fi
  fi
  if ! command -v apt-get >/dev/null 2>&1; then
    rl_fail "apt-get is not available on this machine." "install these packages with your system's package manager: $*"
    return 1
  fi
  rl_run_logged "$log" "${sudo[@]}" env DEBIAN_FRONTEND=noninteractive apt-get update -q || {
    rl_fail "apt-get update failed." "check the network access to the Debian mirrors, then run this again." "$log"
    return 1
  }
  rl_run_logged "$log" "${sudo[@]}" env DEBIAN_FRONTEND=noninteractive apt-get install -y -q "$@" || {
    rl_fail "apt-get install $* failed." "run 'apt-get install -y $*' by hand and look at its error." "$log"
    return 1
  }
}

rl_pg_bindir() {
  local d
  d="$(ls -d /usr/lib/postgresql/*/bin 2>/dev/null | sort -V | tail -n 1)"
  if [ -n "$d" ] && [ -x "$d/initdb" ]; then
    printf '%s' "$d"
    return 0
  fi
  return 1
}

# ------------------------------------------------------------------ processes
# Commands that run for a while are started in their own session (setsid) in the background and
# waited for, so a signal to the script is handled at once and the whole process group can be
# stopped. RL_CHILD holds the one running right now.
RL_CHILD=""

# rl_run_logged LOG CMD… → runs CMD with its output appended to LOG; returns its status.
rl_run_logged() {
  local log="$1" rc=0
  shift
  mkdir -p "$(dirname "$log")"
  printf '\n===== %s: %s\n' "$(date '+%F %T')" "$*" >>"$log"
  setsid "$@" </dev/null >>"$log" 2>&1 &
  rl_child_started $!
  wait "$RL_CHILD" || rc=$?
  rl_child_done
  return "$rc"
}

# rl_build LOG → next build, then the brotli copies of its scripts and stylesheets that server.ts
# sends (precompress-static.ts): every script that builds goes through here, so no build lacks them.
rl_build() {
  rl_run_logged "$1" node "$RL_NEXT" build && rl_run_logged "$1" "$RL_TSX" "$RL_SCRIPTS/precompress-static.ts" "$RL_DIST"
}

# rl_serve PORT → the command line of the built app on 127.0.0.1:PORT (server.ts: Next's handler
# with the brotli copies first), for rl_service_start.
RL_SERVE=(node --import tsx "$RL_ROOT/server.ts" -H 127.0.0.1 -p)

# rl_last_run LOG → the output of the last command rl_run_logged appended to LOG.
rl_last_run() {
  awk '/^===== / { buf = ""; next } { buf = buf $0 "\n" } END { printf "%s", buf }' "$1" 2>/dev/null
}

# rl_run_shown CMD… → like rl_run_logged but the output goes to the terminal.
rl_run_shown() {
  local rc=0
  setsid "$@" </dev/null &
  rl_child_started $!
  wait "$RL_CHILD" || rc=$?
  rl_child_done
  return "$rc"
}

# The running child is also recorded in $RIMELINE_RUN/child-<script pid>.pid, so the reaper can
# stop it if this script is killed outright.
rl_child_started() {
  RL_CHILD="$1"
  if [ -n "${RIMELINE_RUN:-}" ] && [ -d "$RIMELINE_RUN" ]; then echo "$1" >"$RIMELINE_RUN/child-$$.pid"; fi
}
rl_stop_child() {
  if [ -n "$RL_CHILD" ] && rl_alive "$RL_CHILD"; then rl_kill_tree "$RL_CHILD" 15; fi
  rl_child_done
}
rl_child_done() {
  RL_CHILD=""
  if [ -n "${RIMELINE_RUN:-}" ]; then rm -f "$RIMELINE_RUN/child-$$.pid"; fi
}

# rl_watch_parent → when the process that started this script goes away (npm killed with SIGTERM
# does not pass the signal through its `sh -c`; a closed terminal), send ourselves SIGTERM so the
# normal clean-up runs. rl_stop_watcher ends the watcher.
RL_WATCHER=""
rl_watch_parent() {
  local parent="$PPID" self="$$"
  (
    trap - INT TERM EXIT HUP
    while kill -0 "$parent" 2>/dev/null && [ "$(sed 's/.*) //' "/proc/$self/stat" 2>/dev/null | cut -d' ' -f2)" = "$parent" ]; do
      sleep 2
    done
    kill -TERM "$self" 2>/dev/null
  ) </dev/null >/dev/null 2>&1 &
  RL_WATCHER=$!
}
rl_stop_watcher() {
  if [ -n "$RL_WATCHER" ]; then kill "$RL_WATCHER" 2>/dev/null || true; RL_WATCHER=""; fi
}

# The services run in their own sessions (setsid), so a SIGKILL to this script's process group
# (a tool's time limit, say) would leave them running. rl_start_reaper starts a small detached
# process that waits for this script to end and then stops whatever is still recorded in
# $RIMELINE_RUN/*.pid, plus the profile's PostgreSQL when $RIMELINE_RUN/pg.owner names this
# script. After a normal exit the clean-up has already done all that and the reaper just ends.
RL_REAPER=""
rl_start_reaper() {
  mkdir -p "$RIMELINE_LOGS" "$RIMELINE_RUN"
  setsid bash -c 'source "$1/lib.sh"; source "$1/env.sh" "$2"; rl_reap "$3"' rimeline-reaper \
    "$RL_SCRIPTS" "$RIMELINE_PROFILE" "$$" </dev/null >>"$RIMELINE_LOGS/reaper.log" 2>&1 &
  RL_REAPER=$!
}
rl_stop_reaper() {
  if [ -n "$RL_REAPER" ]; then kill "$RL_REAPER" 2>/dev/null || true; RL_REAPER=""; fi
}
rl_reap() {
  local owner="$1" f pid
  while kill -0 "$owner" 2>/dev/null; do sleep 2; done
  for f in "$RIMELINE_RUN"/*.pid; do
    [ -f "$f" ] || continue
    pid="$(cat "$f" 2>/dev/null)"
    if rl_alive "$pid" && rl_is_ours "$pid"; then
      echo "$(date '+%F %T') script $owner is gone; stopping $(basename "$f" .pid) (pid $pid)"
      rl_kill_tree "$pid" 10
    fi
    rm -f "$f"
  done
  if [ "$(cat "$RIMELINE_RUN/pg.owner" 2>/dev/null)" = "$owner" ]; then
    echo "$(date '+%F %T') script $owner is gone; stopping PostgreSQL ($RIMELINE_PROFILE)"
    bash "$RL_SCRIPTS/db-stop.sh" "$RIMELINE_PROFILE" --quiet || true
    rm -f "$RIMELINE_RUN/pg.owner"
  fi
}

rl_alive() {
  [ -n "${1:-}" ] && kill -0 "$1" 2>/dev/null
}

rl_cmdline() {
  tr '\0' ' ' <"/proc/$1/cmdline" 2>/dev/null | cut -c1-160
}

# rl_kill_tree PID [SECONDS] → SIGTERM to the process group (falls back to the pid), SIGKILL
# after the timeout. Returns once the process is gone.
rl_kill_tree() {
  local pid="$1" timeout="${2:-10}" i
  rl_alive "$pid" || return 0
  kill -TERM -- "-$pid" 2>/dev/null || kill -TERM "$pid" 2>/dev/null || true
  for ((i = 0; i < timeout * 10; i++)); do
    rl_alive "$pid" || break
    # A zombie child of ours counts as gone once reaped.
    if [ "$(sed 's/.*) //' "/proc/$pid/stat" 2>/dev/null | cut -d' ' -f1)" = Z ]; then wait "$pid" 2>/dev/null || true; fi
    sleep 0.1
  done
  if rl_alive "$pid"; then
    kill -KILL -- "-$pid" 2>/dev/null || kill -KILL "$pid" 2>/dev/null || true
    sleep 0.2
  fi
  wait "$pid" 2>/dev/null || true
  return 0
}

# ------------------------------------------------------------------ ports
rl_port_busy() {
  (exec 3<>"/dev/tcp/127.0.0.1/$1") 2>/dev/null
}

# rl_port_pids PORT → pids of the processes listening on 127.0.0.1/0.0.0.0:PORT (reads /proc).
rl_port_pids() {
  local port hex inodes inode fd pid
  port="$1"
  hex="$(printf '%04X' "$port")"
  inodes="$(awk -v p=":$hex" '$4 == "0A" && substr($2, length($2) - 4) == p { print $10 }' /proc/net/tcp /proc/net/tcp6 2>/dev/null | sort -u)"
  [ -z "$inodes" ] && return 0
  for fd in /proc/[0-9]*/fd/*; do
    inode="$(readlink "$fd" 2>/dev/null)" || continue
    case "$inode" in socket:*) ;; *) continue ;; esac
    inode="${inode#socket:[}"
    inode="${inode%]}"
    if grep -qx "$inode" <<<"$inodes"; then
      pid="${fd#/proc/}"
      echo "${pid%%/*}"
    fi
  done | sort -un
}

# rl_port_owner PORT → "pid N (command)" descriptions of who listens there.
rl_port_owner() {
  local pid out=""
  for pid in $(rl_port_pids "$1"); do
    out+="pid $pid ($(rl_cmdline "$pid"))"$'\n'
  done
  printf '%s' "${out:-an unknown process (try: ss -ltnp 'sport = :$1')}"
}

# A process is "ours" when it runs from this checkout (its working directory is the repo root).
rl_is_ours() {
  [ "$(readlink "/proc/$1/cwd" 2>/dev/null)" = "$RL_ROOT" ]
}

# rl_recorded PID → true when PID, or its process group, is recorded in one of this profile's pid
# files ($RIMELINE_RUN/*.pid) and runs from this checkout: a service of an earlier run.
rl_recorded() {
  local pid="$1" pgid
  rl_is_ours "$pid" || return 1
  pgid="$(sed 's/.*) //' "/proc/$pid/stat" 2>/dev/null | cut -d' ' -f3)"
  cat "$RIMELINE_RUN"/*.pid 2>/dev/null | grep -qxE "$pid${pgid:+|$pgid}"
}

# rl_free_port PORT LABEL → ok when the port is free. Stops what an earlier run of these scripts
# left there (recorded in a pid file); otherwise fails and names the process holding the port.
rl_free_port() {
  local port="$1" label="$2" pid pids foreign=0 i hint
  rl_port_busy "$port" || return 0
  pids="$(rl_port_pids "$port")"
  for pid in $pids; do
    rl_recorded "$pid" || foreign=1
  done
  if [ -n "$pids" ] && [ "$foreign" = 0 ]; then
    for pid in $pids; do
      rl_note "stopping a leftover $label from an earlier run on port $port (pid $pid)"
      rl_kill_tree "$pid" 10
    done
    for ((i = 0; i < 50; i++)); do rl_port_busy "$port" || return 0; sleep 0.1; done
  fi
  hint="stop that process (kill <pid>), or if it is a Rimeline script still running in another terminal, stop it there (Ctrl-C)."
  for pid in $pids; do
    if rl_is_ours "$pid"; then
      hint="it runs from this checkout, so it is probably left over from an earlier run or started by hand: stop it with kill $pid, then try again."
    fi
  done
  rl_fail "Port 127.0.0.1:$port (needed for the $label) is already in use by:
    $(rl_port_owner "$port")" "$hint"
  return 1
}

# ------------------------------------------------------------------ HTTP
# rl_http_status URL → prints the HTTP status code, 000 when nothing answers.
rl_http_status() {
  if command -v curl >/dev/null 2>&1; then
    curl -s -o /dev/null -w '%{http_code}' --max-time 5 "$1" 2>/dev/null || true
  else
    node -e '
      const c = new AbortController(); setTimeout(() => c.abort(), 5000).unref();
      fetch(process.argv[1], { signal: c.signal, redirect: "manual" })
        .then((r) => process.stdout.write(String(r.status)), () => process.stdout.write("000"));
    ' "$1" 2>/dev/null || printf '000'
  fi
}

rl_http_body() {
  if command -v curl >/dev/null 2>&1; then
    curl -s --max-time 5 "$1" 2>/dev/null || true
  else
    node -e 'fetch(process.argv[1]).then((r) => r.text()).then((t) => process.stdout.write(t), () => {})' "$1" 2>/dev/null || true
  fi
}

# rl_wait_http URL SECONDS [PID] → waits until URL answers with any HTTP status. Fails early when
# PID exits. Returns 0 (answered), 1 (timeout), 2 (process exited).
rl_wait_http() {
  local url="$1" timeout="$2" pid="${3:-}" start=$SECONDS code
  while true; do
    code="$(rl_http_status "$url")"
    [ "$code" != 000 ] && [ -n "$code" ] && return 0
    if [ -n "$pid" ] && ! rl_alive "$pid"; then return 2; fi
    [ $((SECONDS - start)) -ge "$timeout" ] && return 1
    sleep 0.3
  done
}

# ------------------------------------------------------------------ local services
# Background services started by this script, in start order; rl_stop_services stops them in
# reverse order. Pid files live in $RIMELINE_RUN/<name>.pid.
RL_SERVICES=()
declare -A RL_SERVICE_PID=()
declare -A RL_SERVICE_LABEL=()

# rl_stop_stale NAME LABEL → stops a process recorded in NAME.pid by an earlier run that crashed.
rl_stop_stale() {
  local name="$1" label="$2" file pid
  file="$RIMELINE_RUN/$name.pid"
  [ -f "$file" ] || return 0
  pid="$(cat "$file" 2>/dev/null)"
  if rl_alive "$pid" && rl_is_ours "$pid"; then
    rl_note "stopping the $label left running by an earlier run (pid $pid)"
    rl_kill_tree "$pid" 10
  fi
  rm -f "$file"
}

# rl_service_start NAME LABEL READY_URL CMD… → starts CMD in the background (logs in
# $RIMELINE_LOGS/NAME.log), records its pid, waits up to RL_READY_TIMEOUT (30 s) for READY_URL.
rl_service_start() {
  local name="$1" label="$2" url="$3" log pid rc=0
  shift 3
  log="$RIMELINE_LOGS/$name.log"
  mkdir -p "$RIMELINE_LOGS" "$RIMELINE_RUN"
  printf '\n===== %s: %s\n' "$(date '+%F %T')" "$*" >>"$log"
  (cd "$RL_ROOT" && exec setsid "$@" </dev/null >>"$log" 2>&1) &
  pid=$!
  echo "$pid" >"$RIMELINE_RUN/$name.pid"
  RL_SERVICES+=("$name")
  RL_SERVICE_PID[$name]=$pid
  RL_SERVICE_LABEL[$name]=$label
  rl_wait_http "$url" "${RL_READY_TIMEOUT:-30}" "$pid" || rc=$?
  case $rc in
    0) return 0 ;;
    1) rl_fail "The $label did not answer at $url within ${RL_READY_TIMEOUT:-30} s." \
         "look at the log above ($(rl_rel "$log")); if the machine is very slow, set RL_READY_TIMEOUT=120 and retry." "$log" ;;
    *) rl_fail "The $label exited during start-up." "look at the log above ($(rl_rel "$log"))." "$log" ;;
  esac
  return 1
}

# rl_stop_services → stops every service started by rl_service_start, newest first.
rl_stop_services() {
  local i name pid
  for ((i = ${#RL_SERVICES[@]} - 1; i >= 0; i--)); do
    name="${RL_SERVICES[$i]}"
    pid="${RL_SERVICE_PID[$name]}"
    if rl_alive "$pid"; then
      printf '      stopping %s (pid %s) … ' "${RL_SERVICE_LABEL[$name]}" "$pid"
      rl_kill_tree "$pid" 15
      printf 'ok\n'
    fi
    rm -f "$RIMELINE_RUN/$name.pid"
  done
  RL_SERVICES=()
}

rl_start_s3() {
  rl_free_port "$S3_PORT" "S3 fake" || return 1
  rl_service_start s3 "S3 fake" "$S3_ENDPOINT/" \
    "$RL_TSX" "$RL_SCRIPTS/s3-server.ts" --port "$S3_PORT" --dir "$RIMELINE_DATA/s3" --bucket "$S3_BUCKET"
}

rl_start_mail() {
  rl_free_port "$SMTP_PORT" "mail catcher (SMTP)" || return 1
  rl_free_port "$MAIL_HTTP_PORT" "mail catcher (HTTP API)" || return 1
  rl_service_start mail "mail catcher" "$MAIL_CATCHER_URL/health" \
    "$RL_TSX" "$RL_SCRIPTS/mail-catcher.ts" --smtp-port "$SMTP_PORT" --http-port "$MAIL_HTTP_PORT" --dir "$RIMELINE_DATA/mail"
}

# ------------------------------------------------------------------ locks
# One run per profile at a time: .data/<profile>.lock holds the pid of the script that owns the
# profile. A lock whose process is gone is stale and taken over.
rl_lock_holder() {
  local file="$RL_ROOT/.data/$1.lock" pid
  [ -f "$file" ] || return 1
  pid="$(cat "$file" 2>/dev/null)"
  if rl_alive "$pid" && [ "$pid" != "$$" ]; then
    printf '%s' "$pid"
    return 0
  fi
  return 1
}

rl_lock() {
  local profile="$1" holder
  mkdir -p "$RL_ROOT/.data"
  if holder="$(rl_lock_holder "$profile")"; then
    rl_die "Another Rimeline script is already using the $profile profile (pid $holder: $(rl_cmdline "$holder"))." \
      "stop it first (Ctrl-C in its terminal, or: kill $holder)."
  fi
  echo "$$" >"$RL_ROOT/.data/$profile.lock"
  RL_LOCKED_PROFILES+=("$profile")
}
RL_LOCKED_PROFILES=()

rl_unlock_all() {
  local p
  for p in "${RL_LOCKED_PROFILES[@]}"; do
    if [ "$(cat "$RL_ROOT/.data/$p.lock" 2>/dev/null)" = "$$" ]; then rm -f "$RL_ROOT/.data/$p.lock"; fi
  done
  RL_LOCKED_PROFILES=()
}

# rl_wipe_profile_data → removes $RIMELINE_DATA, including a PostgreSQL cluster kept outside the
# repository (see db-start.sh).
rl_wipe_profile_data() {
  local link="$RIMELINE_DATA/pg" target
  if [ -L "$link" ]; then
    target="$(readlink -f "$link")"
    case "$target" in
      /var/lib/postgresql/rimeline/*) rm -rf "$target" ;;
    esac
  fi
  rm -rf "$RIMELINE_DATA"
}

# ------------------------------------------------------------------ PostgreSQL
# rl_pg_vars → sets PGBIN (empty when the server is not installed), RL_PG_AS (the prefix that
# runs a command as the postgres user when we are root) and PGDATA (the profile's cluster:
# $RIMELINE_DATA/pg, or where that symlink points).
rl_pg_vars() {
  PGBIN="$(rl_pg_bindir || true)"
  if [ "$(id -u)" = 0 ]; then
    RL_PG_AS=(runuser -u postgres --)
  else
    RL_PG_AS=()
  fi
  if [ -L "$RIMELINE_DATA/pg" ]; then
    PGDATA="$(readlink -f "$RIMELINE_DATA/pg")"
  else
    PGDATA="$RIMELINE_DATA/pg"
  fi
  export PGDATA
}

rl_pg_initialized() {
  [ -f "$PGDATA/PG_VERSION" ]
}

rl_pg_running() {
  [ -n "$PGBIN" ] && rl_pg_initialized && "${RL_PG_AS[@]}" "$PGBIN/pg_ctl" status -D "$PGDATA" >/dev/null 2>&1
}

# rl_pg_stop_profile PROFILE → fast stop of another profile's cluster (used when test and bench
# share a port and one of them was left running). Quiet when it is not running.
rl_pg_stop_profile() {
  [ -e "$RL_ROOT/.data/$1/pg" ] || return 0
  bash "$RL_SCRIPTS/db-stop.sh" "$1" --quiet
}

# ------------------------------------------------------------------ the start sequence
# rl_up STEP_FN → the start sequence that start.sh, test.sh and bench.sh share, for the profile
# env.sh set: npm packages, the PostgreSQL server (apt-get when absent) and the profile's cluster,
# the S3 fake, the mail catcher, the migrations. STEP_FN "label" opens each step, so the caller
# keeps its own numbering. Exits on a failure (the caller's EXIT trap stops what was started).
# Sets RL_PG_OWNED=1 when this run started PostgreSQL (or took over a cluster an earlier, dead run
# left): the caller stops it on exit. A cluster started by hand (npm run db:start) stays running.
RL_PG_OWNED=0
rl_up() {
  local step_fn="$1" owner applied
  "$step_fn" "Checking npm packages"
  if rl_need_npm_ci; then
    printf 'installing with npm ci (about a minute) … '
    rl_npm_ci "$RIMELINE_LOGS/npm-ci.log" || rl_die "npm ci failed." \
      "check the network access to the npm registry and the log above, then run this again." "$RIMELINE_LOGS/npm-ci.log"
    rl_ok "installed"
  else
    rl_ok "up to date"
  fi

  "$step_fn" "Starting PostgreSQL on 127.0.0.1:$PG_PORT"
  if ! rl_pg_bindir >/dev/null; then
    printf 'not installed, installing Debian'"'"'s postgresql package (apt-get) … '
    rl_apt_install "$RIMELINE_LOGS/apt.log" postgresql || exit 1
  fi
  rl_pg_vars
  if rl_pg_running; then
    owner="$(cat "$RIMELINE_RUN/pg.owner" 2>/dev/null || true)"
    if [ -n "$owner" ] && [ "$owner" != "$$" ] && ! rl_alive "$owner"; then
      RL_PG_OWNED=1
      echo "$$" >"$RIMELINE_RUN/pg.owner"
      rl_ok "already running (left by an earlier run; it will be stopped on exit)"
    else
      rl_ok "already running (started with npm run db:start; it stays running on exit)"
    fi
  else
    RL_PG_OWNED=1
    echo "$$" >"$RIMELINE_RUN/pg.owner"
    rl_run_logged "$RIMELINE_LOGS/db-start.log" bash "$RL_SCRIPTS/db-start.sh" "$RIMELINE_PROFILE" \
      || rl_die "PostgreSQL did not start." "read the messages above; 'npm run db:start' shows the same steps." "$RIMELINE_LOGS/db-start.log"
    rl_ok "database $PG_DB"
  fi

  "$step_fn" "Starting the S3 fake on 127.0.0.1:$S3_PORT"
  rl_stop_stale s3 "S3 fake"
  rl_start_s3 || exit 1
  rl_ok "bucket $S3_BUCKET"

  "$step_fn" "Starting the mail catcher on 127.0.0.1:$SMTP_PORT (API on :$MAIL_HTTP_PORT)"
  rl_stop_stale mail "mail catcher"
  rl_start_mail || exit 1
  rl_ok

  "$step_fn" "Running database migrations"
  [ -f "$RL_ROOT/db/migrate.ts" ] || rl_die "db/migrate.ts is missing." "restore it from git (git checkout -- db/migrate.ts)."
  rl_run_logged "$RIMELINE_LOGS/migrate.log" "$RL_TSX" "$RL_ROOT/db/migrate.ts" latest \
    || rl_die "The migrations failed." "fix the failing migration shown above, then run this again." "$RIMELINE_LOGS/migrate.log"
  applied="$(rl_last_run "$RIMELINE_LOGS/migrate.log" | grep -c ': Success' || true)"
  if [ "$applied" -gt 0 ]; then rl_ok "$applied applied"; else rl_ok "already up to date"; fi
}
