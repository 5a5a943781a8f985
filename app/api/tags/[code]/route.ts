import { withApi } from '@/lib/api/handler';
import { tagCodeParamsSchema } from '@/lib/tags/schemas';
import { resolveTag } from '@/lib/tags/service';

// GET /api/tags/:code: what this tag opens for the caller (not logged as a scan); unknown or another company's → 404.
export const GET = withApi({ params: tagCodeParamsSchema }, async ({ actor, params }) => resolveTag(actor, params.code));
