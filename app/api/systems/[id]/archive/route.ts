import { idParamsSchema } from '@/lib/api/schemas';
import { withApi } from '@/lib/api/handler';
import { setSystemArchived } from '@/lib/systems/service';

// POST /api/systems/:id/archive: hide a system (kept with its history, restorable).
export const POST = withApi({ permission: 'systems.write', params: idParamsSchema }, async ({ actor, params }) => setSystemArchived(actor, params.id, true));
