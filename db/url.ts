// Where the database is: DATABASE_URL, or the dev profile's private cluster
// (docker-free-scripts/env.sh) for a script run without the profile's environment.
export const DEFAULT_DATABASE_URL = 'postgres://postgres@127.0.0.1:54329/rimeline';

export function databaseUrl(): string {
  return process.env.DATABASE_URL || DEFAULT_DATABASE_URL;
}
