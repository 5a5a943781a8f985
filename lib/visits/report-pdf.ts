import { rgb, type PDFFont } from 'pdf-lib';
import { newReportPdf, pdfSafeText } from '@/lib/reports/pdf-text';
import type { VisitReport } from '@/lib/visits/report-content';

function wrap(text: string, font: PDFFont, size: number, width: number): string[] {
  const lines: string[] = [];
  for (const paragraph of text.split('\n')) {
    let line = '';
    for (const word of paragraph.split(/\s+/)) {
      const candidate = line ? `${line} ${word}` : word;
      if (font.widthOfTextAtSize(candidate, size) > width && line) {
        lines.push(line);
        line = word;
      } else line = candidate;
    }
    lines.push(line);
  }
  return lines;
}

/** A plain, printable A4/letter-safe report (US letter page, margins that fit A4 too). */
export async function renderVisitReportPdf(report: VisitReport): Promise<Uint8Array> {
  const { pdf, regular, bold } = await newReportPdf(report.title);
  const margin = 54;
  const pageSize: [number, number] = [612, 792];
  const width = pageSize[0] - margin * 2;
  let page = pdf.addPage(pageSize);
  let y = pageSize[1] - margin;

  const write = (text: string, opts: { font?: PDFFont; size?: number; gap?: number; color?: [number, number, number] } = {}) => {
    const font = opts.font ?? regular;
    const size = opts.size ?? 10;
    for (const line of wrap(pdfSafeText(text, font), font, size, width)) {
      if (y < margin + size) {
        page = pdf.addPage(pageSize);
        y = pageSize[1] - margin;
      }
      page.drawText(line, { x: margin, y: y - size, size, font, color: rgb(...(opts.color ?? [0.06, 0.09, 0.16])) });
      y -= size * 1.35;
    }
    y -= opts.gap ?? 0;
  };

  write(report.title, { font: bold, size: 16, gap: 8 });
  for (const [k, v] of report.facts) write(`${k}: ${v}`, { size: 10 });
  y -= 8;
  write('Summary', { font: bold, size: 12, gap: 2 });
  write(report.summary, { gap: 8 });
  for (const s of report.sections) {
    write(s.heading, { font: bold, size: 12, gap: 2 });
    for (const l of s.lines) write(`- ${l}`);
    y -= 6;
  }
  y -= 6;
  write(report.caution, { size: 8, color: [0.28, 0.33, 0.41] });
  return pdf.save();
}
