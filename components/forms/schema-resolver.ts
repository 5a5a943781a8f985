import { toNestErrors } from '@hookform/resolvers';
import type { FieldError, FieldValues, Resolver } from 'react-hook-form';
import type { z } from 'zod';
import { formatQuantity, type Quantity, type UnitPrefs } from '@/lib/units/quantities';

// One validator for every record form: the form holds text as typed (numbers in the reader's
// units), `toInput` turns it into the schema's SI input, and the schema decides. What the form
// submits is the schema's own parsed output, so nothing is cast; a range error on a number with a
// unit is said in the reader's units, from the schema's own limit.

/** A number field shown in the reader's units. */
export interface UnitField {
  label: string;
  quantity: Quantity;
}

/** Errors by dotted field path, for a form to reword before they are shown. */
export type PathErrors = Record<string, FieldError>;

interface SchemaResolverOptions<TForm> {
  /** Number fields in the reader's units, by path. */
  unitFields?: Record<string, UnitField>;
  prefs?: UnitPrefs;
  /** Last say on the errors: rename paths (a schema key shown as another field) or reword. */
  adjust?: (errors: PathErrors, values: TForm) => void;
}

type Issue = z.core.$ZodIssue;

function rangeMessage(issue: Issue, field: UnitField, prefs: UnitPrefs): string | null {
  if (issue.code === 'too_small') return `${field.label} must be ${issue.inclusive === false ? 'above' : 'at least'} ${formatQuantity(Number(issue.minimum), field.quantity, prefs)}.`;
  if (issue.code === 'too_big') return `${field.label} must be ${issue.inclusive === false ? 'below' : 'at most'} ${formatQuantity(Number(issue.maximum), field.quantity, prefs)}.`;
  return null;
}

/** The first error at each path (`root` for the form as a whole), range errors on unit fields in the reader's units. */
export function pathErrors(issues: readonly Issue[], unitFields: Record<string, UnitField> = {}, prefs?: UnitPrefs): PathErrors {
  const errors: PathErrors = {};
  const all: Issue[] = [...issues];
  // for…of also visits what is pushed while it runs.
  for (const issue of all) {
    // A plain union says only that no branch fitted; the branches' own issues name the fields.
    if (issue.code === 'invalid_union') all.push(...issue.errors.flat().map((e) => ({ ...e, path: [...issue.path, ...e.path] })));
    // An issue about the whole form (no path) is react-hook-form's `root` error.
    const path = issue.path.map(String).join('.') || 'root';
    if (errors[path]) continue;
    const field = unitFields[path];
    errors[path] = { type: issue.code, message: (field && prefs ? rangeMessage(issue, field, prefs) : null) ?? issue.message };
  }
  return errors;
}

export function schemaResolver<TForm extends FieldValues, TOut>(
  schema: z.ZodType<TOut>,
  toInput: (values: TForm) => unknown,
  { unitFields, prefs, adjust }: SchemaResolverOptions<TForm> = {},
): Resolver<TForm, unknown, TOut> {
  return async (values, _context, options) => {
    const parsed = schema.safeParse(toInput(values));
    if (parsed.success) return { values: parsed.data, errors: {} };
    const errors = pathErrors(parsed.error.issues, unitFields, prefs);
    adjust?.(errors, values);
    return { values: {}, errors: toNestErrors(errors, options) };
  };
}
