// Which environment the backup and restore commands work on, the same way the other scripts do:
//   --profile <dev|test|bench|laneN>   that local profile (env.sh sets its database, bucket, ports);
//   else RIMELINE_TEST_PROFILE         the lane a test run uses;
//   else DATABASE_URL from the shell   the app's own environment (production, or a shell that
//                                      sourced env.sh);
//   else                               the dev profile.
import { execFileSync } from 'node:child_process';
import path from 'node:path';

const root = path.resolve(import.meta.dirname, '../..');
const PROFILE = /^(dev|test|bench|lane[1-9])$/;

/** The variables env.sh exports for a profile (it also creates the profile's secret file once). */
export function profileVariables(profile: string): Record<string, string> {
  if (!PROFILE.test(profile)) throw new Error(`Unknown profile "${profile}" (use dev, test, bench or lane1…lane9).`);
  const out = execFileSync('bash', ['-c', 'source "$0/docker-free-scripts/env.sh" "$1" >/dev/null && env -0', root, profile], { encoding: 'utf8' });
  const vars: Record<string, string> = {};
  for (const line of out.split('\0')) {
    const eq = line.indexOf('=');
    if (eq > 0) vars[line.slice(0, eq)] = line.slice(eq + 1);
  }
  return vars;
}

/** Applies the chosen profile to process.env (before any app module reads it); returns its name or null. */
export function applyProfile(flag: string | undefined): string | null {
  const profile = flag ?? process.env.RIMELINE_TEST_PROFILE ?? (process.env.DATABASE_URL ? undefined : 'dev');
  if (!profile) return null;
  Object.assign(process.env, profileVariables(profile));
  return profile;
}

/** "database rimeline_lane1 on 127.0.0.1:54401" with no password in it. */
export function describeDatabase(url: string): string {
  const u = new URL(url);
  return `database ${decodeURIComponent(u.pathname.replace(/^\//, ''))} on ${u.hostname}${u.port ? `:${u.port}` : ''}`;
}
