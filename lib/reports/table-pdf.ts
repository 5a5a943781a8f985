import { PDFDocument, StandardFonts, rgb, type PDFFont } from 'pdf-lib';
import { pdfSafeText } from '@/lib/reports/pdf-text';

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

export async function renderTablePdf(report: TableReport): Promise<Uint8Array> {
  const pdf = await PDFDocument.create();
  pdf.setTitle(report.title);
  pdf.setProducer('Rimeline');
  const regular = await pdf.embedFont(StandardFonts.Helvetica);
  const bold = await pdf.embedFont(StandardFonts.HelveticaBold);
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
    let x = margin;
    for (const c of report.columns) {
      page.drawText(fit(pdfSafeText(c.label, bold), bold, 8, c.width * scale - 4), { x, y: y - 8, size: 8, font: bold });
      x += c.width * scale;
    }
    y -= 13;
    page.drawLine({ start: { x: margin, y: y + 3 }, end: { x: size[0] - margin, y: y + 3 }, thickness: 0.5, color: rgb(0.4, 0.45, 0.5) });
  };
  header();
  for (const row of report.rows) {
    if (y < margin + 20) {
      page = pdf.addPage(size);
      y = size[1] - margin;
      header();
    }
    let x = margin;
    report.columns.forEach((c, i) => {
      page.drawText(fit(pdfSafeText(row[i] ?? '', regular), regular, 8, c.width * scale - 4), { x, y: y - 8, size: 8, font: regular });
      x += c.width * scale;
    });
    y -= 12;
  }
  y -= 8;
  for (const n of report.notes) {
    if (y < margin + 12) {
      page = pdf.addPage(size);
      y = size[1] - margin;
    }
    line(n, regular, 7.5);
  }
  return pdf.save();
}
