// Pictures for the demo's photos, drawn at load time so no binaries live in the repository: a
// nameplate with its invented make and ratings, and a marked-up picture of damage. The camera
// clock (EXIF DateTimeOriginal, local time) is the visit's, so the gallery dates them right.
import sharp from 'sharp';

const escapeXml = (s: string) => s.replace(/&/g, '&amp;').replace(/</g, '&lt;').replace(/>/g, '&gt;');

function lines(texts: string[], x: number, y: number, size: number, step: number, fill = '#1e293b'): string {
  return texts.map((t, i) => `<text x="${x}" y="${y + i * step}" font-family="DejaVu Sans, sans-serif" font-size="${size}" fill="${fill}">${escapeXml(t)}</text>`).join('');
}

async function jpeg(svg: string, takenAt: string): Promise<Buffer> {
  return sharp(Buffer.from(svg))
    .jpeg({ quality: 85 })
    .withExif({ IFD0: { Make: 'Brisco Optics', Model: 'BO-2' }, IFD2: { DateTimeOriginal: takenAt } })
    .toBuffer();
}

/** A riveted data plate: make in bold, then one rating per line. */
export function nameplateImage(make: string, rows: string[], takenAt: string): Promise<Buffer> {
  const svg = `<svg xmlns="http://www.w3.org/2000/svg" width="1280" height="860">
    <rect width="1280" height="860" fill="#7b8794"/>
    <rect x="90" y="80" width="1100" height="700" rx="18" fill="#dfe3e8" stroke="#3b4552" stroke-width="6"/>
    ${[130, 1150].flatMap((cx) => [130, 730].map((cy) => `<circle cx="${cx}" cy="${cy}" r="14" fill="#9aa5b1" stroke="#3b4552" stroke-width="3"/>`)).join('')}
    <text x="170" y="210" font-family="DejaVu Sans, sans-serif" font-size="76" font-weight="bold" fill="#0f172a">${escapeXml(make.toUpperCase())}</text>
    ${lines(rows, 170, 310, 44, 72)}
  </svg>`;
  return jpeg(svg, takenAt);
}

/** Damage as a technician frames it: the part, a red ring around the fault, and a chalk note. */
export function damageImage(title: string, note: string, takenAt: string, base = '#4b5563'): Promise<Buffer> {
  const svg = `<svg xmlns="http://www.w3.org/2000/svg" width="1280" height="960">
    <rect width="1280" height="960" fill="${base}"/>
    <rect x="180" y="160" width="920" height="620" fill="#9ca3af" stroke="#1f2937" stroke-width="8"/>
    ${Array.from({ length: 12 }, (_, i) => `<line x1="${220 + i * 72}" y1="190" x2="${220 + i * 72}" y2="750" stroke="#6b7280" stroke-width="10"/>`).join('')}
    <path d="M520 420 q60 -80 140 -20 t150 30" stroke="#b45309" stroke-width="26" fill="none"/>
    <circle cx="640" cy="430" r="170" fill="none" stroke="#dc2626" stroke-width="14"/>
    <rect x="0" y="820" width="1280" height="140" fill="#111827" opacity="0.85"/>
    ${lines([title, note], 40, 875, 40, 52, '#f9fafb')}
  </svg>`;
  return jpeg(svg, takenAt);
}
