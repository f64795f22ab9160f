import { afterEach, describe, expect, it } from 'vitest';
import { onPhase, timed, timedSync, type PhaseRecord } from './timing';

describe('timed phases', () => {
  const stops: (() => void)[] = [];
  afterEach(() => stops.splice(0).forEach((s) => s()));

  it('reports each phase with its name, start and end, in the order they end', async () => {
    const seen: PhaseRecord[] = [];
    stops.push(onPhase((p) => seen.push(p)));
    const value = await timed('outer', async () => {
      await new Promise((r) => setTimeout(r, 5));
      return timedSync('inner', () => 42);
    });
    expect(value).toBe(42);
    expect(seen.map((p) => p.name)).toEqual(['inner', 'outer']);
    const [inner, outer] = seen;
    expect(outer.end - outer.start).toBeGreaterThanOrEqual(4);
    expect(inner.start).toBeGreaterThanOrEqual(outer.start);
    expect(inner.end).toBeLessThanOrEqual(outer.end);
  });

  it('reports a phase that throws, and passes the error on', async () => {
    const seen: string[] = [];
    stops.push(onPhase((p) => seen.push(p.name)));
    await expect(timed('fails', () => Promise.reject(new Error('no')))).rejects.toThrow('no');
    const boom = (): never => {
      throw new Error('no');
    };
    expect(() => timedSync('fails too', boom)).toThrow('no');
    expect(seen).toEqual(['fails', 'fails too']);
  });

  it('runs the work unchanged when nobody listens, and stops reporting once a listener stops', async () => {
    const seen: string[] = [];
    const stop = onPhase((p) => seen.push(p.name));
    stop();
    expect(await timed('quiet', async () => 'done')).toBe('done');
    expect(seen).toEqual([]);
  });
});
