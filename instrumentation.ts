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
