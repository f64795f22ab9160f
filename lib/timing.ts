/**
 * Named phases of a request or a job (the upload route, the screening worker), reported to
 * listeners with their start and end on this process's `performance.now()` clock. Benchmarks
 * listen (bench:upload prints where an upload's time goes); with no listener a phase costs one
 * size check. No framework imports.
 */
export interface PhaseRecord {
  name: string;
  start: number;
  end: number;
}

type Listener = (phase: PhaseRecord) => void;

const holder = globalThis as typeof globalThis & { __branchwisePhaseListeners?: Set<Listener> };
const listeners = (holder.__branchwisePhaseListeners ??= new Set());

/** Calls `listener` for every phase that ends from now on; returns the function that stops it. */
export function onPhase(listener: Listener): () => void {
  listeners.add(listener);
  return () => void listeners.delete(listener);
}

function report(name: string, start: number): void {
  const phase = { name, start, end: performance.now() };
  for (const l of listeners) l(phase);
}

/** Runs `fn` as the phase `name` (reported also when it throws). */
export async function timed<T>(name: string, fn: () => Promise<T>): Promise<T> {
  if (listeners.size === 0) return fn();
  const start = performance.now();
  try {
    return await fn();
  } finally {
    report(name, start);
  }
}

/** The synchronous form of `timed`. */
export function timedSync<T>(name: string, fn: () => T): T {
  if (listeners.size === 0) return fn();
  const start = performance.now();
  try {
    return fn();
  } finally {
    report(name, start);
  }
}
