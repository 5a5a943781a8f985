// Starts the outbox worker in each Node.js server process. Claims use SKIP LOCKED, so any number
// of app copies can run it together.
export async function register(): Promise<void> {
  if (process.env.NEXT_RUNTIME !== 'nodejs') return;
  if (process.env.NEXT_PHASE === 'phase-production-build') return;
  const { deliverDueMail } = await import('@/lib/mail/outbox');
  const { logger } = await import('@/lib/logger');
  const tick = () => {
    deliverDueMail().catch((error: unknown) => logger.warn({ err: String(error) }, 'outbox pass failed'));
  };
  setInterval(tick, 10_000).unref();
  setTimeout(tick, 2_000).unref();
}
