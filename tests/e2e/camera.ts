// Chromium's fake camera plays a .y4m file; these write one from a real tag label, so a scan test
// reads exactly what the office prints.
import { execFile } from 'node:child_process';
import { mkdir, mkdtemp, readdir, rm, writeFile } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { promisify } from 'node:util';
import sharp from 'sharp';

const run = promisify(execFile);

/** Renders a label sheet PDF (pdftoppm) and writes it, centred on white, as a 640×480 still .y4m. */
export async function writeFakeCameraFromLabel(pdf: Buffer, file: string): Promise<void> {
  const dir = await mkdtemp(path.join(tmpdir(), 'rimeline-camera-'));
  try {
    await writeFile(path.join(dir, 'label.pdf'), pdf);
    await run('pdftoppm', ['-r', '200', '-png', path.join(dir, 'label.pdf'), path.join(dir, 'label')]);
    const png = (await readdir(dir)).find((f) => f.endsWith('.png'))!;
    const W = 640;
    const H = 480;
    const label = await sharp(path.join(dir, png)).resize({ width: 560 }).png().toBuffer();
    const y = await sharp({ create: { width: W, height: H, channels: 3, background: '#ffffff' } })
      .composite([{ input: label, gravity: 'center' }])
      .greyscale()
      .raw()
      .toBuffer({ resolveWithObject: true });
    // YUV4MPEG2, 4:2:0: per frame the Y plane (the greyscale label) and flat U and V planes.
    const luma = y.info.channels === 1 ? y.data : Buffer.from(Array.from({ length: W * H }, (_, i) => y.data[i * y.info.channels]!));
    const chroma = Buffer.alloc((W / 2) * (H / 2), 128);
    const frame = Buffer.concat([Buffer.from('FRAME\n'), luma, chroma, chroma]);
    await mkdir(path.dirname(file), { recursive: true });
    await writeFile(file, Buffer.concat([Buffer.from(`YUV4MPEG2 W${W} H${H} F30:1 Ip A1:1 C420jpeg\n`), ...Array.from({ length: 30 }, () => frame)]));
  } finally {
    await rm(dir, { recursive: true, force: true });
  }
}
