# shellcheck shell=bash
# Environment for one local profile of Rimeline. Sourced, never executed:
#
#   source docker-free-scripts/env.sh dev     # or: test, bench
#
# Every docker-free script sources this, and a developer can source it in a bash shell to get the
# same values (then `psql` connects to the profile's database, `node_modules/.bin/tsx db/migrate.ts
# latest` migrates it, and so on). It only sets variables; it starts nothing. It overrides values
# already present in the environment, so a shell pointed at another database cannot leak into the
# local profiles.
#
#              dev                 test                  bench
#   PostgreSQL 127.0.0.1:54329     127.0.0.1:54339       127.0.0.1:54339
#   database   rimeline            rimeline_test         rimeline_bench
#   S3 fake    127.0.0.1:4570      127.0.0.1:4571        127.0.0.1:4571
#   bucket     rimeline            rimeline-test         rimeline-bench
#   SMTP       127.0.0.1:1025      127.0.0.1:1026        127.0.0.1:1026
#   mail API   127.0.0.1:1080      127.0.0.1:1081        127.0.0.1:1081
#   app        localhost:3000      localhost:3100        localhost:3100
#   data       .data/dev           .data/test            .data/bench
#
# test and bench share ports, so they never run at the same time (the scripts refuse to).
# lane1 … lane9 are private copies of the test profile for people working in one checkout at once
# (RIMELINE_TEST_PROFILE=lane2 npm test …): PostgreSQL 5440N, S3 458N, SMTP 104N, mail API 109N,
# app 320N, data .data/laneN, build folder .next-laneN.

_rl_env_profile="${1:-${RIMELINE_PROFILE:-dev}}"
if [ -n "${BASH_SOURCE[0]:-}" ]; then
  _rl_env_root="$(cd "$(dirname "${BASH_SOURCE[0]}")/.." && pwd)"
else
  _rl_env_root="$(pwd)"
fi

case "$_rl_env_profile" in
  dev)   _rl_env_ports="54329 rimeline 4570 rimeline 1025 1080 3000" ;;
  test)  _rl_env_ports="54339 rimeline_test 4571 rimeline-test 1026 1081 3100" ;;
  bench) _rl_env_ports="54339 rimeline_bench 4571 rimeline-bench 1026 1081 3100" ;;
  lane[1-9])
    _rl_env_n="${_rl_env_profile#lane}"
    _rl_env_ports="5440$_rl_env_n rimeline_lane$_rl_env_n 458$_rl_env_n rimeline-lane$_rl_env_n 104$_rl_env_n 109$_rl_env_n 320$_rl_env_n"
    export NEXT_DIST_DIR=".next-lane$_rl_env_n"
    unset _rl_env_n
    ;;
  *)
    echo "env.sh: unknown profile '$_rl_env_profile' (use dev, test, bench or lane1…lane9)" >&2
    unset _rl_env_profile _rl_env_root
    return 1 2>/dev/null || exit 1
    ;;
esac

export RIMELINE_ROOT="$_rl_env_root"
export RIMELINE_PROFILE="$_rl_env_profile"
export RIMELINE_DATA="$RIMELINE_ROOT/.data/$RIMELINE_PROFILE"
export RIMELINE_LOGS="$RIMELINE_DATA/logs"
export RIMELINE_RUN="$RIMELINE_DATA/run"
read -r PG_PORT PG_DB S3_PORT S3_BUCKET SMTP_PORT MAIL_HTTP_PORT APP_PORT <<<"$_rl_env_ports"
export PG_PORT PG_DB S3_PORT S3_BUCKET SMTP_PORT MAIL_HTTP_PORT APP_PORT

# What the app reads (validated by lib/env.ts).
export DATABASE_URL="postgres://postgres@127.0.0.1:$PG_PORT/$PG_DB"
export S3_ENDPOINT="http://127.0.0.1:$S3_PORT"
export S3_REGION="us-east-1"
export S3_ACCESS_KEY_ID="S3RVER"
export S3_SECRET_ACCESS_KEY="S3RVER"
export S3_FORCE_PATH_STYLE="true"
export SMTP_URL="smtp://127.0.0.1:$SMTP_PORT"
export MAIL_FROM="Rimeline <no-reply@rimeline.test>"
export MAIL_CATCHER_URL="http://127.0.0.1:$MAIL_HTTP_PORT"
export APP_URL="http://localhost:$APP_PORT"
export NEXTAUTH_URL="$APP_URL"
export DEMO_MODE="true"
export NEXT_TELEMETRY_DISABLED=1

# psql and other libpq tools connect to the profile's database without arguments.
export PGHOST=127.0.0.1 PGPORT="$PG_PORT" PGUSER=postgres PGDATABASE="$PG_DB"

# The signing secret: generated once per data folder and kept in it (dev keeps it across runs;
# test and bench wipe their folder, so they get a fresh one every run).
_rl_env_secret_file="$RIMELINE_DATA/auth-secret"
if [ ! -s "$_rl_env_secret_file" ]; then
  mkdir -p "$RIMELINE_DATA"
  ( umask 077
    if command -v openssl >/dev/null 2>&1; then
      openssl rand -hex 32 >"$_rl_env_secret_file"
    else
      node -e "process.stdout.write(require('node:crypto').randomBytes(32).toString('hex') + '\n')" >"$_rl_env_secret_file"
    fi )
fi
AUTH_SECRET="$(tr -d '\n' <"$_rl_env_secret_file")"
export AUTH_SECRET
export NEXTAUTH_SECRET="$AUTH_SECRET"

unset _rl_env_profile _rl_env_root _rl_env_ports _rl_env_secret_file
