import { PDFDocument, StandardFonts, type PDFFont } from 'pdf-lib';

// Text and fonts of the reports' PDFs. The standard PDF fonts cover WinAnsi only: a few symbols the reports use are spelled out, and
// anything else the font cannot encode becomes "?" rather than failing the whole document.
const replacements: Record<string, string> = { '→': '->', '≥': '>=', '≤': '<=', '−': '-' };

export function pdfSafeText(text: string, font: PDFFont): string {
  let out = '';
  for (const ch of text.replace(/[→≥≤−]/g, (c) => replacements[c] ?? c)) {
    try {
      font.encodeText(ch);
      out += ch;
    } catch {
      out += '?';
    }
  }
  return out;
}

/** A new report document with its title and the two standard fonts every report writes in (nothing to embed). */
export async function newReportPdf(title: string): Promise<{ pdf: PDFDocument; regular: PDFFont; bold: PDFFont }> {
  const pdf = await PDFDocument.create();
  pdf.setTitle(title);
  pdf.setProducer('Rimeline');
  return { pdf, regular: await pdf.embedFont(StandardFonts.Helvetica), bold: await pdf.embedFont(StandardFonts.HelveticaBold) };
}
