import { AsyncLocalStorage } from 'node:async_hooks';

// The request (or background job) a piece of server work belongs to, without passing it down
// every call: the logger reads it for each line (lib/logger.ts). Work started inside a request,
// such as the mail pass kicked after a commit, keeps that request's id.
const storage = new AsyncLocalStorage<{ requestId: string }>();

export function runWithRequestId<T>(requestId: string, fn: () => T): T {
  return storage.run({ requestId }, fn);
}

export function currentRequestId(): string | undefined {
  return storage.getStore()?.requestId;
}

/** An id for work no request started (the periodic outbox pass): `job-` and a UUID. */
export function newJobId(): string {
  return `job-${crypto.randomUUID()}`;
}
