#!/usr/bin/env bash
# Regenerates db/schema.gen.ts (the Kysely Database type) from the migrated schema.
#
#   bash docker-free-scripts/db-codegen.sh [extra kysely-codegen flags]    (npm run db:codegen)
#   npm run db:codegen -- --verify      only checks that db/schema.gen.ts is up to date
#
# Creates a scratch database (rimeline_codegen) on the test-profile PostgreSQL (127.0.0.1:54339,
# started and stopped again when it was not running), runs every migration into it, generates the
# types with kysely-codegen and drops the scratch database. Refuses while npm test or npm run
# bench is running (they own that port).
set -Eeuo pipefail
cd "$(dirname "$0")/.."
# shellcheck source=docker-free-scripts/lib.sh
source docker-free-scripts/lib.sh
# shellcheck source=docker-free-scripts/env.sh
source docker-free-scripts/env.sh test

[ -f db/migrate.ts ] || rl_die "db/migrate.ts does not exist." "write the migration runner first (see DEVELOPERS.md)."
if holder="$(rl_lock_holder bench)"; then
  rl_die "npm run bench is running (pid $holder) and uses the test database port." "wait for it to finish, then run this again."
fi
rl_lock test
rl_pg_stop_profile bench

scratch_db=rimeline_codegen
scratch_url="postgres://postgres@127.0.0.1:$PG_PORT/$scratch_db"
started=0
rl_pg_vars
psql_admin() {
  "$PGBIN/psql" -X -q -v ON_ERROR_STOP=1 -h 127.0.0.1 -p "$PG_PORT" -U postgres -d postgres "$@"
}
cleanup() {
  if [ -n "${PGBIN:-}" ] && rl_pg_running; then
    psql_admin -c "DROP DATABASE IF EXISTS $scratch_db WITH (FORCE)" >/dev/null 2>&1 || true
  fi
  if [ "$started" = 1 ]; then bash docker-free-scripts/db-stop.sh test --quiet || true; fi
  rl_unlock_all
}
trap cleanup EXIT

if ! rl_pg_running; then
  bash docker-free-scripts/db-start.sh test >/dev/null
  started=1
  rl_pg_vars
fi
psql_admin -c "DROP DATABASE IF EXISTS $scratch_db WITH (FORCE)" -c "CREATE DATABASE $scratch_db"

echo "Migrating the scratch database $scratch_db …"
DATABASE_URL="$scratch_url" PGDATABASE="$scratch_db" "$RL_TSX" db/migrate.ts latest

verify=0
for a in "$@"; do [ "$a" = --verify ] && verify=1; done
if [ "$verify" = 1 ]; then echo "Checking db/schema.gen.ts against the migrated schema …"; else echo "Generating db/schema.gen.ts …"; fi
# numeric columns are parsed to numbers and dates kept as text at runtime (db/pg-types.ts), so the types say so too.
DATABASE_URL="$scratch_url" node_modules/.bin/kysely-codegen --dialect postgres --url "$scratch_url" \
  --out-file db/schema.gen.ts --numeric-parser number --date-parser string --log-level warn "$@"
if [ "$verify" = 1 ]; then echo "db/schema.gen.ts is up to date."; else echo "Done: db/schema.gen.ts (scratch database dropped)."; fi
