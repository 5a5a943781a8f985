import { performance } from 'node:perf_hooks';
// Signs a demo user in over HTTP and returns a fetch that carries the session cookie.
export async function signedInFetch(baseUrl: string, email: string, password = 'rimeline-demo') {
  const cookie = await sessionCookie(baseUrl, email, password);
  return (path: string, init: RequestInit = {}) => fetch(`${baseUrl}${path}`, { ...init, headers: { ...(init.headers ?? {}), cookie } });
}

/** Signs a demo user in over HTTP and returns the Cookie header that carries the session (for load tools). */
export async function sessionCookie(baseUrl: string, email: string, password = 'rimeline-demo'): Promise<string> {
  const jar = new Map<string, string>();
  const remember = (res: Response) => {
    for (const c of res.headers.getSetCookie()) {
      const [pair] = c.split(';');
      const [name, ...rest] = pair!.split('=');
      jar.set(name!.trim(), rest.join('='));
    }
  };
  const cookie = () => [...jar].map(([k, v]) => `${k}=${v}`).join('; ');
  const csrfRes = await fetch(`${baseUrl}/api/auth/csrf`);
  remember(csrfRes);
  const { csrfToken } = (await csrfRes.json()) as { csrfToken: string };
  const login = await fetch(`${baseUrl}/api/auth/callback/credentials`, {
    method: 'POST',
    redirect: 'manual',
    headers: { 'content-type': 'application/x-www-form-urlencoded', cookie: cookie() },
    body: new URLSearchParams({ csrfToken, email, password, json: 'true' }),
  });
  remember(login);
  if (![...jar.keys()].some((k) => k.includes('session-token'))) throw new Error(`Sign-in as ${email} failed (${login.status})`);
  return cookie();
}

export function percentile(sorted: number[], p: number): number {
  if (sorted.length === 0) return Number.NaN;
  const i = Math.min(sorted.length - 1, Math.max(0, Math.ceil((p / 100) * sorted.length) - 1));
  return sorted[i]!;
}

export function benchRow(name: string, measured: string, baseline: string, ratio: string, goal: string): void {
  console.log(['BENCH', name, measured, baseline, ratio, goal].join('\t'));
}

/** The route floor: a signed-in GET /api/me (session and actor lookup, no other work), timed once. */
export async function timeFloor(api: (path: string) => Promise<Response>): Promise<number> {
  const t = performance.now();
  const res = await api('/api/me');
  await res.json();
  if (!res.ok) throw new Error(`GET /api/me answered ${res.status}`);
  return performance.now() - t;
}

/**
 * What a route costs beyond the floor, per unit of its SQL: (API − floor) ÷ SQL at p50, from
 * samples taken interleaved in the same run. Goal ≤ 1.5 (issue 17).
 */
export function floorRow(name: string, apiSorted: number[], floorSorted: number[], sqlSorted: number[]): void {
  const a = percentile(apiSorted, 50);
  const f = percentile(floorSorted, 50);
  const s = percentile(sqlSorted, 50);
  benchRow(`${name}, beyond the floor p50`, `API − floor ${(a - f).toFixed(1)} ms (floor ${f.toFixed(1)} ms)`, `SQL via pg ${s.toFixed(1)} ms`, `${((a - f) / s).toFixed(2)}×`, '≤ 1.5');
}
