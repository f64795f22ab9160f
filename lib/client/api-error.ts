/** An error answer of the JSON API (`{"error": {"code", "message", "details"}}`), on the client. */
export class ApiError extends Error {
  readonly status: number;
  readonly code: string;
  readonly details?: unknown;

  constructor(status: number, code: string, message: string, details?: unknown) {
    super(message);
    this.name = 'ApiError';
    this.status = status;
    this.code = code;
    this.details = details;
  }
}

/** Turns a non-2xx response into an ApiError with the server's own words when it sent them. */
export async function apiErrorOf(res: Response): Promise<ApiError> {
  let body: unknown = null;
  try {
    body = await res.json();
  } catch {
    // Not JSON (a proxy page, an empty body): fall back to the status line below.
  }
  const err = (body as { error?: { code?: unknown; message?: unknown; details?: unknown } } | null)?.error;
  if (err && typeof err.message === 'string') {
    return new ApiError(res.status, typeof err.code === 'string' ? err.code : 'error', err.message, err.details);
  }
  return new ApiError(res.status, 'http', `The server answered ${res.status}${res.statusText ? ` ${res.statusText}` : ''}.`);
}

export function isApiError(e: unknown): e is ApiError {
  return e instanceof ApiError;
}
