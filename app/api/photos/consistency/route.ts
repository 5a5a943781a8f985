import { withApi } from '@/lib/api/handler';
import { checkPhotoStorage } from '@/lib/photos/files';

export const runtime = 'nodejs';

// GET /api/photos/consistency: photo objects with no record and records with missing objects (admin).
export const GET = withApi({ permission: 'photos.maintain' }, async ({ actor }) => checkPhotoStorage(actor));
