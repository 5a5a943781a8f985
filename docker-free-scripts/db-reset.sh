#!/usr/bin/env bash
# Drops and recreates the dev database (no questions asked). The next `npm start` migrates it and
# loads the demo data again.
#
#   bash docker-free-scripts/db-reset.sh          database only
#   bash docker-free-scripts/db-reset.sh --all    also empties the dev object store and mail inbox
#
# Refuses while `npm start` / `npm run dev` is running. Starts the dev PostgreSQL if needed and
# stops it again afterwards in that case.
set -Eeuo pipefail
cd "$(dirname "$0")/.."
# shellcheck source=docker-free-scripts/lib.sh
source docker-free-scripts/lib.sh
# shellcheck source=docker-free-scripts/env.sh
source docker-free-scripts/env.sh dev
all=0
case "${1:-}" in
  --all) all=1 ;;
  "") ;;
  *) echo "usage: db-reset.sh [--all]" >&2; exit 2 ;;
esac

rl_lock dev
started=0
cleanup() {
  if [ "$started" = 1 ]; then bash docker-free-scripts/db-stop.sh dev --quiet || true; fi
  rl_unlock_all
}
trap cleanup EXIT

rl_pg_vars
if ! rl_pg_running; then
  bash docker-free-scripts/db-start.sh dev >/dev/null
  started=1
  rl_pg_vars
fi
"$PGBIN/psql" -X -q -v ON_ERROR_STOP=1 -h 127.0.0.1 -p "$PG_PORT" -U postgres -d postgres \
  -c "DROP DATABASE IF EXISTS \"$PG_DB\" WITH (FORCE)" -c "CREATE DATABASE \"$PG_DB\""
echo "Dropped and recreated the dev database $PG_DB (it is empty now)."
if [ "$all" = 1 ]; then
  rm -rf "$RIMELINE_DATA/s3" "$RIMELINE_DATA/mail"
  echo "Emptied the dev object store ($(rl_rel "$RIMELINE_DATA")/s3) and mail inbox ($(rl_rel "$RIMELINE_DATA")/mail)."
fi
echo "Next: npm start (runs the migrations and loads the demo data), or npm run db:start && npm run db:migrate && npm run db:seed."
