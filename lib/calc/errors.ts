// Typed errors for the calculations. The API layer maps both codes to HTTP 422.

export type CalcErrorCode = 'invalid_input' | 'out_of_range';

export abstract class CalcError extends Error {
  abstract readonly code: CalcErrorCode;
  /** Input field the error refers to, when there is one (for form messages). */
  readonly field: string | undefined;

  constructor(message: string, field?: string) {
    super(message);
    this.name = new.target.name;
    this.field = field;
  }
}

/** The input itself is unusable: not a number, negative charge, unknown refrigerant, … */
export class CalcInputError extends CalcError {
  readonly code = 'invalid_input' as const;
}

/** A valid input outside the range the calculation covers (above critical, below the data, …). */
export class CalcRangeError extends CalcError {
  readonly code = 'out_of_range' as const;
}

export function isCalcError(error: unknown): error is CalcError {
  return error instanceof CalcError;
}

export function requireFinite(value: number, field: string): number {
  if (typeof value !== 'number' || !Number.isFinite(value)) {
    throw new CalcInputError(`${field} must be a finite number (got ${String(value)})`, field);
  }
  return value;
}

export function requirePositive(value: number, field: string): number {
  requireFinite(value, field);
  if (value <= 0) throw new CalcInputError(`${field} must be greater than zero (got ${fmt(value, 2)})`, field);
  return value;
}

export function requireNonNegative(value: number, field: string): number {
  requireFinite(value, field);
  if (value < 0) throw new CalcInputError(`${field} must not be negative (got ${fmt(value, 2)})`, field);
  return value;
}

/** Rounds for messages without trailing zeros: fmt(30.978, 2) → "30.98". */
export function fmt(value: number, digits = 2): string {
  const rounded = Number(value.toFixed(digits));
  return String(Object.is(rounded, -0) ? 0 : rounded);
}
