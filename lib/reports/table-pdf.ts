import { rgb, type PDFFont } from 'pdf-lib';
import { newReportPdf, pdfSafeText } from '@/lib/reports/pdf-text';

// A landscape table report for printing: title, facts, one table that pages as needed, notes.

export interface TableReport {
  title: string;
  facts: [string, string][];
  columns: { label: string; width: number }[];
  rows: string[][];
  notes: string[];
}

function fit(text: string, font: PDFFont, size: number, width: number): string {
  let t = text;
  while (t.length > 1 && font.widthOfTextAtSize(t, size) > width) t = t.slice(0, -2) + '…';
  return t;
}

/** Word-wrapped lines of at most `width`; past `maxLines` the last line is cut with an ellipsis. */
function wrap(text: string, font: PDFFont, size: number, width: number, maxLines: number): string[] {
  const lines: string[] = [];
  let current = '';
  for (const word of text.split(/\s+/).filter(Boolean)) {
    const next = current ? `${current} ${word}` : word;
    if (current && font.widthOfTextAtSize(next, size) > width) {
      lines.push(current);
      current = word;
    } else current = next;
  }
  if (current) lines.push(current);
  if (lines.length <= maxLines) return lines.map((l) => fit(l, font, size, width));
  const kept = lines.slice(0, maxLines);
  kept[maxLines - 1] = fit(`${kept[maxLines - 1]} ${lines.slice(maxLines).join(' ')}`, font, size, width);
  return kept.map((l) => fit(l, font, size, width));
}

export async function renderTablePdf(report: TableReport): Promise<Uint8Array> {
  const { pdf, regular, bold } = await newReportPdf(report.title);
  const size: [number, number] = [792, 612];
  const margin = 36;
  const total = report.columns.reduce((a, c) => a + c.width, 0);
  const scale = (size[0] - margin * 2) / total;
  let page = pdf.addPage(size);
  let y = size[1] - margin;
  const line = (text: string, font: PDFFont, fontSize: number) => {
    page.drawText(pdfSafeText(text, font), { x: margin, y: y - fontSize, size: fontSize, font, color: rgb(0.06, 0.09, 0.16) });
    y -= fontSize * 1.4;
  };
  line(report.title, bold, 15);
  for (const [k, v] of report.facts) line(`${k}: ${v}`, regular, 9);
  y -= 6;
  const header = () => {
    const labels = report.columns.map((c) => wrap(pdfSafeText(c.label, bold), bold, 8, c.width * scale - 4, 2));
    let x = margin;
    report.columns.forEach((c, i) => {
      labels[i]!.forEach((text, k) => page.drawText(text, { x, y: y - 8 - k * 10, size: 8, font: bold }));
      x += c.width * scale;
    });
    y -= Math.max(1, ...labels.map((l) => l.length)) * 10 + 3;
    page.drawLine({ start: { x: margin, y: y + 3 }, end: { x: size[0] - margin, y: y + 3 }, thickness: 0.5, color: rgb(0.4, 0.45, 0.5) });
  };
  header();
  for (const row of report.rows) {
    // Long cells (a leak location, a note) wrap onto up to three lines rather than being cut.
    const cells = report.columns.map((c, i) => wrap(pdfSafeText(row[i] ?? '', regular), regular, 8, c.width * scale - 4, 3));
    const height = Math.max(1, ...cells.map((l) => l.length)) * 10 + 2;
    if (y - height < margin) {
      page = pdf.addPage(size);
      y = size[1] - margin;
      header();
    }
    let x = margin;
    report.columns.forEach((c, i) => {
      cells[i]!.forEach((text, k) => page.drawText(text, { x, y: y - 8 - k * 10, size: 8, font: regular }));
      x += c.width * scale;
    });
    y -= height;
  }
  y -= 8;
  for (const n of report.notes) {
    for (const text of wrap(pdfSafeText(n, regular), regular, 7.5, size[0] - margin * 2, 6)) {
      if (y < margin + 12) {
        page = pdf.addPage(size);
        y = size[1] - margin;
      }
      page.drawText(text, { x: margin, y: y - 7.5, size: 7.5, font: regular, color: rgb(0.06, 0.09, 0.16) });
      y -= 7.5 * 1.4;
    }
  }
  return pdf.save();
}
