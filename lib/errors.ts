/**
 * The one error taxonomy. Services throw AppError; the wrappers in lib/http turn it into
 * `{"error": {"code", "message", "details"}}` with the status below. Anything else becomes a
 * generic 500: its message and stack stay in the server log.
 */
export const errorStatus = {
  invalid_input: 400,
  unauthenticated: 401,
  forbidden: 403,
  not_found: 404,
  conflict: 409,
  too_large: 413,
  unparsable: 422,
  internal: 500,
  unavailable: 503,
} as const;

export type ErrorCode = keyof typeof errorStatus;

const defaultMessage: Record<ErrorCode, string> = {
  invalid_input: 'The input is not valid.',
  unauthenticated: 'Sign in first.',
  forbidden: 'Your role does not allow this.',
  not_found: 'Not found.',
  conflict: 'This conflicts with the current state.',
  too_large: 'The file is too large.',
  unparsable: 'The file could not be read.',
  internal: 'Something went wrong on our side.',
  unavailable: 'A service is unavailable; try again shortly.',
};

export class AppError extends Error {
  readonly code: ErrorCode;
  readonly details?: unknown;

  constructor(code: ErrorCode, message?: string, details?: unknown) {
    super(message ?? defaultMessage[code]);
    this.name = 'AppError';
    this.code = code;
    this.details = details;
  }

  get status(): number {
    return errorStatus[this.code];
  }
}

export interface ErrorBody {
  error: { code: ErrorCode; message: string; details?: unknown };
}

export function isAppError(e: unknown): e is AppError {
  return e instanceof AppError;
}

/** What the client may see. A 500 never carries the internal message or details. */
export function toErrorBody(e: AppError): ErrorBody {
  if (e.code === 'internal') return { error: { code: 'internal', message: defaultMessage.internal } };
  return { error: { code: e.code, message: e.message, ...(e.details === undefined ? {} : { details: e.details }) } };
}

export const notFound = (what = 'Not found.') => new AppError('not_found', what);
