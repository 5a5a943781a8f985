#!/usr/bin/env bash
# npm start: everything Rimeline needs on one machine, without containers (dev profile).
#
#   npm start                    build when needed, then run the production server
#   npm start -- --rebuild       always run next build first
#   npm run dev                  same services, but `next dev` (hot reload) instead of build + start
#
# Steps: npm ci when node_modules is missing or older than package-lock.json; the PostgreSQL server
# (apt-get when absent); the private cluster in .data/dev/pg on 127.0.0.1:54329; the S3 fake
# (127.0.0.1:4570) and the mail catcher (SMTP 127.0.0.1:1025, API 127.0.0.1:1080); migrations;
# the demo data (the seed does nothing when the demo company exists); next build (skipped when
# the build folder (.next, or NEXT_DIST_DIR) holds a build of the dev profile and no source file is newer than its BUILD_ID); the app
# on 127.0.0.1:3000, reached at http://localhost:3000.
# Logs: .data/dev/logs/. Ctrl-C (or SIGTERM) stops everything this run started, newest first.
set -Eeuo pipefail
cd "$(dirname "$0")/.."
# shellcheck source=docker-free-scripts/lib.sh
source docker-free-scripts/lib.sh

mode=start
rebuild=0
for arg in "$@"; do
  case "$arg" in
    --dev) mode=dev ;;
    --rebuild) rebuild=1 ;;
    -h|--help) sed -n '2,14p' "$0"; exit 0 ;;
    *) echo "start.sh: unknown option $arg (use --rebuild, or npm run dev)" >&2; exit 2 ;;
  esac
done

rl_check_node
# shellcheck source=docker-free-scripts/env.sh
source docker-free-scripts/env.sh dev
mkdir -p "$RIMELINE_LOGS" "$RIMELINE_RUN"
LOGS="$RIMELINE_LOGS"
TOTAL=8
step=0
next_step() { step=$((step + 1)); rl_step "$step" "$TOTAL" "$1"; }

stopping=0

cleanup() {
  local rc=$?
  trap '' INT TERM HUP
  [ "$stopping" = 1 ] && return
  stopping=1
  rl_stop_watcher
  rl_close_line
  rl_stop_child
  if [ "${#RL_SERVICES[@]}" -gt 0 ] || [ "$RL_PG_OWNED" = 1 ]; then
    echo "Stopping Rimeline …"
  fi
  rl_stop_services
  if [ "$RL_PG_OWNED" = 1 ]; then
    printf '      stopping PostgreSQL (127.0.0.1:%s) … ' "$PG_PORT"
    if bash docker-free-scripts/db-stop.sh dev --quiet; then printf 'ok\n'; fi
    rm -f "$RIMELINE_RUN/pg.owner"
  fi
  rl_unlock_all
  rl_stop_reaper
  [ "$rc" = 0 ] || [ "$rc" -ge 128 ] || echo "Rimeline did not start (see the message above)."
  [ "$rc" -ge 128 ] && echo "Stopped."
  return 0
}
on_signal() {
  trap '' INT TERM HUP
  rl_close_line
  echo
  echo "Received $1."
  if [ "$1" = INT ]; then exit 130; else exit 143; fi
}
trap cleanup EXIT
trap 'on_signal INT' INT
trap 'on_signal TERM' TERM
trap 'on_signal HUP' HUP
rl_watch_parent

rl_lock dev
rl_start_reaper
echo "Rimeline ($mode) — data in $(rl_rel "$RIMELINE_DATA"), logs in $(rl_rel "$LOGS")"

# ------------------------------------------------------------------- npm, PostgreSQL, S3, mail, migrations
rl_up next_step

# ---------------------------------------------------------------------------------------- demo data
next_step "Loading the demo data (only when absent)"
[ -f docker-free-scripts/seed.ts ] || rl_die "docker-free-scripts/seed.ts is missing." "restore it from git."
rl_run_logged "$LOGS/seed.log" "$RL_TSX" docker-free-scripts/seed.ts \
  || rl_die "Loading the demo data failed." "read the log above; 'npm run db:seed' runs the same step." "$LOGS/seed.log"
rl_ok "$(rl_last_run "$LOGS/seed.log" | grep -v '^[[:space:]]*$' | tail -n 1 | sed 's/^[[:space:]]*//' | cut -c1-90)"

# ---------------------------------------------------------------------------------------- build
if [ "$mode" = dev ]; then
  next_step "Building the app"
  rl_ok "skipped (next dev compiles on demand)"
else
  next_step "Building the app (next build)"
  why=""
  if [ "$rebuild" = 1 ]; then
    why="asked for with --rebuild"
  elif [ ! -f "$RL_DIST/BUILD_ID" ]; then
    why="no build yet"
  elif [ "$(cat "$RL_DIST/rimeline-profile" 2>/dev/null)" != dev ]; then
    why="the last build was made for another profile"
  else
    newer="$(find . \( -path ./node_modules -o -path "./$RL_DIST" -o -path "./.next*" -o -path ./.data -o -path ./.git -o -path ./tests \
      -o -path ./docker-free-scripts \) -prune -o -type f \( -name '*.ts' -o -name '*.tsx' -o -name '*.js' -o -name '*.mjs' \
      -o -name '*.cjs' -o -name '*.css' -o -name '*.json' -o -path './public/*' \) -newer "$RL_DIST/BUILD_ID" -print -quit)"
    [ -n "$newer" ] && why="${newer#./} changed"
  fi
  if [ -z "$why" ]; then
    rl_ok "up to date, skipped (npm start -- --rebuild forces a build)"
  else
    printf '%s, building (about a minute) … ' "$why"
    rm -f "$RL_DIST/rimeline-profile"
    rl_build "$LOGS/build.log" \
      || rl_die "next build failed." "fix the error shown above (full output: $(rl_rel "$LOGS")/build.log), then run npm start again." "$LOGS/build.log"
    echo dev >"$RL_DIST/rimeline-profile"
    rl_ok
  fi
fi

# ---------------------------------------------------------------------------------------- app
next_step "Starting the app on 127.0.0.1:$APP_PORT"
rl_stop_stale app "app"
rl_free_port "$APP_PORT" "app" || exit 1
if [ "$mode" = dev ]; then
  RL_READY_TIMEOUT=90 rl_service_start app "app (next dev)" "http://127.0.0.1:$APP_PORT/api/health" \
    node "$RL_NEXT" dev -H 127.0.0.1 -p "$APP_PORT" || exit 1
else
  RL_READY_TIMEOUT=90 rl_service_start app "app" "http://127.0.0.1:$APP_PORT/api/health" \
    "${RL_SERVE[@]}" "$APP_PORT" || exit 1
fi
health_code="$(rl_http_status "http://127.0.0.1:$APP_PORT/api/health")"
if [ "$health_code" = 200 ]; then
  rl_ok "healthy"
else
  rl_ok
  rl_warn "/api/health answered $health_code: $(rl_http_body "http://127.0.0.1:$APP_PORT/api/health" | cut -c1-200)"
fi

cat <<EOF

  Rimeline is running at  $APP_URL
  Mail inbox (admins):    $APP_URL/settings/mail

  Demo sign-ins (password: rimeline-demo)
    admin@rimeline.test        admin
    office@rimeline.test       office
    tech@rimeline.test         technician
    owner@client-one.test      client user of the first client
    owner@client-two.test      client user of the second client

  Logs: $(rl_rel "$LOGS")/ (app.log, s3.log, mail.log, postgres.log)
  Press Ctrl-C to stop everything.

EOF

# Run until Ctrl-C, or until one of the services exits on its own.
while true; do
  wait -n "${RL_SERVICE_PID[app]}" "${RL_SERVICE_PID[s3]}" "${RL_SERVICE_PID[mail]}" || true
  for name in app s3 mail; do
    if ! rl_alive "${RL_SERVICE_PID[$name]}"; then
      rl_fail "The ${RL_SERVICE_LABEL[$name]} stopped unexpectedly." \
        "read the log above, then run npm start again." "$LOGS/$name.log"
      exit 1
    fi
  done
done
