import type { ReportFile } from '@/lib/reports/service';

export function fileResponse(file: ReportFile): Response {
  const body = typeof file.body === 'string' ? file.body : Buffer.from(file.body);
  return new Response(body, {
    headers: {
      'Content-Type': file.contentType,
      'Content-Disposition': `attachment; filename="${file.filename.replace(/[^\w.-]+/g, '-')}"`,
      'Cache-Control': 'private, no-store',
    },
  });
}
