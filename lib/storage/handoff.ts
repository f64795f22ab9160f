/**
 * Files this process has just stored, kept briefly in memory for the screening worker when it
 * runs in the same process (the default: the worker starts with the app). Saves reading the
 * bytes back from the upload service a moment after sending them there, and, when the file was
 * parsed while it was being stored, parsing it again. Bounded in size and time; a miss simply
 * reads from storage and parses.
 */
import type { Dispersion } from '@/lib/dispersion/types';
import type { ParseError } from '@/lib/parsers';

const MAX_TOTAL_BYTES = 160 * 1024 * 1024;
const TTL_MS = 5 * 60_000;

/** The outcome of parsing the bytes while they were being stored. */
export type ParsedAhead = { dispersion: Dispersion } | { error: ParseError };

export interface Handoff {
  bytes: Uint8Array;
  parsed: ParsedAhead | null;
}

interface Entry extends Handoff {
  at: number;
  size: number;
}
const holder = globalThis as typeof globalThis & { __branchwiseHandoff?: Map<string, Entry> };
const cache = (holder.__branchwiseHandoff ??= new Map());

function total(): number {
  let n = 0;
  for (const e of cache.values()) n += e.size;
  return n;
}

function sizeOf(bytes: Uint8Array, parsed: ParsedAhead | null): number {
  if (!parsed || !('dispersion' in parsed)) return bytes.byteLength;
  const d = parsed.dispersion;
  return bytes.byteLength + [d.frequencies, d.q, d.distance, d.weights].reduce((n, a) => n + (a?.byteLength ?? 0), 0);
}

export function rememberStored(key: string, bytes: Uint8Array, parsed: ParsedAhead | null = null): void {
  const now = Date.now();
  cache.delete(key);
  for (const [k, e] of cache) if (now - e.at > TTL_MS) cache.delete(k);
  const size = sizeOf(bytes, parsed);
  if (size > MAX_TOTAL_BYTES) return;
  while (cache.size && total() + size > MAX_TOTAL_BYTES) cache.delete(cache.keys().next().value!);
  cache.set(key, { bytes, parsed, at: now, size });
}

/** What this process stored under `key` (and parsed, if it did), once (the entry is dropped), or null. */
export function takeHandoff(key: string, size: number): Handoff | null {
  const e = cache.get(key);
  cache.delete(key);
  if (!e || Date.now() - e.at > TTL_MS || e.bytes.byteLength !== size) return null;
  return { bytes: e.bytes, parsed: e.parsed };
}

/** The bytes stored under `key` by this process, once (the entry is dropped), or null. */
export function takeStored(key: string, size: number): Uint8Array | null {
  return takeHandoff(key, size)?.bytes ?? null;
}
