import { z } from 'zod';
import { AppError } from '@/lib/errors';

// Opaque keyset cursors: the sort key and id of the last row, base64url JSON.
const cursorSchema = z.object({ k: z.union([z.string(), z.number(), z.null()]), id: z.uuid() });
export type Cursor = z.infer<typeof cursorSchema>;

export function encodeCursor(cursor: Cursor): string {
  return Buffer.from(JSON.stringify(cursor)).toString('base64url');
}

export function decodeCursor(value: string | undefined): Cursor | null {
  if (!value) return null;
  try {
    return cursorSchema.parse(JSON.parse(Buffer.from(value, 'base64url').toString('utf8')));
  } catch {
    throw new AppError('bad_request', 'The page cursor is not valid; start from the first page.');
  }
}

export interface Page<T> {
  items: T[];
  nextCursor: string | null;
}
