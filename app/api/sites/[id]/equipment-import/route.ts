import { z } from 'zod';
import { idParamsSchema } from '@/lib/api/schemas';
import { withApi } from '@/lib/api/handler';
import { importEquipmentCsv } from '@/lib/equipment/import';

const bodySchema = z.object({
  csv: z.string().min(1, 'Choose a CSV file.').max(5_000_000, 'The file is larger than 5 MB.'),
  commit: z.boolean().default(false),
});

// POST /api/sites/:id/equipment-import: check a CSV ({ csv }) and, with { commit: true } and no problems, import it in one transaction.
export const POST = withApi({ permission: 'equipment.import', params: idParamsSchema, body: bodySchema, maxBodyBytes: 6_000_000 }, async ({ actor, params, body }) =>
  importEquipmentCsv(actor, params.id, body.csv, body.commit),
);
