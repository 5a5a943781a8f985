// One closed list of error codes, each with its HTTP status, so no handler types a status by hand.
export const errorStatus = {
  bad_request: 400,
  unauthorized: 401,
  forbidden: 403,
  not_found: 404,
  conflict: 409,
  payload_too_large: 413,
  unsupported_media_type: 415,
  validation_failed: 422,
  too_many_requests: 429,
  internal: 500,
  unavailable: 503,
} as const;

export type ErrorCode = keyof typeof errorStatus;

export interface ErrorIssue {
  path: string;
  message: string;
}

export interface ErrorBody {
  error: { code: ErrorCode; message: string; issues?: ErrorIssue[] };
}

export class AppError extends Error {
  readonly code: ErrorCode;
  readonly issues?: ErrorIssue[];

  constructor(code: ErrorCode, message?: string, issues?: ErrorIssue[]) {
    super(message ?? defaultMessages[code]);
    this.name = 'AppError';
    this.code = code;
    this.issues = issues;
  }

  get status(): number {
    return errorStatus[this.code];
  }

  toBody(): ErrorBody {
    return { error: { code: this.code, message: this.message, ...(this.issues ? { issues: this.issues } : {}) } };
  }
}

const defaultMessages: Record<ErrorCode, string> = {
  bad_request: 'The request could not be read.',
  unauthorized: 'Sign in to continue.',
  forbidden: 'Your role does not allow this.',
  not_found: 'Not found.',
  conflict: 'This conflicts with an existing record.',
  payload_too_large: 'The upload is too large.',
  unsupported_media_type: 'This file type is not supported.',
  validation_failed: 'Some fields need attention.',
  too_many_requests: 'Too many attempts. Wait a moment and try again.',
  internal: 'Something went wrong on our side. Nothing was changed.',
  unavailable: 'A service is unavailable.',
};

export function isAppError(e: unknown): e is AppError {
  return e instanceof AppError;
}

/** The row a lookup found, or a 404 saying what was not found (also what a record outside scope reads as). */
export function foundOr404<T>(row: T | undefined, message: string): T {
  if (row === undefined) throw new AppError('not_found', message);
  return row;
}
