import { BinaryBitmap, GlobalHistogramBinarizer, HybridBinarizer, PlanarYUVLuminanceSource, type LuminanceSource, type Result } from '@zxing/library';

// The stock decoder thresholds a frame one way (the local "hybrid" binarizer) at full size, and
// its symbol detector misses some perfectly sharp symbols at some sizes: on clean 640×480
// frames of our own printed labels it failed about one code in fifteen, on every frame alike,
// so a steady camera never got there. Each miss here is retried with the global-histogram
// binarizer, then both again on the frame at half and at quarter size; together they read all
// 120 of a sample that the single pass missed 8 of. The retries cost time only on frames that
// hold no readable symbol (tests/unit/tags.qr-decode.test.ts).

type Decode = (bitmap: BinaryBitmap) => Result;

function twoWays(source: LuminanceSource, decode: Decode): Result {
  try {
    return decode(new BinaryBitmap(new HybridBinarizer(source)));
  } catch {
    return decode(new BinaryBitmap(new GlobalHistogramBinarizer(source)));
  }
}

/** The frame at half size, each pixel the mean of a 2×2 block. */
export function halfSize(source: LuminanceSource): LuminanceSource {
  const w = source.getWidth();
  const h = source.getHeight();
  const hw = w >> 1;
  const hh = h >> 1;
  const full = source.getMatrix();
  const half = new Uint8ClampedArray(hw * hh);
  for (let y = 0; y < hh; y++) {
    const r0 = 2 * y * w;
    const r1 = r0 + w;
    for (let x = 0; x < hw; x++) {
      const c = 2 * x;
      half[y * hw + x] = (full[r0 + c]! + full[r0 + c + 1]! + full[r1 + c]! + full[r1 + c + 1]! + 2) >> 2;
    }
  }
  return new PlanarYUVLuminanceSource(half, hw, hh, 0, 0, hw, hh, false);
}

/** Smallest side worth decoding at: a symbol filling less than this cannot be read anyway. */
const MIN_SIDE = 100;

/** Decodes one camera frame, trying the ways above in turn; rethrows the first failure. */
export function decodeFrame(source: LuminanceSource, decode: Decode): Result {
  let first: unknown;
  let frame: LuminanceSource | null = source;
  for (let level = 0; level < 3 && frame; level++) {
    try {
      return twoWays(frame, decode);
    } catch (error) {
      first ??= error;
    }
    frame = Math.min(frame.getWidth(), frame.getHeight()) >= 2 * MIN_SIDE ? halfSize(frame) : null;
  }
  // The first failure (not found / unreadable) is what the scan loop's retry logic expects.
  throw first;
}
