// Log lines kept in memory, and two requests in flight at once: for the tests of request ids on
// log lines (API routes, pages and actions).
import { Writable } from 'node:stream';

/**
 * A logger (lib/logger) whose JSON lines are parsed into `lines`. The logger is imported on call, not
 * at the top: it reads Next's request storage, which needs the global AsyncLocalStorage that a test
 * of pages sets up first.
 */
export async function captureLog() {
  const { createLogger } = await import('@/lib/logger');
  const lines: Record<string, unknown>[] = [];
  const stream = new Writable({
    write(chunk: Buffer, _enc, done) {
      for (const line of chunk.toString().split('\n').filter(Boolean)) lines.push(JSON.parse(line) as Record<string, unknown>);
      done();
    },
  });
  return { lines, log: createLogger(stream) };
}

/**
 * Starts `first`, which waits on `held` partway, runs `second` to its end, then lets `first` finish:
 * two requests handled at the same time, the first one finishing last.
 */
export async function overlapping(first: (held: Promise<void>) => Promise<unknown>, second: () => Promise<unknown>): Promise<void> {
  let release!: () => void;
  const held = new Promise<void>((r) => (release = r));
  const running = first(held);
  await second();
  release();
  await running;
}
