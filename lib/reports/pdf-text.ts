import type { PDFFont } from 'pdf-lib';

// The standard PDF fonts cover WinAnsi only: a few symbols the reports use are spelled out, and
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
