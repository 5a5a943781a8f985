import { withApi } from '@/lib/api/handler';
import { listLayouts } from '@/lib/tags/print-runs';

// GET /api/tags/layouts: the label layouts a print run can use (rows of label_layouts).
export const GET = withApi({ permission: 'tags.print' }, async ({ actor }) => listLayouts(actor));
