import { apiErrorOf } from './api-error';

// Same-origin calls: the session cookie goes along; nothing is cached by the browser because
// TanStack Query decides when to refetch.
const init = (signal?: AbortSignal): RequestInit => ({ credentials: 'same-origin', cache: 'no-store', signal });

export async function getJson<T>(url: string, signal?: AbortSignal): Promise<T> {
  const res = await fetch(url, { ...init(signal), headers: { Accept: 'application/json' } });
  if (!res.ok) throw await apiErrorOf(res);
  return (await res.json()) as T;
}

export async function getBytes(url: string, signal?: AbortSignal): Promise<ArrayBuffer> {
  const res = await fetch(url, init(signal));
  if (!res.ok) throw await apiErrorOf(res);
  return res.arrayBuffer();
}
