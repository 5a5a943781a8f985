import { withApi } from '@/lib/api/handler';
import { downloadResponse } from '@/lib/api/download';
import { siteReportQuerySchema } from '@/lib/reports/schemas';
import { reportFile, siteEquipmentReport } from '@/lib/reports/service';

// GET /api/reports/site-equipment?siteId=&format=csv|pdf: every unit of a site with age, expected life and condition.
export const GET = withApi({ permission: 'reports.read', query: siteReportQuerySchema }, async ({ actor, query }) => {
  const report = await siteEquipmentReport(actor, query.siteId);
  return downloadResponse(await reportFile(report, query.format, `site-equipment-${report.facts[1]![1]}`));
});
