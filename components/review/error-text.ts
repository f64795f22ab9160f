import { isApiError } from '@/lib/client/api-error';

/** The server's own words for a refused change (409 on a stale revision, 400 naming a field). */
export function errorText(e: unknown): string {
  if (isApiError(e)) return e.message;
  if (e instanceof Error) return e.message;
  return 'Something went wrong; try again.';
}
