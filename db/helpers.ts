// SQL helpers that know no domain. Who sees what is lib/auth/scope.ts.

/** Escapes LIKE wildcards so user text matches literally. */
export function escapeLike(value: string): string {
  return value.replace(/[\\%_]/g, (c) => `\\${c}`);
}
