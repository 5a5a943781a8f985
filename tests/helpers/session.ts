import { NextRequest } from 'next/server';
import type { Actor } from '@/lib/auth/actor';

// Route handlers read the signed-in user through @/lib/auth; tests replace it with this holder.
export const session: { actor: Actor | null } = { actor: null };

export function mockAuthModule() {
  return {
    requireActor: async () => {
      const { AppError } = await import('@/lib/errors');
      if (!session.actor) throw new AppError('unauthorized');
      return session.actor;
    },
    getActor: async () => session.actor,
  };
}

type Handler = (req: NextRequest, ctx: { params: Promise<Record<string, string>> }) => Promise<Response>;

export interface CallResult {
  status: number;
  body: unknown;
}

/** Calls a route handler export the way Next does: a request plus awaited params. */
export async function call(
  handler: Handler,
  { method = 'GET', path = '/api/x', params = {}, json, rawBody, headers = {} }: { method?: string; path?: string; params?: Record<string, string>; json?: unknown; rawBody?: string; headers?: Record<string, string> } = {},
): Promise<CallResult> {
  const body = rawBody ?? (json !== undefined ? JSON.stringify(json) : undefined);
  const req = new NextRequest(`http://localhost${path}`, {
    method,
    body,
    headers: { ...(body !== undefined ? { 'content-type': 'application/json' } : {}), ...headers },
  });
  const res = await handler(req, { params: Promise.resolve(params) });
  const text = await res.text();
  const isJson = (res.headers.get('content-type') ?? '').includes('json');
  return { status: res.status, body: text ? (isJson ? JSON.parse(text) : text) : null };
}
