// vitest globalSetup. Safety guard: the tests write to and wipe whatever DATABASE_URL points at,
// so refuse to run unless it is a database on this machine. `npm test` exports the test profile's
// DATABASE_URL (postgres://postgres@127.0.0.1:54339/rimeline_test); unit tests need none.
const LOCAL_HOSTS = new Set(['127.0.0.1', 'localhost', '::1', '[::1]']);

export function assertLocalDatabaseUrl(value: string | undefined): void {
  if (!value) return;
  let host: string;
  try {
    host = new URL(value).hostname;
  } catch {
    throw new Error('DATABASE_URL is not a valid URL; refusing to run the tests.');
  }
  if (!LOCAL_HOSTS.has(host)) {
    throw new Error(
      `DATABASE_URL points at "${host}", not at a database on this machine; refusing to run the tests ` +
        '(they modify and delete data). Run them with `npm test`, which uses the local test database.',
    );
  }
}

export default function setup(): void {
  assertLocalDatabaseUrl(process.env.DATABASE_URL);
}
