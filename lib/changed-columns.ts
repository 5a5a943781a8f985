/**
 * The columns a partial update writes: a field left undefined keeps its stored value, while null
 * clears it. Spelled as the column map itself (`{ name: input.name, postal_code: input.postalCode }`)
 * instead of one conditional spread per field.
 */
export function changedColumns<T extends Record<string, unknown>>(values: T): { [K in keyof T]?: Exclude<T[K], undefined> } {
  // Object.fromEntries widens to a string-keyed record; the kept entries are T's own, minus the undefined ones.
  return Object.fromEntries(Object.entries(values).filter(([, v]) => v !== undefined)) as { [K in keyof T]?: Exclude<T[K], undefined> };
}
