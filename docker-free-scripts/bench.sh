#!/usr/bin/env bash
# npm run bench: runs every tests/bench/*.bench.ts against fresh local services (bench profile)
# and prints one table of the figures.
#
#   npm run bench                     all benchmarks
#   npm run bench -- pricing          only files whose name contains "pricing"
#   npm run bench -- --keep           reuse .data/bench from the previous run (no wipe)
#   npm run bench -- --no-build       start the app from the profile's last build (no next build)
#   npm run bench -- --no-app         skip building and starting the app (benches that measure the
#                                     HTTP API then print an error row); by default the app is built
#                                     and run on 127.0.0.1:3100 and BENCH_APP_URL=http://localhost:3100
#                                     is exported
#
# The bench profile has its own data (.data/bench, database rimeline_bench, bucket rimeline-bench)
# but the test ports (PostgreSQL 54339, S3 4571, SMTP 1026, mail API 1081, app 3100), so it refuses
# to run while npm test is running.
#
# Contract for a bench file: run with `node_modules/.bin/tsx <file>` and the bench environment
# exported (DATABASE_URL, S3_*, SMTP_URL, …); print one line per figure on stdout:
#   BENCH<TAB>name<TAB>measured<TAB>baseline<TAB>ratio<TAB>goal
# and exit 0. Anything else on stdout/stderr goes to .data/bench/logs/<file>.log. A bench that
# exits non-zero gets an "error" row; slow figures never fail this script (exit 0 unless the
# services themselves cannot start).
# Note: modules that `import 'server-only'` throw outside Next; bench files should import the
# pure modules (lib/calc, db) directly.
set -Eeuo pipefail
cd "$(dirname "$0")/.."
# shellcheck source=docker-free-scripts/lib.sh
source docker-free-scripts/lib.sh

keep=0
with_app=1
build=1
filters=()
for arg in "$@"; do
  case "$arg" in
    --keep) keep=1 ;;
    --with-app) with_app=1 ;;
    --no-app) with_app=0 ;;
    --no-build) build=0 ;;
    -h|--help) sed -n '2,25p' "$0"; exit 0 ;;
    -*) echo "bench.sh: unknown option $arg" >&2; exit 2 ;;
    *) filters+=("$arg") ;;
  esac
done

rl_check_node
# The bench profile, or a private lane (lane1…lane9) while someone else runs the tests.
profile="${RIMELINE_BENCH_PROFILE:-bench}"
case "$profile" in bench|lane[1-9]) ;; *) echo "bench.sh: RIMELINE_BENCH_PROFILE must be bench or lane1…lane9" >&2; exit 2 ;; esac
# shellcheck source=docker-free-scripts/env.sh
source docker-free-scripts/env.sh "$profile"
RL_DIST="${NEXT_DIST_DIR:-.next}"

TOTAL=6
[ "$with_app" = 1 ] && TOTAL=8
step=0
next_step() { step=$((step + 1)); rl_step "$step" "$TOTAL" "$1"; }

stopped=0
stop_all() {
  [ "$stopped" = 1 ] && return 0
  stopped=1
  rl_stop_watcher
  rl_close_line
  rl_stop_child
  echo "Stopping the bench services …"
  rl_stop_services
  printf '      stopping PostgreSQL (127.0.0.1:%s) … ' "$PG_PORT"
  if bash docker-free-scripts/db-stop.sh "$profile" --quiet; then printf 'ok\n'; else printf 'failed\n'; fi
  rm -f "$RIMELINE_RUN/pg.owner"
  rl_unlock_all
  rl_stop_reaper
}
cleanup() {
  local rc=$?
  trap '' INT TERM HUP
  stop_all
  exit "$rc"
}
if [ "$profile" = bench ] && holder="$(rl_lock_holder test)"; then
  rl_die "npm test is running (pid $holder); it uses the same ports as the benchmarks." "wait for it to finish, then run npm run bench again."
fi
rl_lock "$profile"
trap cleanup EXIT
trap 'rl_close_line; echo; echo "Interrupted."; exit 130' INT
trap 'rl_close_line; echo; echo "Terminated."; exit 143' TERM
trap 'rl_close_line; echo; echo "Hang-up."; exit 129' HUP
rl_watch_parent


# ------------------------------------------------------------------------------------ set-up
next_step "Preparing .data/$profile"
rl_stop_stale s3 "S3 fake"
rl_stop_stale mail "mail catcher"
rl_stop_stale app "app"
if rl_pg_bindir >/dev/null; then
  [ "$profile" = bench ] && rl_pg_stop_profile test   # shares the port; not running a test (no lock), so a leftover
  [ "$keep" = 0 ] && bash docker-free-scripts/db-stop.sh "$profile" --quiet
fi
if [ "$keep" = 0 ]; then
  rl_wipe_profile_data
  # shellcheck source=docker-free-scripts/env.sh
  source docker-free-scripts/env.sh "$profile"
fi
mkdir -p "$RIMELINE_LOGS" "$RIMELINE_RUN"
rl_start_reaper
if [ "$keep" = 1 ]; then rl_ok "kept the previous data (--keep)"; else rl_ok "wiped"; fi

# The phone and offline benches drive Debian's chromium, as the browser tests do.
if [ ! -x /usr/bin/chromium ]; then
  printf '      installing chromium with apt-get (a few minutes) … '
  rl_apt_install "$RIMELINE_LOGS/apt.log" chromium || exit 1
  rl_ok "installed"
fi

rl_up next_step   # npm packages, PostgreSQL, S3 fake, mail catcher, migrations (lib.sh)

# Benches that time the JSON API need the app over HTTP.
if [ "$with_app" = 1 ]; then
  if [ "$build" = 1 ]; then
    next_step "Building the app for the bench profile (next build)"
    rm -f "$RL_DIST/rimeline-profile"
    rl_build "$RIMELINE_LOGS/build.log" \
      || rl_die "next build failed." "fix the build error above." "$RIMELINE_LOGS/build.log"
    echo bench >"$RL_DIST/rimeline-profile"
    rl_ok
  else
    next_step "Reusing the last build in $RL_DIST (--no-build)"
    [ -f "$RL_DIST/BUILD_ID" ] || rl_die "There is no build in $RL_DIST." "run once without --no-build."
    rl_ok
  fi
  next_step "Starting the app on 127.0.0.1:$APP_PORT"
  rl_free_port "$APP_PORT" "app" || exit 1
  RL_READY_TIMEOUT=90 rl_service_start app "app" "http://127.0.0.1:$APP_PORT/api/health" \
    "${RL_SERVE[@]}" "$APP_PORT" || exit 1
  export BENCH_APP_URL="$APP_URL"
  rl_ok
fi

# ------------------------------------------------------------------------------------ benches
rows="$RIMELINE_DATA/bench-results.tsv"
: >"$rows"
shopt -s nullglob
files=("${BENCH_DIR:-tests/bench}"/*.bench.ts)
shopt -u nullglob
selected=()
for f in "${files[@]}"; do
  if [ "${#filters[@]}" -eq 0 ]; then
    selected+=("$f")
  else
    for pat in "${filters[@]}"; do
      case "$(basename "$f")" in *"$pat"*) selected+=("$f"); break ;; esac
    done
  fi
done

echo
if [ "${#selected[@]}" -eq 0 ]; then
  echo "No benchmark files found (tests/bench/*.bench.ts${filters[*]:+ matching ${filters[*]}})."
fi
for f in "${selected[@]}"; do
  name="$(basename "$f" .bench.ts)"
  log="$RIMELINE_LOGS/bench-$name.log"
  out="$RIMELINE_DATA/bench-$name.out"
  printf '  %s … ' "$f"
  t0=$SECONDS
  rc=0
  setsid "$RL_TSX" "$f" </dev/null >"$out" 2>>"$log" &
  rl_child_started $!
  wait "$RL_CHILD" || rc=$?
  rl_child_done
  cat "$out" >>"$log"
  found="$(grep -c $'^BENCH\t' "$out" || true)"
  grep $'^BENCH\t' "$out" | cut -f2- >>"$rows" || true
  if [ "$rc" != 0 ]; then
    printf '%s\terror\t-\t-\t-\n' "$name" >>"$rows"
    printf 'error (exit %s after %s s; log: %s)\n' "$rc" $((SECONDS - t0)) "$(rl_rel "$log")"
  elif [ "$found" = 0 ]; then
    printf '%s\t(no BENCH lines)\t-\t-\t-\n' "$name" >>"$rows"
    printf 'done, but printed no BENCH line (%s s; log: %s)\n' $((SECONDS - t0)) "$(rl_rel "$log")"
  else
    printf 'ok, %s figure(s) (%s s)\n' "$found" $((SECONDS - t0))
  fi
done

stop_all
echo
node - "$rows" <<'NODE'
const rows = require('node:fs').readFileSync(process.argv[2], 'utf8').split('\n').filter((l) => l.length > 0)
  .map((l) => { const c = l.split('\t'); return Array.from({ length: 5 }, (_, i) => (c[i] ?? '').trim() || '-'); });
const table = [['benchmark', 'measured', 'baseline', 'ratio', 'goal'], null, ...rows];
const len = (s) => [...s].length;
const w = [0, 1, 2, 3, 4].map((i) => Math.max(...table.filter(Boolean).map((r) => len(r[i]))));
for (const r of table) {
  const cells = r ?? w.map((n) => '-'.repeat(n));
  console.log(cells.map((c, i) => c + ' '.repeat(w[i] - len(c))).join('  ').trimEnd());
}
NODE
echo
echo "Raw figures: $(rl_rel "$rows")"
