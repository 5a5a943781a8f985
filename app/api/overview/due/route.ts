import { withApi } from '@/lib/api/handler';
import { dueWork } from '@/lib/overview/due';

// GET /api/overview/due: maintenance due by each system's interval and leak inspections by rule (office).
export const GET = withApi({ permission: 'due.read' }, async ({ actor }) => ({ items: await dueWork(actor), nextCursor: null }));
