// Browser tests start from the demo scenario exactly, whatever the integration tests left behind.
import { createTestDb, resetToDemo } from '../helpers/db';

export default async function globalSetup(): Promise<void> {
  const db = createTestDb();
  try {
    await resetToDemo(db);
  } finally {
    await db.destroy();
  }
}
