// Label sheet and calibration PDFs with pdf-lib: pure (bytes in memory, no I/O).
//
// Each label: the QR symbol as vector rectangles from `qrcode`'s module matrix (sharp at any printer
// resolution), its quiet zone kept inside the symbol box, the human code in large type beside it, the
// equipment's type, name, site and area when the tag is bound at print time, and the company's name
// and service line at the bottom. Every label is drawn inside `q 1 0 0 1 x y cm … Q` at its box's
// corner, so the label geometry can be read back from the PDF's own operators (tests do).
import {
  PDFDocument,
  StandardFonts,
  concatTransformationMatrix,
  fill,
  popGraphicsState,
  pushGraphicsState,
  rectangle,
  rgb,
  setFillingGrayscaleColor,
  type PDFFont,
  type PDFPage,
} from 'pdf-lib';
import { formatCode } from '@/lib/tags/code';
import { mmToPt, placeLabels, type LabelBox, type LabelLayout } from '@/lib/tags/layouts';
import { darkRuns, qrSymbol, QUIET_ZONE_MODULES, type ErrorCorrection } from '@/lib/tags/qr';

export interface LabelEquipment {
  type: string;
  name: string;
  site: string;
  area: string | null;
}

export interface LabelContent {
  code: string;
  /** What the QR symbol holds (lib/tags/qr.ts tagUrl). */
  url: string;
  equipment?: LabelEquipment | null;
}

export interface CompanyLine {
  name: string;
  servicePhone: string | null;
  labelLine: string | null;
}

export interface SheetInput {
  layout: LabelLayout;
  labels: LabelContent[];
  startPosition?: number;
  company: CompanyLine;
  errorCorrection: ErrorCorrection;
  title?: string;
}

export interface DrawnLabel {
  code: string;
  box: LabelBox;
  /** Symbol box including the quiet zone, in mm from the label's top-left corner. */
  qr: { xMm: number; yMm: number; sizeMm: number; moduleMm: number; modules: number; version: number };
}

export interface SheetResult {
  bytes: Uint8Array;
  pages: number;
  drawn: DrawnLabel[];
}

/** The company's two short lines: its name, then its label line (or its service phone). */
export function companyLines(company: CompanyLine): string[] {
  const name = company.name.trim();
  const phone = company.servicePhone?.trim() ?? '';
  let line = company.labelLine?.trim() ?? '';
  // The service phone is on every label: added to the label line unless the line already carries it.
  if (phone && !line.includes(phone)) line = line ? `${line} · ${phone}` : `Service: ${phone}`;
  return [name, line].filter((l) => l.length > 0);
}

interface Fonts {
  regular: PDFFont;
  bold: PDFFont;
  charset: Set<number>;
}

async function loadFonts(doc: PDFDocument): Promise<Fonts> {
  const regular = await doc.embedFont(StandardFonts.Helvetica);
  const bold = await doc.embedFont(StandardFonts.HelveticaBold);
  return { regular, bold, charset: new Set(regular.getCharacterSet()) };
}

/** The standard fonts speak WinAnsi only: anything else becomes a plain look-alike or "?". */
function printable(text: string, charset: Set<number>): string {
  let out = '';
  // NFKC spells ⅝ as 5⁄8; the fraction slash becomes a plain one.
  for (const ch of text.normalize('NFKC').replace(/\u2044/g, '/')) {
    const cp = ch.codePointAt(0)!;
    if (charset.has(cp)) out += ch;
    else if (/\s/.test(ch)) out += ' ';
    else {
      const plain = ch.normalize('NFD').replace(/[\u0300-\u036f]/g, '');
      out += plain.length > 0 && [...plain].every((c) => charset.has(c.codePointAt(0)!)) ? plain : '?';
    }
  }
  return out;
}

/** Shortens with an ellipsis until the text fits the width. */
function fitText(text: string, font: PDFFont, size: number, maxWidthPt: number): string {
  if (font.widthOfTextAtSize(text, size) <= maxWidthPt) return text;
  let lo = 0;
  let hi = text.length;
  while (lo < hi) {
    const mid = Math.ceil((lo + hi) / 2);
    if (font.widthOfTextAtSize(`${text.slice(0, mid).trimEnd()}…`, size) <= maxWidthPt) lo = mid;
    else hi = mid - 1;
  }
  return lo === 0 ? '' : `${text.slice(0, lo).trimEnd()}…`;
}

function largestSize(text: string, font: PDFFont, maxSize: number, minSize: number, maxWidthPt: number): number {
  const width = font.widthOfTextAtSize(text, 1);
  return Math.max(minSize, Math.min(maxSize, Math.floor((maxWidthPt / width) * 4) / 4));
}

const clamp = (v: number, lo: number, hi: number) => Math.min(hi, Math.max(lo, v));

/** Geometry of the parts of a label, in mm from the label's top-left corner (shared with tests). */
export function labelParts(layout: LabelLayout, modules: number) {
  const pad = layout.paddingMm;
  const qrSize = Math.min(layout.labelHeightMm - 2 * pad, layout.labelWidthMm * 0.48);
  const qrX = pad;
  const qrY = (layout.labelHeightMm - qrSize) / 2;
  const textX = qrX + qrSize + 0.5;
  return { pad, qrX, qrY, qrSize, moduleMm: qrSize / modules, textX, textWidth: layout.labelWidthMm - pad - textX };
}

function drawLabel(page: PDFPage, layout: LabelLayout, box: LabelBox, label: LabelContent, company: string[], ec: ErrorCorrection, fonts: Fonts): DrawnLabel {
  const symbol = qrSymbol(label.url, ec);
  const modules = symbol.size + 2 * QUIET_ZONE_MODULES;
  const parts = labelParts(layout, modules);
  const H = mmToPt(layout.labelHeightMm);
  const originX = mmToPt(box.xMm);
  const originY = mmToPt(layout.pageHeightMm - box.yMm - layout.labelHeightMm);
  const m = mmToPt(parts.moduleMm);
  const qrLeft = mmToPt(parts.qrX);
  const qrTop = H - mmToPt(parts.qrY);

  page.pushOperators(pushGraphicsState(), concatTransformationMatrix(1, 0, 0, 1, originX, originY), setFillingGrayscaleColor(0));
  // The symbol is drawn in module units (x right, y down from the first module), so every rectangle
  // is a few small integers: short to write, quick to compress.
  const rects = darkRuns(symbol).map((r) => rectangle(r.col, r.row, r.length, r.height));
  page.pushOperators(
    pushGraphicsState(),
    concatTransformationMatrix(m, 0, 0, -m, qrLeft + QUIET_ZONE_MODULES * m, qrTop - QUIET_ZONE_MODULES * m),
    ...rects,
    fill(),
    popGraphicsState(),
  );

  const scale = clamp(layout.labelHeightMm / 25.4, 1, 1.4);
  const textX = mmToPt(parts.textX);
  const textW = mmToPt(parts.textWidth);
  const top = H - mmToPt(parts.pad);
  const bottom = mmToPt(parts.pad);
  const black = rgb(0, 0, 0);

  const human = formatCode(label.code);
  const codeSize = largestSize(human, fonts.bold, 16 * scale, 7, textW);
  let y = top - fonts.bold.heightAtSize(codeSize, { descender: false });
  page.drawText(human, { x: textX, y, size: codeSize, font: fonts.bold, color: black });

  const small = 6.2 * scale;
  const lineGap = small * 1.2;
  y -= codeSize * 0.35 + lineGap;
  const eq = label.equipment;
  const detail: { text: string; font: PDFFont }[] = eq
    ? [
        { text: eq.type, font: fonts.bold },
        { text: eq.name, font: fonts.regular },
        { text: eq.area ? `${eq.site} · ${eq.area}` : eq.site, font: fonts.regular },
      ]
    : [{ text: 'Scan to open or register', font: fonts.regular }];
  const companyTop = bottom + company.length * lineGap;
  for (const d of detail) {
    if (y < companyTop) break;
    const text = fitText(printable(d.text, fonts.charset), d.font, small, textW);
    if (text) page.drawText(text, { x: textX, y, size: small, font: d.font, color: black });
    y -= lineGap;
  }
  let cy = bottom + (company.length - 1) * lineGap + small * 0.2;
  company.forEach((line, i) => {
    const font = i === 0 ? fonts.bold : fonts.regular;
    const clean = printable(line, fonts.charset);
    // Shrink a long company line a little before cutting it short.
    const size = largestSize(clean, font, small, Math.min(small, 4.6), textW);
    const text = fitText(clean, font, size, textW);
    if (text) page.drawText(text, { x: textX, y: cy, size, font, color: black });
    cy -= lineGap;
  });
  page.pushOperators(popGraphicsState());

  return {
    code: label.code,
    box,
    qr: { xMm: parts.qrX, yMm: parts.qrY, sizeMm: parts.qrSize, moduleMm: parts.moduleMm, modules, version: symbol.version },
  };
}

/** The label sheet PDF for a print run. */
export async function renderLabelSheet(input: SheetInput): Promise<SheetResult> {
  const { layout } = input;
  const doc = await PDFDocument.create();
  doc.setTitle(input.title ?? 'Tag labels');
  doc.setCreator('Rimeline');
  doc.setProducer('Rimeline (pdf-lib)');
  const fonts = await loadFonts(doc);
  const boxes = placeLabels(layout, input.labels.length, input.startPosition ?? 1);
  const company = companyLines(input.company);
  const pages: PDFPage[] = [];
  const drawn: DrawnLabel[] = [];
  input.labels.forEach((label, i) => {
    const box = boxes[i]!;
    while (pages.length <= box.page) pages.push(doc.addPage([mmToPt(layout.pageWidthMm), mmToPt(layout.pageHeightMm)]));
    drawn.push(drawLabel(pages[box.page]!, layout, box, label, company, input.errorCorrection, fonts));
  });
  const bytes = await doc.save();
  return { bytes, pages: pages.length, drawn };
}

/**
 * One page to check the printer's scaling before printing labels: every label outline with its
 * position number, a ruler of known length each way, and what to look for.
 */
export async function renderCalibrationSheet(layout: LabelLayout): Promise<{ bytes: Uint8Array; boxes: LabelBox[]; rulerMm: number }> {
  const doc = await PDFDocument.create();
  doc.setTitle(`Calibration: ${layout.name}`);
  doc.setCreator('Rimeline');
  const fonts = await loadFonts(doc);
  const say = (text: string) => printable(text, fonts.charset);
  const W = mmToPt(layout.pageWidthMm);
  const Hp = mmToPt(layout.pageHeightMm);
  const page = doc.addPage([W, Hp]);
  const grey = rgb(0.45, 0.45, 0.45);
  const black = rgb(0, 0, 0);
  const boxes = placeLabels(layout, layout.columns * layout.rows, 1);
  const small = layout.labelHeightMm < 30 && layout.columns === 1 ? 5 : 7;
  for (const b of boxes) {
    const x = mmToPt(b.xMm);
    const y = Hp - mmToPt(b.yMm + b.heightMm);
    // A single-label page outlines 1 mm inside the edge, where a thermal printer still prints.
    const inset = layout.columns * layout.rows === 1 ? mmToPt(1) : 0;
    page.drawRectangle({ x: x + inset, y: y + inset, width: mmToPt(b.widthMm) - 2 * inset, height: mmToPt(b.heightMm) - 2 * inset, borderColor: grey, borderWidth: 0.5 });
    if (layout.columns * layout.rows > 1) {
      page.drawText(String(b.position), { x: x + 3, y: y + mmToPt(b.heightMm) - 9, size: 7, font: fonts.bold, color: grey });
    }
  }
  // Rulers: 100 mm where the page allows, else the largest whole 10 mm (5 mm on tiny pages).
  const step = layout.pageWidthMm >= 120 ? 10 : 5;
  const rulerMm = Math.min(100, Math.floor((layout.pageWidthMm - 10) / step) * step);
  const rx = (W - mmToPt(rulerMm)) / 2;
  const ry = Hp / 2;
  page.drawLine({ start: { x: rx, y: ry }, end: { x: rx + mmToPt(rulerMm), y: ry }, thickness: 0.6, color: black });
  for (let t = 0; t <= rulerMm; t += step) {
    const tick = t % (step * 5) === 0 ? 4 : 2;
    page.drawLine({ start: { x: rx + mmToPt(t), y: ry - tick }, end: { x: rx + mmToPt(t), y: ry + tick }, thickness: 0.5, color: black });
  }
  page.drawText(say(`This line is ${rulerMm} mm long when printed at actual size (100 %).`), { x: rx, y: ry + 6, size: small, font: fonts.bold, color: black });
  if (layout.pageHeightMm >= 120) {
    const vx = W / 2 - mmToPt(30);
    const vy = (Hp - mmToPt(rulerMm)) / 2;
    page.drawLine({ start: { x: vx, y: vy }, end: { x: vx, y: vy + mmToPt(rulerMm) }, thickness: 0.6, color: black });
    for (let t = 0; t <= rulerMm; t += step) {
      const tick = t % (step * 5) === 0 ? 4 : 2;
      page.drawLine({ start: { x: vx - tick, y: vy + mmToPt(t) }, end: { x: vx + tick, y: vy + mmToPt(t) }, thickness: 0.5, color: black });
    }
    const lines = [
      `${layout.name}: calibration page`,
      'Print on plain paper with scaling off ("actual size", not "fit to page").',
      `Measure both lines: each must be ${rulerMm} mm. Then hold this page over a label sheet`,
      'against the light: the grey outlines must sit on the label edges.',
      'If they are shifted, set the printer\'s margins or paper guides and print this page again.',
    ];
    lines.forEach((l, i) => page.drawText(say(l), { x: vx + 10, y: ry - 16 - i * 10, size: 7.5, font: i === 0 ? fonts.bold : fonts.regular, color: black }));
  } else {
    page.drawText(say('Scaling off ("actual size"). The outline sits 1 mm inside the label edge.'), { x: rx, y: ry - 9, size: small, font: fonts.regular, color: black });
  }
  return { bytes: await doc.save(), boxes, rulerMm };
}
