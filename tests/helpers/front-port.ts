// A test service that can be stopped and started again behind one address. The app reads its
// service addresses once (lib/env), so a service restarted on a new port would be unreachable;
// a fixed port could be taken by another process (EADDRINUSE under load). Instead a small TCP
// front listens on port 0 for the whole test file and forwards each connection to whatever the
// service currently listens on (itself on port 0), or resets it while the service is stopped.
import { createServer, connect, type Server, type Socket } from 'node:net';
import type { AddressInfo } from 'node:net';

export interface FrontPort {
  /** The port the app is pointed at; fixed for the life of the front. */
  port: number;
  /** Forward new connections to this local port, or refuse them (null: the service is down). */
  setTarget(port: number | null): void;
  /** Resets the connections that are open right now (a stopping service drops them). */
  dropConnections(): void;
  close(): Promise<void>;
}

/** Listens on 127.0.0.1 port 0 and resolves with the port it got. */
export function listenOnFreePort(server: Server | { listen: Server['listen'] }): Promise<number> {
  return new Promise((resolve, reject) => {
    const s = server as Server;
    s.once('error', reject);
    s.listen(0, '127.0.0.1', () => {
      s.off('error', reject);
      resolve((s.address() as AddressInfo).port);
    });
  });
}

export async function openFrontPort(): Promise<FrontPort> {
  let target: number | null = null;
  const open = new Set<Socket>();
  const server = createServer((client) => {
    open.add(client);
    client.on('close', () => open.delete(client));
    client.on('error', () => {});
    if (target === null) {
      client.resetAndDestroy();
      return;
    }
    const upstream = connect(target, '127.0.0.1');
    open.add(upstream);
    upstream.on('close', () => open.delete(upstream));
    upstream.on('error', () => client.resetAndDestroy());
    client.on('error', () => upstream.destroy());
    client.pipe(upstream).pipe(client);
  });
  const port = await listenOnFreePort(server);
  return {
    port,
    setTarget(next) {
      target = next;
    },
    dropConnections() {
      for (const s of open) s.destroy();
      open.clear();
    },
    close() {
      for (const s of open) s.destroy();
      return new Promise((resolve) => server.close(() => resolve()));
    },
  };
}

interface S3rverInstance {
  run(): Promise<AddressInfo>;
  close(): Promise<void>;
}

export interface TestObjectStore {
  /** http://127.0.0.1:<front port>, for S3_ENDPOINT. */
  endpoint: string;
  start(): Promise<void>;
  /** Stops the S3 fake (its files stay, so start() brings the same objects back). */
  stop(): Promise<void>;
  close(): Promise<void>;
}

/** An S3 fake in this process behind a front port; call start() before using it. */
export async function openTestObjectStore(directory: string, buckets: string[] = []): Promise<TestObjectStore> {
  const { createRequire } = await import('node:module');
  const S3rver = createRequire(import.meta.url)('@20minutes/s3rver') as new (o: Record<string, unknown>) => S3rverInstance;
  const front = await openFrontPort();
  let running: S3rverInstance | null = null;
  const store: TestObjectStore = {
    endpoint: `http://127.0.0.1:${front.port}`,
    async start() {
      if (running) return;
      const s3 = new S3rver({
        address: '127.0.0.1',
        port: 0,
        directory,
        silent: true,
        allowMismatchedSignatures: true,
        configureBuckets: buckets.map((name) => ({ name })),
      });
      const address = await s3.run();
      running = s3;
      front.setTarget(address.port);
    },
    async stop() {
      front.setTarget(null);
      front.dropConnections();
      const s3 = running;
      running = null;
      await s3?.close();
    },
    async close() {
      await store.stop();
      await front.close();
    },
  };
  return store;
}
