import 'server-only';
import pino from 'pino';
import { env } from '@/lib/env';
import { currentRequestId } from '@/lib/request-context';

// Every line carries reqId: the id of the request (the x-request-id response header) or
// background job it came from, or 'none' for work outside both (start-up, pool events).
export function createLogger(destination?: pino.DestinationStream): pino.Logger {
  return pino({ level: env.LOG_LEVEL, base: { app: 'rimeline' }, mixin: () => ({ reqId: currentRequestId() ?? 'none' }) }, destination);
}

export const logger = createLogger();
