// Label sheet PDFs, read back from the PDF itself: every label box where its layout row says (within
// 0.2 mm), the QR symbol and text inside the box, and every QR symbol decoding — with zbar, a decoder
// that is not the encoder (pdftoppm -r 300, one crop per label, zbarimg) — to its tag URL.
import { execFile } from 'node:child_process';
import { mkdtemp, readdir, rm, writeFile } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { promisify } from 'node:util';
import sharp from 'sharp';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { generateCode } from '@/lib/tags/code';
import { ptToMm, type LabelLayout } from '@/lib/tags/layouts';
import { renderCalibrationSheet, renderLabelSheet, type LabelContent } from '@/lib/tags/pdf';
import { chooseErrorCorrection, tagUrl } from '@/lib/tags/qr';
import { layoutQuery, toLayout } from '@/lib/tags/queries';
import { createTestDb } from '@/tests/helpers/db';
import { readDrawnPages } from '@/tests/helpers/pdf-operators';

const run = promisify(execFile);
const db = createTestDb();
const APP = process.env.APP_URL ?? 'http://localhost:3100';
const TOLERANCE_MM = 0.2;
const DPI = 300;
let layouts: LabelLayout[];
let work: string;

beforeAll(async () => {
  layouts = (await layoutQuery(db).execute()).map(toLayout);
  work = await mkdtemp(path.join(tmpdir(), 'rimeline-tags-'));
});
afterAll(async () => {
  await db.destroy();
  await rm(work, { recursive: true, force: true });
});

function labelsFor(n: number): LabelContent[] {
  return Array.from({ length: n }, (_, i) => {
    const code = generateCode();
    return {
      code,
      url: tagUrl(APP, code),
      equipment: i % 3 === 0 ? null : { type: 'Condensing unit', name: `Walk-in cooler condensing unit ${i} with a long name — Bäckerei`, site: 'Pell Street Kitchen', area: i % 2 ? 'Roof' : null },
    };
  });
}

const company = { name: 'Brackenfield Refrigeration Service', servicePhone: '555-0100', labelLine: 'Service: 555-0100 · call before opening' };

describe('label layouts (rows seeded by the migration)', () => {
  it('has the three sheet kinds the brief names, each fitting its page', () => {
    const byId = new Map(layouts.map((l) => [l.id, l]));
    const letter = byId.get('letter-30')!;
    const a4 = byId.get('a4-24')!;
    const thermal = byId.get('thermal-2x1')!;
    // US letter 8.5 × 11 in, 30 labels of 1 × 2-5/8 in.
    expect([letter.pageWidthMm, letter.pageHeightMm, letter.labelHeightMm, letter.labelWidthMm, letter.columns * letter.rows]).toEqual([215.9, 279.4, 25.4, 66.675, 30]);
    // A4 210 × 297 mm, 24 labels of 70 × 37 mm.
    expect([a4.pageWidthMm, a4.pageHeightMm, a4.labelWidthMm, a4.labelHeightMm, a4.columns * a4.rows]).toEqual([210, 297, 70, 37, 24]);
    // Thermal: one 2 × 1 in label per page.
    expect([thermal.pageWidthMm, thermal.pageHeightMm, thermal.labelWidthMm, thermal.labelHeightMm, thermal.columns * thermal.rows]).toEqual([50.8, 25.4, 50.8, 25.4, 1]);
    for (const l of layouts) {
      const right = l.pageWidthMm - (l.marginLeftMm + (l.columns - 1) * l.pitchXMm + l.labelWidthMm);
      const bottom = l.pageHeightMm - (l.marginTopMm + (l.rows - 1) * l.pitchYMm + l.labelHeightMm);
      expect(right).toBeGreaterThanOrEqual(-0.01);
      expect(bottom).toBeGreaterThanOrEqual(-0.01);
    }
    // The letter sheet's grid is centred (equal side margins).
    expect(letter.pageWidthMm - (letter.marginLeftMm + 2 * letter.pitchXMm + letter.labelWidthMm)).toBeCloseTo(letter.marginLeftMm, 3);
  });
});

describe.each(['letter-30', 'a4-24', 'thermal-2x1'])('label sheet %s', (layoutId) => {
  let layout: LabelLayout;
  let labels: LabelContent[];
  let bytes: Uint8Array;
  const start = layoutId === 'thermal-2x1' ? 1 : 4;

  beforeAll(async () => {
    layout = layouts.find((l) => l.id === layoutId)!;
    const perPage = layout.columns * layout.rows;
    // Fill the first sheet from the start position and spill onto a second one.
    labels = labelsFor(perPage === 1 ? 3 : perPage - start + 1 + 2);
    const sheet = await renderLabelSheet({ layout, labels, startPosition: start, company, errorCorrection: chooseErrorCorrection(APP) });
    bytes = sheet.bytes;
  });

  it('puts every label box where the layout says, within 0.2 mm', async () => {
    const pages = await readDrawnPages(bytes);
    const perPage = layout.columns * layout.rows;
    expect(pages).toHaveLength(2 + (perPage === 1 ? 1 : 0));
    let n = 0;
    pages.forEach((page, p) => {
      expect(Math.abs(ptToMm(page.width) - layout.pageWidthMm)).toBeLessThan(TOLERANCE_MM);
      expect(Math.abs(ptToMm(page.height) - layout.pageHeightMm)).toBeLessThan(TOLERANCE_MM);
      page.blocks.forEach((block, k) => {
        const slot = p === 0 ? start - 1 + k : k;
        const col = slot % layout.columns;
        const row = Math.floor(slot / layout.columns);
        const expectedLeft = layout.marginLeftMm + col * layout.pitchXMm;
        const expectedTop = layout.marginTopMm + row * layout.pitchYMm;
        const drawnLeft = ptToMm(block.x);
        const drawnTop = layout.pageHeightMm - ptToMm(block.y) - layout.labelHeightMm;
        expect(Math.abs(drawnLeft - expectedLeft), `label ${n + 1} left edge`).toBeLessThan(TOLERANCE_MM);
        expect(Math.abs(drawnTop - expectedTop), `label ${n + 1} top edge`).toBeLessThan(TOLERANCE_MM);

        // The QR symbol: dark modules of at least 0.4 mm, with a 4-module quiet zone inside the label's
        // padding on every side and before the text.
        expect(block.rects.length).toBeGreaterThan(30);
        const moduleMm = Math.min(...block.rects.flatMap((r) => [ptToMm(r.w), ptToMm(r.h)]));
        expect(moduleMm).toBeGreaterThanOrEqual(0.4);
        const quiet = 4 * moduleMm - 0.01;
        const xs = block.rects.flatMap((r) => [r.x, r.x + r.w]).map(ptToMm);
        const ys = block.rects.flatMap((r) => [r.y, r.y + r.h]).map(ptToMm);
        expect(Math.min(...xs) - layout.paddingMm).toBeGreaterThanOrEqual(quiet);
        expect(Math.min(...ys) - layout.paddingMm).toBeGreaterThanOrEqual(quiet);
        expect(layout.labelHeightMm - layout.paddingMm - Math.max(...ys)).toBeGreaterThanOrEqual(quiet);
        // Text starts after the symbol's quiet zone and inside the label.
        expect(block.texts.length).toBeGreaterThanOrEqual(3);
        for (const t of block.texts) {
          expect(ptToMm(t.x) - Math.max(...xs)).toBeGreaterThanOrEqual(quiet);
          expect(ptToMm(t.x)).toBeLessThan(layout.labelWidthMm - layout.paddingMm);
          expect(ptToMm(t.y)).toBeGreaterThanOrEqual(layout.paddingMm - 0.5);
          expect(ptToMm(t.y)).toBeLessThanOrEqual(layout.labelHeightMm - layout.paddingMm);
        }
        n++;
      });
    });
    expect(n).toBe(labels.length);
  });

  it('every QR symbol decodes with zbar to its own tag URL', async () => {
    const dir = await mkdtemp(path.join(work, `${layoutId}-`));
    const pdf = path.join(dir, 'sheet.pdf');
    await writeFile(pdf, bytes);
    await run('pdftoppm', ['-r', String(DPI), '-png', pdf, path.join(dir, 'page')]);
    const pngs = (await readdir(dir)).filter((f) => f.startsWith('page') && f.endsWith('.png')).sort();
    const pages = await readDrawnPages(bytes);
    expect(pngs).toHaveLength(pages.length);
    const px = (mm: number) => Math.round((mm / 25.4) * DPI);
    let i = 0;
    for (const [p, page] of pages.entries()) {
      const image = sharp(path.join(dir, pngs[p]!));
      const meta = await image.metadata();
      for (const block of page.blocks) {
        const left = Math.max(0, px(ptToMm(block.x)));
        const top = Math.max(0, px(layout.pageHeightMm - ptToMm(block.y) - layout.labelHeightMm));
        const width = Math.min(meta.width! - left, px(layout.labelWidthMm));
        const height = Math.min(meta.height! - top, px(layout.labelHeightMm));
        const crop = path.join(dir, `label-${i}.png`);
        await sharp(path.join(dir, pngs[p]!)).extract({ left, top, width, height }).extend({ top: 20, bottom: 20, left: 20, right: 20, background: '#ffffff' }).toFile(crop);
        const { stdout } = await run('zbarimg', ['-q', '--raw', '-Sdisable', '-Sqrcode.enable', crop]).catch((e: { stdout?: string }) => ({ stdout: e.stdout ?? '' }));
        expect(stdout.trim(), `label ${i + 1} (${labels[i]!.code})`).toBe(labels[i]!.url);
        i++;
      }
    }
    expect(i).toBe(labels.length);
  }, 60_000);
});

describe('calibration page', () => {
  it('outlines and numbers every label of the layout and states the ruler length', async () => {
    for (const layout of layouts) {
      const { bytes, boxes, rulerMm } = await renderCalibrationSheet(layout);
      expect(await readDrawnPages(bytes)).toHaveLength(1);
      expect(boxes).toHaveLength(layout.columns * layout.rows);
      expect(rulerMm).toBeGreaterThanOrEqual(40);
      expect(rulerMm).toBeLessThanOrEqual(layout.pageWidthMm - 10);
      const file = path.join(work, `calibration-${layout.id}.pdf`);
      await writeFile(file, bytes);
      const { stdout } = await run('pdftotext', ['-layout', file, '-']);
      expect(stdout).toContain(`This line is ${rulerMm} mm long`);
      if (boxes.length > 1) {
        const numbers = new Set(stdout.match(/\b\d{1,2}\b/g));
        for (let n = 1; n <= boxes.length; n++) expect(numbers.has(String(n)), `position ${n}`).toBe(true);
      }
    }
  });
});
