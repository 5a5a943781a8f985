#!/usr/bin/env bash
# Starts the private PostgreSQL cluster of a profile and creates its database.
#
#   bash docker-free-scripts/db-start.sh [dev|test|bench]      (npm run db:start → dev)
#
# - Installs Debian's postgresql package with apt-get when no server is installed.
# - Creates the cluster in .data/<profile>/pg on first use (initdb as the postgres user:
#   PostgreSQL refuses to run as root), trust authentication, UTF-8, C.UTF-8 locale.
#   When the postgres user cannot reach the repository folder (a checkout under /root, say) or
#   the socket path would be too long, the cluster is kept under /var/lib/postgresql/rimeline/
#   and .data/<profile>/pg is a symlink to it.
# - Starts it on 127.0.0.1:<port> only, with its unix socket inside the data folder; the test
#   profile runs with fsync off (throwaway data).
# - Creates the profile's database when absent and checks that pg_trgm is available.
# Idempotent: an already running cluster is left as it is.
set -Eeuo pipefail
cd "$(dirname "$0")/.."
# shellcheck source=docker-free-scripts/lib.sh
source docker-free-scripts/lib.sh
# shellcheck source=docker-free-scripts/env.sh
source docker-free-scripts/env.sh "${1:-dev}"
mkdir -p "$RIMELINE_LOGS"

rl_pg_vars
if [ -z "$PGBIN" ]; then
  echo "The PostgreSQL server is not installed; installing Debian's postgresql package (apt-get) …"
  rl_apt_install "$RIMELINE_LOGS/apt.log" postgresql || exit 1
  rl_pg_vars
  [ -n "$PGBIN" ] || rl_die "apt-get finished but no initdb was found under /usr/lib/postgresql/*/bin." \
    "install the PostgreSQL server by hand (apt-get install -y postgresql) and check /usr/lib/postgresql."
fi
if [ "$(id -u)" = 0 ] && ! id postgres >/dev/null 2>&1; then
  rl_die "There is no 'postgres' system user to run the server as (PostgreSQL refuses to run as root)." \
    "reinstall the server package: apt-get install --reinstall -y postgresql-common postgresql"
fi

# Where the postgres user can reach, with a unix socket path short enough (limit ~107 bytes).
rl_pg_location_ok() {
  local dir="$1"
  [ $(( ${#dir} + 20 )) -le 100 ] || return 1
  if [ "${#RL_PG_AS[@]}" -gt 0 ]; then
    "${RL_PG_AS[@]}" test -x "$(dirname "$dir")" 2>/dev/null || return 1
  fi
  return 0
}

if [ ! -e "$RIMELINE_DATA/pg" ] && [ ! -L "$RIMELINE_DATA/pg" ]; then
  mkdir -p "$RIMELINE_DATA"
  if rl_pg_location_ok "$RIMELINE_DATA/pg"; then
    mkdir -p "$RIMELINE_DATA/pg"
  else
    hash="$(printf '%s' "$RIMELINE_ROOT" | cksum | cut -d' ' -f1)"
    if [ "$(id -u)" = 0 ] && [ -d /var/lib/postgresql ]; then
      outside="/var/lib/postgresql/rimeline/$hash/$RIMELINE_PROFILE"
    else
      outside="${TMPDIR:-/tmp}/rimeline-pg-$(id -u)-$hash/$RIMELINE_PROFILE"
    fi
    echo "note: the postgres user cannot use $(rl_rel "$RIMELINE_DATA")/pg (a parent folder is not"
    echo "      traversable by other users, or the path is too long for a unix socket)."
    echo "      The cluster is kept in $outside instead, linked from .data/$RIMELINE_PROFILE/pg."
    echo "      To keep it inside the repository, make every parent folder traversable"
    echo "      (e.g. chmod o+x on each), delete .data/$RIMELINE_PROFILE/pg and start again."
    mkdir -p "$outside"
    ln -s "$outside" "$RIMELINE_DATA/pg"
  fi
  rl_pg_vars
fi

if ! rl_pg_initialized; then
  mkdir -p "$PGDATA"
  if [ "$(id -u)" = 0 ]; then
    chown postgres:postgres "$PGDATA"
    if ! "${RL_PG_AS[@]}" test -w "$PGDATA" 2>/dev/null; then
      rl_die "The postgres user cannot write to $PGDATA." \
        "make every parent folder of the repository traversable by other users (chmod o+x …), or delete .data/$RIMELINE_PROFILE/pg and let this script place the cluster elsewhere."
    fi
  fi
  chmod 700 "$PGDATA"
  echo "Creating the PostgreSQL cluster in $(rl_rel "$PGDATA") …"
  if ! "${RL_PG_AS[@]}" "$PGBIN/initdb" -D "$PGDATA" -U postgres --auth=trust -E UTF8 --locale=C.UTF-8 \
      >"$RIMELINE_LOGS/initdb.log" 2>&1; then
    rl_die "initdb failed for $PGDATA." "read the log above; delete .data/$RIMELINE_PROFILE/pg and retry once the cause is fixed." \
      "$RIMELINE_LOGS/initdb.log"
  fi
fi
ln -sfn "$PGDATA/server.log" "$RIMELINE_LOGS/postgres.log"

if rl_pg_running; then
  echo "PostgreSQL ($RIMELINE_PROFILE) was already running."
else
  if rl_port_busy "$PG_PORT"; then
    rl_die "Port 127.0.0.1:$PG_PORT is already in use by:
    $(rl_port_owner "$PG_PORT")" \
      "stop that process first. If it is the other local profile's database (test and bench share this port): npm run db:stop -- test (or bench)."
  fi
  # random_page_cost 1.1 (the usual setting for SSD or cached data): with the default 4.0 the
  # planner reads a whole 100k-row table rather than walk an index for one client's 50 sites.
  opts="-c listen_addresses=127.0.0.1 -p $PG_PORT -k '$PGDATA' -c random_page_cost=1.1"
  if [ "$RIMELINE_PROFILE" = test ] || [[ "$RIMELINE_PROFILE" == lane* ]]; then
    opts+=" -c fsync=off -c synchronous_commit=off -c full_page_writes=off"
  fi
  if ! "${RL_PG_AS[@]}" "$PGBIN/pg_ctl" -D "$PGDATA" -l "$PGDATA/server.log" -w -t 60 -o "$opts" start \
      >>"$RIMELINE_LOGS/pg_ctl.log" 2>&1; then
    tail -n 5 "$RIMELINE_LOGS/pg_ctl.log" >&2 || true
    rl_die "PostgreSQL did not start on 127.0.0.1:$PG_PORT." \
      "read the server log above ($(rl_rel "$RIMELINE_LOGS")/postgres.log). A stale cluster can be removed with: rm -rf .data/$RIMELINE_PROFILE/pg (this deletes that profile's data)." \
      "$PGDATA/server.log"
  fi
fi

psql_admin() {
  "$PGBIN/psql" -X -q -v ON_ERROR_STOP=1 -h 127.0.0.1 -p "$PG_PORT" -U postgres -d postgres "$@"
}
if [ "$(psql_admin -tAc "SELECT 1 FROM pg_database WHERE datname = '$PG_DB'")" != 1 ]; then
  psql_admin -c "CREATE DATABASE \"$PG_DB\"" >/dev/null \
    || rl_die "Could not create the database $PG_DB." "check $(rl_rel "$RIMELINE_LOGS")/postgres.log" "$PGDATA/server.log"
  echo "Created database $PG_DB."
fi
if [ "$(psql_admin -tAc "SELECT 1 FROM pg_available_extensions WHERE name = 'pg_trgm'")" != 1 ]; then
  rl_die "The pg_trgm extension is not available in this PostgreSQL installation." \
    "install the contrib modules: apt-get install -y postgresql-contrib"
fi
echo "PostgreSQL ($RIMELINE_PROFILE) is running on 127.0.0.1:$PG_PORT, database $PG_DB ($DATABASE_URL)."
