// The compression middleware (npm "compression" 1.8) as server.ts calls it: on Node's own request
// and response, without Express (its published types are written against Express's).
declare module 'compression' {
  import type { IncomingMessage, ServerResponse } from 'node:http';
  import type { BrotliOptions, ZlibOptions } from 'node:zlib';

  interface CompressionOptions extends ZlibOptions {
    brotli?: BrotliOptions;
    threshold?: number | string;
    filter?: (req: IncomingMessage, res: ServerResponse) => boolean;
  }

  function compression(options?: CompressionOptions): (req: IncomingMessage, res: ServerResponse, next: (error?: unknown) => void) => void;
  namespace compression {
    /** The default filter: whether the response's type is compressible. */
    function filter(req: IncomingMessage, res: ServerResponse): boolean;
  }
  export default compression;
}
