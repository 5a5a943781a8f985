import { AsyncLocalStorage } from 'node:async_hooks';
import { workUnitAsyncStorage } from 'next/dist/server/app-render/work-unit-async-storage.external';
import { isWellFormedRequestId, REQUEST_ID_HEADER } from '@/lib/api/request-id';

// The request (or background job) a piece of server work belongs to, without passing it down
// every call: the logger reads it for each line (lib/logger.ts). Work started inside a request,
// such as the mail pass kicked after a commit, keeps that request's id.
const storage = new AsyncLocalStorage<{ requestId: string }>();

export function runWithRequestId<T>(requestId: string, fn: () => T): T {
  return storage.run({ requestId }, fn);
}

/**
 * The id of the request or job this code runs for: the one `runWithRequestId` set (route
 * handlers through withApi, background jobs), else the x-request-id header proxy.ts put on the
 * request of the page or server action being run.
 */
export function currentRequestId(): string | undefined {
  return storage.getStore()?.requestId ?? pageOrActionRequestId();
}

/**
 * Pages and server actions have no wrapper to run them inside `runWithRequestId`, and `headers()`
 * is async (a log line is written synchronously). Next keeps each request's headers in its own
 * async storage, shared through a global so every bundle sees the same one; reading it here is
 * synchronous and has none of `headers()`'s side effects (it would mark a prerender dynamic).
 * Only a live request counts: a prerender or cache scope has no request id. The header is checked
 * again, so nothing a client sent unchecked reaches a log line.
 * `tests/integration/request-id.test.ts` runs this against Next's storage, so a Next upgrade that
 * moves it fails there rather than quietly logging `none`.
 */
function pageOrActionRequestId(): string | undefined {
  const store = workUnitAsyncStorage.getStore();
  if (store?.type !== 'request') return undefined;
  const id = store.headers.get(REQUEST_ID_HEADER);
  return isWellFormedRequestId(id) ? id : undefined;
}

/** An id for work no request started (the periodic outbox pass): `job-` and a UUID. */
export function newJobId(): string {
  return `job-${crypto.randomUUID()}`;
}
