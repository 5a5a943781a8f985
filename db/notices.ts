import { pg } from '@/db/pg-types';

// One connection that only LISTENs on a channel, for an in-process cache that must forget an entry
// as soon as a transaction in any app copy commits a change (PostgreSQL delivers NOTIFY on
// commit). While it is not listening, notices sent meanwhile are lost, so `up` is false and the
// cache must not answer from memory; `down` is called once per loss so it can forget everything,
// and `up` once listening, so that answers read before then are not kept.

export interface NoticeChannel {
  /** True while the LISTEN is confirmed and the connection open. */
  readonly up: boolean;
  /** Connects when not up and no attempt is running; resolves when listening, or after a failure. */
  connect(): Promise<void>;
  close(): Promise<void>;
}

export interface NoticeHandlers {
  notice(payload: string): void;
  /** Listening from now on: what was read before may predate a notice that was never received. */
  up(): void;
  down(error?: Error): void;
}

export function noticeChannel(url: string, channel: string, handlers: NoticeHandlers): NoticeChannel {
  if (!/^[a-z_][a-z0-9_]*$/.test(channel)) throw new Error(`not a channel name: ${channel}`);
  let client: InstanceType<typeof pg.Client> | null = null;
  let up = false;
  let connecting: Promise<void> | null = null;
  let closed = false;

  const lose = (c: InstanceType<typeof pg.Client>, error?: Error) => {
    if (client !== c) return;
    client = null;
    const was = up;
    up = false;
    c.end().catch(() => undefined);
    if (was) handlers.down(error);
  };

  const connect = () => {
    if (up || closed) return Promise.resolve();
    connecting ??= (async () => {
      // keepAlive: a connection cut without a reset is noticed rather than trusted for hours.
      const c = new pg.Client({ connectionString: url, keepAlive: true });
      client = c;
      c.on('error', (error) => lose(c, error));
      c.on('end', () => lose(c));
      c.on('notification', (msg) => {
        if (msg.channel === channel && client === c && up) handlers.notice(msg.payload ?? '');
      });
      try {
        await c.connect();
        await c.query(`listen ${channel}`);
        if (client === c && !closed) {
          up = true;
          handlers.up();
        } else await c.end();
      } catch (error) {
        lose(c, error as Error);
      }
    })().finally(() => {
      connecting = null;
    });
    return connecting;
  };

  return {
    get up() {
      return up;
    },
    connect,
    async close() {
      closed = true;
      const c = client;
      client = null;
      up = false;
      await connecting?.catch(() => undefined);
      await c?.end().catch(() => undefined);
    },
  };
}
