import type { Instrumentation } from 'next';

// Starts the outbox worker in each Node.js server process. Claims use SKIP LOCKED, so any number
// of app copies can run it together.
export async function register(): Promise<void> {
  if (process.env.NEXT_RUNTIME !== 'nodejs') return;
  if (process.env.NEXT_PHASE === 'phase-production-build') return;
  const { deliverDueMail } = await import('@/lib/mail/outbox');
  const { logger } = await import('@/lib/logger');
  const { newJobId, runWithRequestId } = await import('@/lib/request-context');
  // Each pass gets its own id, so its log lines can be told apart from a request's.
  const tick = () =>
    runWithRequestId(newJobId(), () => {
      deliverDueMail().catch((error: unknown) => logger.warn({ err: String(error) }, 'outbox pass failed'));
    });
  setInterval(tick, 10_000).unref();
  setTimeout(tick, 2_000).unref();
}

// Next reports an error thrown by a page render, a server action or a route handler without withApi
// here (withApi catches and logs its own). Next's own console line has no request id; this pino line
// has the one proxy.ts put on the request, so an operator finds it from the response's x-request-id.
// A render can report one error more than once (each part of the page that awaited it).
export const onRequestError: Instrumentation.onRequestError = async (error, request, context) => {
  if (process.env.NEXT_RUNTIME !== 'nodejs') return;
  const { logger } = await import('@/lib/logger');
  const { runWithRequestId } = await import('@/lib/request-context');
  const { isWellFormedRequestId, REQUEST_ID_HEADER } = await import('@/lib/api/request-id');
  const header = request.headers[REQUEST_ID_HEADER];
  // The path without its query: a query may hold a sign-in token.
  const details = { err: error, method: request.method, path: request.path.split('?')[0], routeType: context.routeType, routePath: context.routePath, renderSource: context.renderSource };
  const write = () => logger.error(details, 'unhandled error in a page, server action or route');
  if (typeof header === 'string' && isWellFormedRequestId(header)) runWithRequestId(header, write);
  else write();
};
