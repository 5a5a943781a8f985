// Request ids on the log lines of pages and server actions, which withApi does not wrap: the
// logger reads the x-request-id that proxy.ts put on the request from Next's own request scope.
// The scope is made here with Next's own store constructor and storage, as `next start` makes it
// for a page render or an action, so a Next upgrade that moves them fails this file.
import { AsyncLocalStorage } from 'node:async_hooks';
import { describe, expect, it, vi } from 'vitest';
import { captureLog, overlapping } from '@/tests/helpers/log-capture';

// What Next's server does first thing (node-environment-baseline): its storages need this global.
(globalThis as { AsyncLocalStorage?: unknown }).AsyncLocalStorage ??= AsyncLocalStorage;

const { NextRequest } = await import('next/server');
const { workUnitAsyncStorage } = await import('next/dist/server/app-render/work-unit-async-storage.external');
const { createRequestStore } = await import('next/dist/server/async-storage/request-store');
const { proxy } = await import('@/proxy');
const { runWithRequestId } = await import('@/lib/request-context');

/** The request headers the page receives after the proxy: Next applies its x-middleware-request-* overrides. */
function headersAfterProxy(path: string, incoming: Record<string, string> = {}): { headers: Record<string, string>; responseId: string | null } {
  const res = proxy(new NextRequest(`http://localhost${path}`, { headers: incoming }));
  const prefix = 'x-middleware-request-';
  const headers: Record<string, string> = { ...incoming };
  res.headers.forEach((value, name) => {
    if (name.startsWith(prefix)) headers[name.slice(prefix.length)] = value;
  });
  return { headers, responseId: res.headers.get('x-request-id') };
}

/** Runs fn the way Next runs a page render or a server action: inside its request store. */
function inNextRequest<T>(phase: 'render' | 'action', headers: Record<string, string>, fn: () => T): T {
  const store = createRequestStore({
    phase,
    headers,
    onUpdateCookies: undefined,
    url: { pathname: '/clients', search: '' },
    rootParams: {},
    implicitTags: { tags: [], expirationsByCacheKind: new Map() } as never,
    resumeDataCache: null,
    previewProps: undefined,
    isHmrRefresh: false,
    serverComponentsHmrCache: undefined,
    hmrRefreshHash: undefined,
    stagedFallbackParams: null,
  });
  return workUnitAsyncStorage.run(store, fn);
}

describe('log lines of pages and server actions', () => {
  it('carry the id the proxy kept, and a page response says the same id', async () => {
    const { lines, log } = await captureLog();
    const { headers, responseId } = headersAfterProxy('/clients', { 'x-request-id': 'page-request-0001' });
    expect(responseId).toBe('page-request-0001');
    await inNextRequest('render', headers, async () => {
      log.info('rendering the page');
      // A service call awaited by the page, and work it leaves running, keep the id.
      await new Promise((r) => setTimeout(r, 1));
      log.warn('after an await');
    });
    expect(lines.map((l) => [l.msg, l.reqId])).toEqual([
      ['rendering the page', 'page-request-0001'],
      ['after an await', 'page-request-0001'],
    ]);
  });

  it('carry the id the proxy made when the request came without one (a server action post)', async () => {
    const { lines, log } = await captureLog();
    const { headers, responseId } = headersAfterProxy('/settings');
    const made = headers['x-request-id'];
    expect(made).toMatch(/^[0-9a-f-]{36}$/);
    expect(responseId).toBe(made);
    await inNextRequest('action', headers, async () => log.info('inside the action'));
    expect(lines.map((l) => l.reqId)).toEqual([made]);
  });

  it('keep two requests apart', async () => {
    const { lines, log } = await captureLog();
    await overlapping(
      (held) =>
        inNextRequest('render', { 'x-request-id': 'first-page-01' }, async () => {
          await held;
          log.info('first');
        }),
      () => inNextRequest('action', { 'x-request-id': 'second-action' }, async () => log.info('second')),
    );
    expect(lines.map((l) => [l.msg, l.reqId])).toEqual([
      ['second', 'second-action'],
      ['first', 'first-page-01'],
    ]);
  });

  it('never log a malformed header as an id, and an id set by withApi or a job wins', async () => {
    const { lines, log } = await captureLog();
    inNextRequest('render', { 'x-request-id': 'bad id\n{"reqId":"forged"}' }, () => log.info('malformed'));
    inNextRequest('render', { 'x-request-id': 'from-the-page-1' }, () => runWithRequestId('from-withapi-1', () => log.info('route')));
    log.info('outside any request');
    expect(lines.map((l) => [l.msg, l.reqId])).toEqual([
      ['malformed', 'none'],
      ['route', 'from-withapi-1'],
      ['outside any request', 'none'],
    ]);
  });

  it('say none in a scope that is not a live request (a prerender has no request id)', async () => {
    const { lines, log } = await captureLog();
    workUnitAsyncStorage.run({ type: 'prerender-legacy', headers: new Headers({ 'x-request-id': 'prerender-id-01' }) } as never, () => log.info('prerendering'));
    expect(lines.map((l) => l.reqId)).toEqual(['none']);
  });
});

describe('an error a page or server action throws', () => {
  it('is logged once by onRequestError with the request id and the path without its query', async () => {
    const { onRequestError } = await import('@/instrumentation');
    const { logger } = await import('@/lib/logger');
    const { currentRequestId } = await import('@/lib/request-context');
    const seen: [Record<string, unknown>, string, string | undefined][] = [];
    const spy = vi.spyOn(logger, 'error').mockImplementation(((obj: Record<string, unknown>, msg: string) => void seen.push([obj, msg, currentRequestId()])) as never);
    vi.stubEnv('NEXT_RUNTIME', 'nodejs');
    try {
      const boom = new Error('boom');
      const context = { routerKind: 'App Router', routePath: '/visits/[id]', routeType: 'render', revalidateReason: undefined } as const;
      await onRequestError(boom, { path: '/visits/abc?token=secret', method: 'GET', headers: { 'x-request-id': 'failed-page-01' } }, context);
      await onRequestError(boom, { path: '/settings', method: 'POST', headers: { 'x-request-id': 'not well formed' } }, { ...context, routeType: 'action' });
      expect(seen.map(([obj, msg, id]) => [obj.path, obj.routeType, obj.err, msg, id])).toEqual([
        ['/visits/abc', 'render', boom, 'unhandled error in a page, server action or route', 'failed-page-01'],
        ['/settings', 'action', boom, 'unhandled error in a page, server action or route', undefined],
      ]);
    } finally {
      spy.mockRestore();
      vi.unstubAllEnvs();
    }
  });
});
