// A closed list of values and the words people read for each, written once: the values come from
// the labels' keys, in the order written (for selects, zod enums and check constraints alike).
// Keys are names, never numbers (JavaScript lists integer keys first). No imports: safe anywhere.

type Labels = Readonly<Record<string, string>>;

export function labelled<const L extends Labels>(labels: L): { values: readonly [keyof L & string, ...(keyof L & string)[]]; labels: Readonly<Record<keyof L & string, string>> } {
  const values = Object.keys(labels);
  if (values.length === 0) throw new Error('A list of choices needs at least one value.');
  // Object.keys widens to string[]; these are exactly L's own keys (a literal object, not a class).
  return { values: values as [keyof L & string, ...(keyof L & string)[]], labels };
}
