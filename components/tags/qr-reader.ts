import { BrowserQRCodeReader, HTMLCanvasElementLuminanceSource } from '@zxing/browser';
import type { Result } from '@zxing/library';
import { decodeFrame } from '@/lib/tags/qr-decode';

/** The Scan page's QR reader: the stock camera loop, each frame decoded the ways lib/tags/qr-decode.ts lists. */
export class TagQrReader extends BrowserQRCodeReader {
  override decodeFromCanvas(canvas: HTMLCanvasElement): Result {
    return decodeFrame(new HTMLCanvasElementLuminanceSource(canvas), (bitmap) => this.decodeBitmap(bitmap));
  }
}
