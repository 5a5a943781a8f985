// Reads back what a PDF page draws: each top-level `q 1 0 0 1 x y cm … Q` block (one label) with the
// rectangles (`re`) and text positions (`Tm`) inside it, and the page size. Used by the tag tests to
// check label geometry from the PDF itself rather than from the code that wrote it.
import { PDFArray, PDFDocument, PDFName, PDFRawStream, PDFStream, decodePDFRawStream } from 'pdf-lib';

export interface DrawnBlock {
  /** Translation of the block, in points from the page's bottom-left corner; rects and texts are relative to it, in points. */
  x: number;
  y: number;
  rects: { x: number; y: number; w: number; h: number }[];
  texts: { x: number; y: number }[];
}

export interface DrawnPage {
  width: number;
  height: number;
  blocks: DrawnBlock[];
}

function streamText(stream: PDFStream): string {
  const bytes = stream instanceof PDFRawStream ? decodePDFRawStream(stream).decode() : (stream as unknown as { getContents(): Uint8Array }).getContents();
  return Buffer.from(bytes).toString('latin1');
}

export async function readDrawnPages(bytes: Uint8Array): Promise<DrawnPage[]> {
  const doc = await PDFDocument.load(bytes);
  return doc.getPages().map((page) => {
    const contents = page.node.get(PDFName.of('Contents'));
    const resolved = contents ? page.node.context.lookup(contents) : undefined;
    const streams: PDFStream[] =
      resolved instanceof PDFArray
        ? resolved.asArray().map((r) => page.node.context.lookup(r) as PDFStream)
        : resolved instanceof PDFStream
          ? [resolved]
          : [];
    const text = streams.map(streamText).join('\n');
    // Strings and names never hold the operators we look for in our own output; hex strings are skipped.
    const tokens = text.replace(/<[0-9A-Fa-f\s]*>/g, ' ').replace(/\([^)]*\)/g, ' ').split(/\s+/).filter(Boolean);
    const blocks: DrawnBlock[] = [];
    // Current transformation matrix [a b c d e f], saved and restored with q / Q.
    type M = [number, number, number, number, number, number];
    let ctm: M = [1, 0, 0, 1, 0, 0];
    const stack: M[] = [];
    const apply = (m: M, x: number, y: number): [number, number] => [m[0] * x + m[2] * y + m[4], m[1] * x + m[3] * y + m[5]];
    let current: DrawnBlock | null = null;
    let blockDepth = -1;
    const nums: number[] = [];
    let pendingQ = false;
    for (const t of tokens) {
      if (/^-?\d*\.?\d+(e-?\d+)?$/i.test(t)) {
        nums.push(Number(t));
        continue;
      }
      if (t === 'q') {
        stack.push([...ctm]);
        pendingQ = stack.length === 1;
      } else if (t === 'Q') {
        if (current && stack.length === blockDepth) {
          blocks.push(current);
          current = null;
          blockDepth = -1;
        }
        ctm = stack.pop() ?? [1, 0, 0, 1, 0, 0];
      } else if (t === 'cm') {
        const [a, b, c, d, e, f] = nums.slice(-6) as M;
        if (pendingQ && a === 1 && b === 0 && c === 0 && d === 1) {
          current = { x: e, y: f, rects: [], texts: [] };
          blockDepth = stack.length;
        }
        // CTM' = M × CTM
        ctm = [
          a * ctm[0] + b * ctm[2],
          a * ctm[1] + b * ctm[3],
          c * ctm[0] + d * ctm[2],
          c * ctm[1] + d * ctm[3],
          e * ctm[0] + f * ctm[2] + ctm[4],
          e * ctm[1] + f * ctm[3] + ctm[5],
        ];
      } else if (t === 're' && current) {
        const [x, y, w, h] = nums.slice(-4) as [number, number, number, number];
        const corners = [apply(ctm, x, y), apply(ctm, x + w, y + h)];
        const xs = corners.map((p) => p[0] - current!.x);
        const ys = corners.map((p) => p[1] - current!.y);
        current.rects.push({ x: Math.min(...xs), y: Math.min(...ys), w: Math.abs(xs[1]! - xs[0]!), h: Math.abs(ys[1]! - ys[0]!) });
      } else if (t === 'Tm' && current) {
        const [, , , , e, f] = nums.slice(-6) as M;
        const [x, y] = apply(ctm, e, f);
        current.texts.push({ x: x - current.x, y: y - current.y });
      }
      // Only a `cm` straight after a top-level `q` opens a label block.
      if (t !== 'q') pendingQ = false;
      nums.length = 0;
    }
    const { width, height } = page.getSize();
    return { width, height, blocks };
  });
}
