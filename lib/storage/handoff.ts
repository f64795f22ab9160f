/**
 * Files this process has just stored, kept briefly in memory for the screening worker when it
 * runs in the same process (the default: the worker starts with the app). Saves reading the
 * bytes back from the upload service a moment after sending them there. Bounded in size and
 * time; a miss simply reads from storage.
 */
const MAX_TOTAL_BYTES = 160 * 1024 * 1024;
const TTL_MS = 5 * 60_000;

interface Entry {
  bytes: Uint8Array;
  at: number;
}
const holder = globalThis as typeof globalThis & { __branchwiseHandoff?: Map<string, Entry> };
const cache = (holder.__branchwiseHandoff ??= new Map());

function total(): number {
  let n = 0;
  for (const e of cache.values()) n += e.bytes.byteLength;
  return n;
}

export function rememberStored(key: string, bytes: Uint8Array): void {
  const now = Date.now();
  for (const [k, e] of cache) if (now - e.at > TTL_MS) cache.delete(k);
  if (bytes.byteLength > MAX_TOTAL_BYTES) return;
  while (cache.size && total() + bytes.byteLength > MAX_TOTAL_BYTES) cache.delete(cache.keys().next().value!);
  cache.set(key, { bytes, at: now });
}

/** The bytes stored under `key` by this process, once (the entry is dropped), or null. */
export function takeStored(key: string, size: number): Uint8Array | null {
  const e = cache.get(key);
  cache.delete(key);
  if (!e || Date.now() - e.at > TTL_MS || e.bytes.byteLength !== size) return null;
  return e.bytes;
}
