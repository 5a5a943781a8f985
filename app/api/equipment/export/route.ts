import { downloadResponse } from '@/lib/api/download';
import { withApi } from '@/lib/api/handler';
import { exportEquipmentCsv } from '@/lib/equipment/import';
import { listEquipmentQuerySchema } from '@/lib/equipment/schemas';

const exportQuerySchema = listEquipmentQuerySchema.omit({ cursor: true, limit: true });

// GET /api/equipment/export: the filtered equipment list as CSV (same filters as GET /api/equipment).
export const GET = withApi({ query: exportQuerySchema }, async ({ actor, query }) => {
  const csv = await exportEquipmentCsv(actor, query);
  const stamp = new Date().toISOString().slice(0, 10);
  return downloadResponse({ filename: `equipment-${stamp}.csv`, contentType: 'text/csv; charset=utf-8', body: csv });
});
