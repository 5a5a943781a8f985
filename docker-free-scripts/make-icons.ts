// Draws the app icon (a six-armed frost crystal over a rime line, in the product's ice blues) and
// renders the PNG sizes the web app manifest names. Run: npx tsx docker-free-scripts/make-icons.ts
// Output is committed under public/icons/; rerun only when the drawing changes.
import { mkdirSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import sharp from 'sharp';

const OUT = path.join(process.cwd(), 'public', 'icons');
// tailwind.config.ts: ice-900 ground, ice-100 crystal, ice-300 line.
const GROUND = '#0f3a56';
const CRYSTAL = '#dceff8';
const LINE = '#86c6e3';

/** The mark on a 512 grid, centred on (256, 240); `scale` shrinks it for the maskable safe zone. */
function mark(scale: number): string {
  const cx = 256;
  const cy = 236;
  const arm = 150;
  const arms: string[] = [];
  for (let i = 0; i < 6; i++) {
    const a = (Math.PI / 3) * i - Math.PI / 2;
    const x = (r: number, da = 0) => (cx + r * Math.cos(a + da)).toFixed(1);
    const y = (r: number, da = 0) => (cy + r * Math.sin(a + da)).toFixed(1);
    arms.push(`M${cx} ${cy}L${x(arm)} ${y(arm)}`);
    // Two pairs of side branches, the outer pair shorter: the trade's frost, not a star.
    for (const [at, len] of [
      [0.45, 48],
      [0.72, 34],
    ] as const) {
      const bx = cx + arm * at * Math.cos(a);
      const by = cy + arm * at * Math.sin(a);
      for (const side of [-1, 1]) {
        const ba = a + side * (Math.PI / 4);
        arms.push(`M${bx.toFixed(1)} ${by.toFixed(1)}L${(bx + len * Math.cos(ba)).toFixed(1)} ${(by + len * Math.sin(ba)).toFixed(1)}`);
      }
    }
  }
  return `<g transform="translate(256 256) scale(${scale}) translate(-256 -256)">
    <path d="${arms.join('')}" fill="none" stroke="${CRYSTAL}" stroke-width="22" stroke-linecap="round" stroke-linejoin="round"/>
    <path d="M128 438H384" stroke="${LINE}" stroke-width="22" stroke-linecap="round"/>
  </g>`;
}

function svg({ maskable }: { maskable: boolean }): string {
  // Maskable: full-bleed ground and the mark inside the central 80 % circle that every mask keeps.
  const ground = maskable ? `<rect width="512" height="512" fill="${GROUND}"/>` : `<rect width="512" height="512" rx="112" fill="${GROUND}"/>`;
  return `<svg xmlns="http://www.w3.org/2000/svg" viewBox="0 0 512 512" width="512" height="512">${ground}${mark(maskable ? 0.72 : 0.92)}</svg>`;
}

async function main() {
  mkdirSync(OUT, { recursive: true });
  const plain = svg({ maskable: false });
  const maskable = svg({ maskable: true });
  writeFileSync(path.join(OUT, 'icon.svg'), `${plain}\n`);
  await sharp(Buffer.from(plain)).resize(192, 192).png({ compressionLevel: 9 }).toFile(path.join(OUT, 'icon-192.png'));
  await sharp(Buffer.from(plain)).resize(512, 512).png({ compressionLevel: 9 }).toFile(path.join(OUT, 'icon-512.png'));
  await sharp(Buffer.from(maskable)).resize(512, 512).png({ compressionLevel: 9 }).toFile(path.join(OUT, 'icon-maskable-512.png'));
  await sharp(Buffer.from(plain)).resize(180, 180).flatten({ background: GROUND }).png({ compressionLevel: 9 }).toFile(path.join(OUT, 'apple-touch-icon.png'));
  console.log(`icons written to ${path.relative(process.cwd(), OUT)}`);
}

void main();
