#!/usr/bin/env bash
# npm test: the whole test suite against real local services (test profile), as CI runs it.
#
#   npm test                              everything: vitest (unit + integration), then Playwright
#   npm test -- --unit-only               vitest only (no build, no browser)
#   npm test -- --e2e-only                Playwright only (still builds the app)
#   npm test -- --e2e-only --no-build     Playwright against the existing test build (.next or NEXT_DIST_DIR)
#   npm test -- tests/unit/money          positional arguments are file filters for the runner(s);
#                                         such a targeted run skips the lint
#   npm test -- --no-lint                 skip the lint (npm run lint runs it alone)
#   npm test -- --e2e-only -- --grep "sign in" --project desktop
#                                         everything after a second -- goes to the runner(s) verbatim
#
# Steps: stop anything an earlier test run left behind and wipe .data/test; install what is
# missing (apt-get: chromium, zbar-tools, poppler-utils, postgresql; npm ci); start PostgreSQL
# (127.0.0.1:54339, database rimeline_test, fsync off), the S3 fake (4571, bucket rimeline-test)
# and the mail catcher (SMTP 1026, API 1081); run the migrations (that sequence is rl_up in lib.sh,
# shared with npm start and npm run bench); the lint (ESLint, eslint.config.mjs: an error fails
# the run, warnings are shown); vitest; next build with the
# test environment; Playwright (its globalSetup resets the database to the demo scenario, its
# webServer starts next on 127.0.0.1:3100).
# Services are stopped on every exit path. The last line printed is always `N passed, N failed`
# (vitest + Playwright; a stage that crashes counts as one failure) and the exit status is
# non-zero when anything failed.
# Reports: .data/test/vitest.json, .data/test/playwright.json, .data/test/playwright-results/
# (traces and screenshots of failures), logs in .data/test/logs/.
set -Eeuo pipefail
cd "$(dirname "$0")/.."
# shellcheck source=docker-free-scripts/lib.sh
source docker-free-scripts/lib.sh

run_unit=1
run_e2e=1
build=1
lint=1
filters=()
runner_args=()
while [ $# -gt 0 ]; do
  case "$1" in
    --unit-only) run_e2e=0 ;;
    --e2e-only) run_unit=0 ;;
    --no-build) build=0 ;;
    --no-lint) lint=0 ;;
    -h|--help) sed -n '2,26p' "$0"; exit 0 ;;
    --) shift; runner_args=("$@"); break ;;
    -*) echo "test.sh: unknown option $1 (runner options go after a second --, see --help)" >&2; exit 2 ;;
    *) filters+=("$1") ;;
  esac
  shift
done
if [ "$run_unit" = 0 ] && [ "$run_e2e" = 0 ]; then
  echo "test.sh: --unit-only and --e2e-only exclude each other" >&2
  exit 2
fi

rl_check_node
# The test profile, or a private lane (lane1…lane4) so that several people can test at once.
profile="${RIMELINE_TEST_PROFILE:-test}"
case "$profile" in test|lane[1-9]) ;; *) echo "test.sh: RIMELINE_TEST_PROFILE must be test or lane1…lane9" >&2; exit 2 ;; esac
# shellcheck source=docker-free-scripts/env.sh
source docker-free-scripts/env.sh "$profile"
RL_DIST="${NEXT_DIST_DIR:-.next}"   # a lane builds into its own folder

TOTAL=8
[ "$run_unit" = 1 ] && TOTAL=$((TOTAL + 1))
[ "$run_e2e" = 1 ] && TOTAL=$((TOTAL + 2))
step=0
next_step() { step=$((step + 1)); rl_step "$step" "$TOTAL" "$1"; }
header() {
  rl_close_line
  step=$((step + 1))
  printf '[%s/%s] %s\n' "$step" "$TOTAL" "$1"
}

stage_failures=()
vitest_rc=skip
playwright_rc=skip
interrupted=0
finished=0

summary() {
  # Prints detail lines, then "PASSED FAILED" as the last line.
  node - "$RIMELINE_DATA/vitest.json" "$vitest_rc" "$RIMELINE_DATA/playwright.json" "$playwright_rc" <<'NODE'
const fs = require('node:fs');
const [vitestFile, vitestRc, pwFile, pwRc] = process.argv.slice(2);
let passed = 0, failed = 0;
const how = (rc) => (rc === 'running' ? 'was interrupted' : `exit ${rc}`);
const read = (f) => { try { return JSON.parse(fs.readFileSync(f, 'utf8')); } catch { return null; } };
if (vitestRc !== 'skip') {
  const r = read(vitestFile);
  if (!r) {
    failed += 1;
    console.log(`  vitest: no report (${how(vitestRc)}), counted as 1 failure`);
  } else {
    let p = r.numPassedTests ?? 0, f = r.numFailedTests ?? 0;
    // A test file that fails to load has no failed test in it: count the file.
    for (const file of r.testResults ?? []) {
      if (file.status === 'failed' && !(file.assertionResults ?? []).some((a) => a.status === 'failed')) f += 1;
    }
    if (f === 0 && vitestRc !== '0') { f = 1; console.log(`  vitest: ${how(vitestRc)} without a failed test, counted as 1 failure`); }
    console.log(`  vitest:     ${p} passed, ${f} failed` + (r.numPendingTests || r.numTodoTests ? `, ${(r.numPendingTests ?? 0) + (r.numTodoTests ?? 0)} skipped` : ''));
    passed += p; failed += f;
  }
}
if (pwRc !== 'skip') {
  const r = read(pwFile);
  if (!r || !r.stats) {
    failed += 1;
    console.log(`  playwright: no report (${how(pwRc)}), counted as 1 failure`);
  } else {
    const s = r.stats;
    let p = (s.expected ?? 0) + (s.flaky ?? 0), f = s.unexpected ?? 0;
    const errors = (r.errors ?? []).length;
    if (errors > 0) { f += errors; console.log(`  playwright: ${errors} error(s) outside tests (e.g. the web server), counted as failures`); }
    if (f === 0 && pwRc !== '0') { f = 1; console.log(`  playwright: ${how(pwRc)} without a failed test, counted as 1 failure`); }
    console.log(`  playwright: ${p} passed, ${f} failed` + (s.flaky ? ` (${s.flaky} flaky)` : '') + (s.skipped ? `, ${s.skipped} skipped` : ''));
    passed += p; failed += f;
  }
}
console.log(`${passed} ${failed}`);
NODE
}

on_exit() {
  local rc=$? out counts passed failed f
  trap '' INT TERM HUP
  rl_stop_watcher
  rl_close_line
  rl_stop_child
  if [ "$finished" = 0 ] && [ "$interrupted" = 0 ] && [ "$rc" != 0 ]; then
    stage_failures+=("a set-up step failed (exit $rc)")
  fi
  echo "Stopping the test services …"
  rl_stop_services
  # The Playwright web server is Playwright's to stop; make sure nothing is left on the port.
  if rl_port_busy "$APP_PORT"; then rl_free_port "$APP_PORT" "test app server" >/dev/null 2>&1 || true; fi
  printf '      stopping PostgreSQL (127.0.0.1:%s) … ' "$PG_PORT"
  if bash docker-free-scripts/db-stop.sh "$profile" --quiet; then printf 'ok\n'; else printf 'failed\n'; fi
  rm -f "$RIMELINE_RUN/pg.owner"
  rl_unlock_all
  rl_stop_reaper
  echo
  echo "Summary"
  out="$(summary 2>&1 || echo "0 1")"
  counts="$(tail -n 1 <<<"$out")"
  printf '%s\n' "$out" | sed '$d'
  passed="${counts% *}"
  failed="${counts#* }"
  for f in "${stage_failures[@]}"; do
    echo "  stage failed: $f (counted as 1 failure)"
    failed=$((failed + 1))
  done
  echo "$passed passed, $failed failed"
  if [ "$interrupted" = 1 ]; then exit 130; fi
  if [ "$failed" -gt 0 ]; then exit 1; fi
  exit 0
}
on_signal() {
  trap '' INT TERM HUP
  interrupted=1
  rl_close_line
  echo
  echo "Received $1, stopping."
  stage_failures+=("interrupted by $1")
  exit 130
}
if [ "$profile" = test ] && holder="$(rl_lock_holder bench)"; then
  rl_fail "npm run bench is running (pid $holder); it uses the same ports as the tests." "wait for it to finish, or stop it (kill $holder)."
  echo "0 passed, 1 failed"
  exit 1
fi
if holder="$(rl_lock_holder "$profile")"; then
  rl_fail "npm test is already running in this checkout (pid $holder: $(rl_cmdline "$holder"))." "wait for it to finish, or stop it (kill $holder)."
  echo "0 passed, 1 failed"
  exit 1
fi
rl_lock "$profile"
trap on_exit EXIT
trap 'on_signal INT' INT
trap 'on_signal TERM' TERM
trap 'on_signal HUP' HUP
rl_watch_parent

# ------------------------------------------------------------------------------------ set-up

next_step "Stopping leftovers and wiping .data/$profile"
rl_stop_stale s3 "S3 fake"
rl_stop_stale mail "mail catcher"
rl_stop_stale app "test app server"
if rl_pg_bindir >/dev/null; then
  bash docker-free-scripts/db-stop.sh "$profile" --quiet
  [ "$profile" = test ] && rl_pg_stop_profile bench   # bench shares the test ports; it is not running (no lock), so stop its database
fi
rl_wipe_profile_data
# shellcheck source=docker-free-scripts/env.sh
source docker-free-scripts/env.sh "$profile"   # a fresh AUTH_SECRET for this run
mkdir -p "$RIMELINE_LOGS" "$RIMELINE_RUN" "$RIMELINE_DATA/screenshots"
rl_start_reaper
rl_ok

next_step "Checking system packages"
missing=()
[ "$run_e2e" = 1 ] && [ ! -x /usr/bin/chromium ] && missing+=(chromium)
command -v zbarimg >/dev/null 2>&1 || missing+=(zbar-tools)
command -v pdftoppm >/dev/null 2>&1 || missing+=(poppler-utils)
rl_pg_bindir >/dev/null || missing+=(postgresql)
if [ "${#missing[@]}" -gt 0 ]; then
  printf 'installing %s with apt-get (a few minutes) … ' "${missing[*]}"
  rl_apt_install "$RIMELINE_LOGS/apt.log" "${missing[@]}" || exit 1
  rl_ok "installed"
else
  rl_ok "all present"
fi

rl_up next_step   # npm packages, PostgreSQL, S3 fake, mail catcher, migrations (lib.sh)

next_step "Linting (ESLint)"
if [ "$lint" = 0 ]; then
  rl_ok "skipped (--no-lint)"
elif [ "${#filters[@]}" -gt 0 ]; then
  rl_ok "skipped (a run of chosen files; npm run lint checks the tree)"
elif rl_run_logged "$RIMELINE_LOGS/lint.log" node_modules/.bin/eslint --cache --cache-location ".data/eslint-$profile/" .; then
  warnings="$(rl_last_run "$RIMELINE_LOGS/lint.log" | grep -oE '[0-9]+ warnings?' | tail -n 1 || true)"
  rl_ok "${warnings:-clean}"
else
  rl_fail "The lint found errors (eslint.config.mjs)." "fix them (npm run lint lists them); an import across a layer means the code belongs elsewhere." "$RIMELINE_LOGS/lint.log"
  stage_failures+=("lint")
fi

# ------------------------------------------------------------------------------------ vitest
if [ "$run_unit" = 1 ]; then
  header "Unit and integration tests (vitest)"
  vitest_rc=running
  rl_run_shown node_modules/.bin/vitest run --config tests/vitest.config.ts --passWithNoTests \
    --reporter=default --reporter=json --outputFile="$RIMELINE_DATA/vitest.json" \
    "${filters[@]}" "${runner_args[@]}" && vitest_rc=0 || vitest_rc=$?
fi

# ------------------------------------------------------------------------------------ Playwright
if [ "$run_e2e" = 1 ]; then
  next_step "Building the app for the test profile (next build)"
  if [ "$build" = 0 ] && [ -f "$RL_DIST/BUILD_ID" ] && [ "$(cat "$RL_DIST/rimeline-profile" 2>/dev/null)" = "$profile" ]; then
    rl_ok "skipped (--no-build, reusing the existing test build)"
    built=1
  else
    [ "$build" = 0 ] && printf 'no test build to reuse, building … '
    rm -f "$RL_DIST/rimeline-profile"
    built=0
    if rl_build "$RIMELINE_LOGS/build.log"; then
      echo "$profile" >"$RL_DIST/rimeline-profile"
      built=1
      rl_ok
    else
      rl_fail "next build failed, so the browser tests cannot run." "fix the build error above (full output: $(rl_rel "$RIMELINE_LOGS")/build.log)." "$RIMELINE_LOGS/build.log"
      stage_failures+=("next build")
    fi
  fi

  if [ "$built" = 1 ]; then
    header "Browser tests (Playwright, Chromium, app on $APP_URL)"
    if rl_free_port "$APP_PORT" "test app server"; then
      playwright_rc=running
      rl_run_shown node_modules/.bin/playwright test --config tests/playwright.config.ts --pass-with-no-tests \
        "${filters[@]}" "${runner_args[@]}" && playwright_rc=0 || playwright_rc=$?
    else
      stage_failures+=("port $APP_PORT busy")
    fi
  fi
fi

finished=1
