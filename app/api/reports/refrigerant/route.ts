import { withApi } from '@/lib/api/handler';
import { downloadResponse } from '@/lib/api/download';
import { refrigerantReportQuerySchema } from '@/lib/reports/schemas';
import { refrigerantReport, reportFile } from '@/lib/reports/service';

// GET /api/reports/refrigerant?systemId=&year=&format=csv|pdf: the system's refrigerant record for a calendar year.
export const GET = withApi({ permission: 'reports.read', query: refrigerantReportQuerySchema }, async ({ actor, query }) => {
  const report = await refrigerantReport(actor, query.systemId, query.year, actor);
  return downloadResponse(await reportFile(report, query.format, `refrigerant-${query.year}-${report.facts[2]![1].split(' (')[0]}`));
});
