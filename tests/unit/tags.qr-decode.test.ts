// The Scan page's frame decoder against camera-like frames of our own printed labels (the same
// frames the fake-camera browser test plays; pdftoppm from poppler-utils renders the PDF). zxing's stock single pass misses some of these perfectly sharp frames; the page
// decodes each frame the further ways lib/tags/qr-decode.ts lists and must read them all.
import { execFile } from 'node:child_process';
import { mkdtemp, rm, writeFile } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { promisify } from 'node:util';
import sharp from 'sharp';
import { BinaryBitmap, DecodeHintType, HybridBinarizer, PlanarYUVLuminanceSource, QRCodeReader } from '@zxing/library';
import { describe, expect, it, onTestFinished } from 'vitest';
import { generateCode } from '@/lib/tags/code';
import type { LabelLayout } from '@/lib/tags/layouts';
import { renderLabelSheet } from '@/lib/tags/pdf';
import { tagUrl } from '@/lib/tags/qr';
import { decodeFrame, halfSize } from '@/lib/tags/qr-decode';

const run = promisify(execFile);
const W = 640;
const H = 480;
const hints = new Map([[DecodeHintType.TRY_HARDER, true]]);
const read = (bitmap: BinaryBitmap) => new QRCodeReader().decode(bitmap, hints);

/** A deterministic stand-in for crypto bytes, so the set of codes is the same on every run. */
function seeded(seed: number) {
  let s = seed;
  return (n: number) => Uint8Array.from({ length: n }, () => ((s = (s * 1103515245 + 12345) >>> 0) >>> 16) & 0xff);
}

// The 2 × 1 in thermal label as the migration seeds it.
const thermal: LabelLayout = {
  id: 'thermal-2x1',
  name: 'Thermal 2 × 1 in',
  description: null,
  pageWidthMm: 50.8,
  pageHeightMm: 25.4,
  labelWidthMm: 50.8,
  labelHeightMm: 25.4,
  columns: 1,
  rows: 1,
  marginLeftMm: 0,
  marginTopMm: 0,
  pitchXMm: 50.8,
  pitchYMm: 25.4,
  paddingMm: 1.2,
};

/** A printed label as a phone camera frames it: the label PDF at 200 dpi, 560 px wide in a grey 640×480 frame. */
async function cameraFrame(dir: string, code: string, url: string): Promise<Uint8ClampedArray> {
  const { bytes } = await renderLabelSheet({
    layout: thermal,
    labels: [{ code, url, equipment: { type: 'condensing_unit', name: 'Walk-in cooler condensing unit', site: 'Pell Street Kitchen', area: 'Roof' } }],
    company: { name: 'Brackenfield Refrigeration Service', servicePhone: '555-0100', labelLine: null },
    errorCorrection: 'H',
  });
  const pdf = path.join(dir, `${code}.pdf`);
  await writeFile(pdf, bytes);
  await run('pdftoppm', ['-r', '200', '-png', '-singlefile', pdf, path.join(dir, code)]);
  const label = await sharp(path.join(dir, `${code}.png`)).resize({ width: 560 }).png().toBuffer();
  const frame = await sharp({ create: { width: W, height: H, channels: 3, background: '#ffffff' } })
    .composite([{ input: label, gravity: 'center' }])
    .greyscale()
    .raw()
    .toBuffer({ resolveWithObject: true });
  const luma = new Uint8ClampedArray(W * H);
  for (let i = 0; i < W * H; i++) luma[i] = frame.data[i * frame.info.channels]!;
  return luma;
}

const source = (luma: Uint8ClampedArray) => new PlanarYUVLuminanceSource(luma, W, H, 0, 0, W, H, false);

describe('Scan page frame decoding', () => {
  // 120 renders through pdftoppm: a minute on a quiet machine, several on a busy one. The limit
  // only stops a hung run; nothing here is timed.
  it('reads every one of 120 printed labels at camera-like sizes, where one stock pass misses some', { timeout: 300_000 }, async () => {
    const random = seeded(20261201);
    const misses: string[] = [];
    const dir = await mkdtemp(path.join(tmpdir(), 'rimeline-qr-frames-'));
    onTestFinished(() => rm(dir, { recursive: true, force: true }));
    for (let i = 0; i < 120; i++) {
      const code = generateCode(random);
      const url = tagUrl('http://localhost:3100', code);
      const luma = await cameraFrame(dir, code, url);
      expect(decodeFrame(source(luma), read).getText(), code).toBe(url);
      try {
        read(new BinaryBitmap(new HybridBinarizer(source(luma))));
      } catch {
        misses.push(code);
      }
    }
    // Why the extra ways exist: without them these frames would never scan.
    expect(misses.length).toBeGreaterThan(0);
  });

  it('halves a frame by averaging 2×2 blocks', () => {
    const luma = Uint8ClampedArray.from({ length: 16 }, (_, i) => (i % 4 < 2 ? 0 : 200) + (i >= 8 ? 40 : 0));
    const half = halfSize(new PlanarYUVLuminanceSource(luma, 4, 4, 0, 0, 4, 4, false));
    expect([half.getWidth(), half.getHeight()]).toEqual([2, 2]);
    expect(Array.from(half.getMatrix())).toEqual([0, 200, 40, 240]);
  });

  it('a frame with no symbol still fails the way the scan loop expects', () => {
    expect(() => decodeFrame(source(new Uint8ClampedArray(W * H).fill(255)), read)).toThrow(expect.objectContaining({ name: expect.stringMatching(/NotFound/) }));
  });
});
