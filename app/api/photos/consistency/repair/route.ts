import { withApi } from '@/lib/api/handler';
import { repairStorage } from '@/lib/photos/files';

export const runtime = 'nodejs';

// POST /api/photos/consistency/repair: fix what the check finds, then check again (admin).
export const POST = withApi({ permission: 'photos.maintain' }, async ({ actor }) => repairStorage(actor));
