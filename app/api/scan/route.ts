import { withApi } from '@/lib/api/handler';
import { scanSchema } from '@/lib/tags/schemas';
import { scanTag } from '@/lib/tags/service';

// POST /api/scan: log a scan of a tag and answer where it leads, with the equipment page's data.
export const POST = withApi({ permission: 'tags.scan', body: scanSchema }, async ({ actor, body }) => scanTag(actor, body.code, body.via));
