// Reads back what a PDF page draws: each top-level `q 1 0 0 1 x y cm … Q` block (one label) with the
// rectangles (`re`) and text positions (`Tm`) inside it, and the page size. Used by the tag tests to
// check label geometry from the PDF itself rather than from the code that wrote it.
import { PDFArray, PDFDocument, PDFName, PDFRawStream, PDFStream, decodePDFRawStream } from 'pdf-lib';

export interface DrawnBlock {
  /** Translation of the block, in points from the page's bottom-left corner. */
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
    let depth = 0;
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
        depth++;
        pendingQ = depth === 1;
      } else if (t === 'Q') {
        if (current && depth === blockDepth) {
          blocks.push(current);
          current = null;
          blockDepth = -1;
        }
        depth--;
      } else if (t === 'cm') {
        const [a, b, c, d, e, f] = nums.slice(-6);
        if (pendingQ && depth === 1 && a === 1 && b === 0 && c === 0 && d === 1) {
          current = { x: e!, y: f!, rects: [], texts: [] };
          blockDepth = depth;
        }
      } else if (t === 're' && current) {
        const [x, y, w, h] = nums.slice(-4);
        current.rects.push({ x: x!, y: y!, w: w!, h: h! });
      } else if (t === 'Tm' && current) {
        const [, , , , e, f] = nums.slice(-6);
        current.texts.push({ x: e!, y: f! });
      }
      // Only a `cm` straight after a top-level `q` opens a label block.
      if (t !== 'q') pendingQ = false;
      nums.length = 0;
    }
    const { width, height } = page.getSize();
    return { width, height, blocks };
  });
}
