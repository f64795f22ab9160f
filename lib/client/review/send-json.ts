import { apiErrorOf } from '../api-error';

/** A JSON request that changes something; a non-2xx answer throws the server's ApiError. */
export async function sendJson<T>(method: 'POST' | 'PUT' | 'PATCH', url: string, body: unknown): Promise<T> {
  const res = await fetch(url, {
    method,
    credentials: 'same-origin',
    cache: 'no-store',
    headers: { 'Content-Type': 'application/json', Accept: 'application/json' },
    body: JSON.stringify(body),
  });
  if (!res.ok) throw await apiErrorOf(res);
  return (await res.json()) as T;
}
