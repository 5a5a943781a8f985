import { withApi } from '@/lib/api/handler';
import { listUsers } from '@/lib/users/service';

// GET /api/users: the company's users (admin).
export const GET = withApi({}, async ({ actor }) => ({ items: await listUsers(actor), nextCursor: null }));
