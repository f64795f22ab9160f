'use client';

import { useEffect, useMemo, useRef, useState, useSyncExternalStore } from 'react';
import {
  DispersionPlot,
  type DispersionPlotHandle,
  type MeasuredPoint,
  type PlotFinding,
  type PlotPoint,
  type PlotRenderInfo,
} from '@/components/plot/dispersion-plot';
import { SEVERITY_LOOK } from '@/components/plot/plot-style';
import { Button } from '@/components/ui/button';
import { Glyph } from '@/components/ui/glyph';
import { syntheticBands } from '@/lib/plot/synthetic-bands';
import { decodePlotData, encodePlotData, type PlotData } from '@/lib/plot/wire';
import { NaivePlot } from './naive-plot';

/** What the benchmark reads from the page. */
export interface PlotBenchHook {
  ready: boolean;
  mode: 'ours' | 'naive';
  /** Generation + encode + decode of the synthetic data, ms. */
  prepareMs: number;
  /** First drawing: setOption (with decimation for ours) to `finished`, ms. */
  firstDrawMs: number | null;
  /** performance.now() at the first `finished`: from navigation start. */
  firstDrawAt: number | null;
  points: number;
  /** The latest drawing's report, with its phases. */
  last: PlotRenderInfo | null;
  /** Zoom the view by `factor` about its centre; resolves with the redraw time in ms. */
  zoom(factor: number): Promise<number>;
  reset(): Promise<number>;
}

declare global {
  interface Window {
    __plot?: PlotBenchHook;
  }
}

const noSubscribe = () => () => {};

function prepare(branches: number, points: number, soft: boolean, top?: number): PlotData {
  const { dispersion, geometry } = syntheticBands({ branches, points, softMode: soft, top });
  // Through the wire format, as the spectrum page gets it from the API.
  return decodePlotData(encodePlotData(dispersion, geometry));
}

/** The harness's data (and the overlay's), timed: a module function, so rendering stays pure. */
function prepareAll(branches: number, points: number, soft: boolean, withOverlay: boolean) {
  const t0 = performance.now();
  const data = prepare(branches, points, soft);
  const overlay = withOverlay ? prepare(branches, points, false, 46) : null;
  return { data, overlay, ms: performance.now() - t0 };
}

function demoFindings(d: PlotData): PlotFinding[] {
  const out: PlotFinding[] = [];
  // The most negative point of the lowest branch, when there is one.
  let min = 0;
  let at = -1;
  for (let i = 0; i < d.nq; i++) {
    if (d.frequencies[i] < min) {
      min = d.frequencies[i];
      at = i;
    }
  }
  if (at >= 0) out.push({ id: 'f1', severity: 'fail', index: at, branch: 0, value: min, label: `imaginary mode, ${min.toFixed(2)} THz` });
  const gammas = d.labels.filter((l) => l.label === 'Γ').map((l) => l.index);
  if (gammas[1] !== undefined) out.push({ id: 'w1', severity: 'warn', index: gammas[1], branch: Math.min(2, d.nb - 1), label: 'acoustic branch off zero at Γ' });
  const xs = d.labels.filter((l) => l.label === 'X').map((l) => l.index);
  if (xs[0] !== undefined && d.nb > 6) out.push({ id: 'w2', severity: 'warn', index: xs[0], branch: Math.floor(d.nb / 2), label: 'step at a segment join' });
  const ls = d.labels.filter((l) => l.label === 'L').map((l) => l.index);
  if (ls[0] !== undefined) out.push({ id: 'i1', severity: 'info', index: ls[0], branch: d.nb - 1, label: 'q folded into the first zone' });
  return out;
}

function demoMeasured(d: PlotData): MeasuredPoint[] {
  const out: MeasuredPoint[] = [];
  const k = Math.min(2, d.nb - 1);
  for (let i = 3; i < d.nq * 0.18; i += Math.max(1, Math.floor(d.nq / 60))) {
    out.push({ index: i, frequencyTHz: d.frequencies[k * d.nq + i] * (1 + 0.03 * Math.sin(i)), uncertaintyTHz: 0.1 });
  }
  return out;
}

export function PlotHarness(props: {
  branches: number;
  points: number;
  mode: 'ours' | 'naive';
  overlay: boolean;
  measured: boolean;
  soft: boolean;
  height: number;
}) {
  // Generated in the browser only: never on the server, never in the HTML.
  const inBrowser = useSyncExternalStore(
    noSubscribe,
    () => true,
    () => false,
  );
  const prepared = useMemo(() => {
    if (!inBrowser) return null;
    return prepareAll(props.branches, props.points, props.soft, props.overlay);
  }, [inBrowser, props.branches, props.points, props.soft, props.overlay]);
  const data = prepared?.data ?? null;
  const overlay = prepared?.overlay ?? null;
  const prepareMs = prepared?.ms ?? 0;
  const [timings, setTimings] = useState<PlotRenderInfo[]>([]);
  const [clicked, setClicked] = useState<PlotPoint | null>(null);
  const [highlight, setHighlight] = useState<PlotFinding | null>(null);
  const handle = useRef<DispersionPlotHandle>(null);
  const naive = useRef<{ zoom(f: number): void; reset(): void } | null>(null);
  const waiting = useRef<((ms: number) => void) | null>(null);
  // The chart may finish its first drawing inside setOption, before this component's effects
  // run: keep it until the hook exists.
  const firstDraw = useRef<{ ms: number; at: number; points: number } | null>(null);

  const findings = useMemo(() => (data ? demoFindings(data) : []), [data]);
  const measured = useMemo(() => (data && props.measured ? demoMeasured(data) : []), [data, props.measured]);

  const onRendered = (info: PlotRenderInfo) => {
    setTimings((t) => [...t.slice(-5), info]);
    if (!firstDraw.current) firstDraw.current = { ms: info.ms, at: performance.now(), points: info.points };
    const hook = window.__plot;
    if (hook) hook.last = info;
    if (hook && !hook.ready) {
      hook.ready = true;
      hook.firstDrawMs = firstDraw.current.ms;
      hook.firstDrawAt = firstDraw.current.at;
      hook.points = firstDraw.current.points;
    }
    const w = waiting.current;
    waiting.current = null;
    w?.(info.ms);
  };

  useEffect(() => {
    if (!data) return;
    const redraw = (act: () => void) =>
      new Promise<number>((resolve) => {
        waiting.current = resolve;
        act();
      });
    const first = firstDraw.current;
    window.__plot = {
      ready: first !== null,
      mode: props.mode,
      prepareMs,
      firstDrawMs: first?.ms ?? null,
      firstDrawAt: first?.at ?? null,
      points: first?.points ?? 0,
      last: null,
      zoom: (f) => redraw(() => (props.mode === 'naive' ? naive.current?.zoom(f) : handle.current?.zoom(f))),
      reset: () => redraw(() => (props.mode === 'naive' ? naive.current?.reset() : handle.current?.reset())),
    };
  }, [data, prepareMs, props.mode]);

  if (!data) return <p className="text-sm text-paper-700">Generating {props.branches * props.points} values…</p>;

  return (
    <div className="space-y-4">
      {props.mode === 'naive' ? (
        <NaivePlot data={data} ref={naive} onRendered={onRendered} height={props.height} />
      ) : (
        <DispersionPlot
          ref={handle}
          data={data}
          findings={findings}
          highlight={highlight}
          overlay={overlay}
          overlayLabel="Earlier revision (synthetic)"
          measured={measured}
          onPointClick={setClicked}
          onRendered={onRendered}
          height={props.height}
        />
      )}
      <div className="grid gap-4 sm:grid-cols-3">
        <section className="rounded-md border border-paper-300 bg-paper-0 p-3 text-xs">
          <h2 className="mb-1 font-semibold text-paper-900">Findings (demo)</h2>
          <ul className="space-y-1">
            {findings.map((f) => (
              <li key={f.id}>
                <button
                  type="button"
                  className="flex items-center gap-1.5 text-left hover:underline"
                  aria-pressed={highlight?.id === f.id}
                  onClick={() => setHighlight(highlight?.id === f.id ? null : f)}
                  data-testid={`harness-finding-${f.id}`}
                >
                  <span style={{ color: SEVERITY_LOOK[f.severity].color }}>
                    <Glyph shape={SEVERITY_LOOK[f.severity].glyph} />
                  </span>
                  {SEVERITY_LOOK[f.severity].word}: {f.label} (point {f.index})
                </button>
              </li>
            ))}
          </ul>
        </section>
        <section className="rounded-md border border-paper-300 bg-paper-0 p-3 text-xs" aria-live="polite">
          <h2 className="mb-1 font-semibold text-paper-900">Last point clicked</h2>
          {clicked ? (
            <pre className="font-mono text-2xs" data-testid="harness-clicked">
              {JSON.stringify({ index: clicked.index, branch: clicked.branch, frequencyTHz: +clicked.frequencyTHz.toFixed(5), q: clicked.q.folded }, null, 1)}
            </pre>
          ) : (
            <p className="text-paper-600">Click a line (or press Enter on the keyboard cursor).</p>
          )}
        </section>
        <section className="rounded-md border border-paper-300 bg-paper-0 p-3 text-xs">
          <h2 className="mb-1 font-semibold text-paper-900">Timings</h2>
          <p>prepare (generate, encode, decode): {prepareMs.toFixed(0)} ms</p>
          <ul className="tabular font-mono text-2xs" data-testid="harness-timings">
            {timings.map((t, i) => (
              <li key={i}>
                {t.kind}: {t.ms.toFixed(1)} ms, {t.points.toLocaleString('en')} points
              </li>
            ))}
          </ul>
          <div className="mt-2 flex gap-1">
            <Button size="sm" variant="secondary" onClick={() => window.__plot?.zoom(0.5)}>
              Zoom ×2 (timed)
            </Button>
          </div>
        </section>
      </div>
    </div>
  );
}
