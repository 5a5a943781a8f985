import type { ErrorBody, ErrorCode, ErrorIssue } from '@/lib/errors';

// Browser-side fetcher for TanStack Query: every failure becomes an ApiError built from the
// server's one error shape.
export class ApiError extends Error {
  constructor(
    readonly status: number,
    readonly code: ErrorCode | 'network',
    message: string,
    readonly issues: ErrorIssue[] = [],
  ) {
    super(message);
    this.name = 'ApiError';
  }
}

export async function apiFetch<T>(path: string, init: RequestInit & { json?: unknown } = {}): Promise<T> {
  const { json, headers, ...rest } = init;
  let res: Response;
  try {
    res = await fetch(path, {
      ...rest,
      headers: { Accept: 'application/json', ...(json !== undefined ? { 'Content-Type': 'application/json' } : {}), ...headers },
      body: json !== undefined ? JSON.stringify(json) : rest.body,
    });
  } catch {
    throw new ApiError(0, 'network', 'No connection. Check the signal and try again; nothing was lost on the server.');
  }
  if (res.status === 204) return undefined as T;
  const data: unknown = await res.json().catch(() => null);
  if (!res.ok) {
    const body = data as Partial<ErrorBody> | null;
    throw new ApiError(res.status, body?.error?.code ?? 'internal', body?.error?.message ?? `Request failed (${res.status}).`, body?.error?.issues ?? []);
  }
  return data as T;
}
