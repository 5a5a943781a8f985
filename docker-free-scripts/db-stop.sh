#!/usr/bin/env bash
# Stops the private PostgreSQL cluster of a profile (fast shutdown: open sessions are ended).
#
#   bash docker-free-scripts/db-stop.sh [dev|test|bench] [--quiet]    (npm run db:stop → dev)
set -Eeuo pipefail
cd "$(dirname "$0")/.."
# shellcheck source=docker-free-scripts/lib.sh
source docker-free-scripts/lib.sh
# shellcheck source=docker-free-scripts/env.sh
source docker-free-scripts/env.sh "${1:-dev}"
quiet=0
[ "${2:-}" = --quiet ] && quiet=1

rl_pg_vars
if ! rl_pg_running; then
  [ "$quiet" = 1 ] || echo "PostgreSQL ($RIMELINE_PROFILE) is not running."
  exit 0
fi
mkdir -p "$RIMELINE_LOGS"
if ! "${RL_PG_AS[@]}" "$PGBIN/pg_ctl" -D "$PGDATA" -m fast -w -t 60 stop >>"$RIMELINE_LOGS/pg_ctl.log" 2>&1; then
  rl_die "PostgreSQL ($RIMELINE_PROFILE) did not stop." "look at the log above; as a last resort: kill \$(head -1 $PGDATA/postmaster.pid)" "$PGDATA/server.log"
fi
[ "$quiet" = 1 ] || echo "PostgreSQL ($RIMELINE_PROFILE) stopped."
