'use client';

import { useMemo, useState } from 'react';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { Field } from '@/components/ui/field';
import { Panel } from '@/components/ui/panel';
import { Select } from '@/components/ui/select';
import type { FrequencyUnit } from '@/lib/dispersion/types';
import { fromTHz } from '@/lib/physics/units';
import type { PlotData } from '@/lib/plot/wire';
import { MeasuredCsvError, measuredDeviation, parseMeasuredCsv, type MeasuredRow } from '@/lib/client/review/measured-points';
import type { DerivedResponse } from '@/lib/client/review/review-types';
import { useDerived } from '@/lib/client/review/use-review';
import { frequencyText } from './anchor-text';
import { SmallLineChart, type SmallSeries } from './small-line-chart';

const ms = (v: number | null) => (v === null || !Number.isFinite(v) ? '—' : Math.round(v).toLocaleString('en'));

function SoundTable({ d }: { d: DerivedResponse }) {
  if (d.sound.length === 0) return null;
  const n = d.acoustic;
  return (
    <table className="w-full text-sm" data-testid="sound-velocities">
      <caption className="mb-1 text-left text-xs text-paper-700">
        Acoustic branches leaving Γ, m/s: the slope fitted over the first 5 % of each segment, and |dν/dk| at the first point off Γ.
      </caption>
      <thead className="text-left text-2xs uppercase tracking-wide text-paper-600">
        <tr>
          <th scope="col" className="py-1 pr-2">From Γ toward</th>
          {Array.from({ length: n }, (_, k) => (
            <th key={k} scope="col" className="py-1 pr-2">
              Branch {k} <span className="normal-case">(fit / first point)</span>
            </th>
          ))}
        </tr>
      </thead>
      <tbody className="tabular divide-y divide-paper-100">
        {d.sound.map((s) => (
          <tr key={`${s.segment}-${s.gammaIndex}`}>
            <th scope="row" className="py-1 pr-2 text-left font-medium text-paper-900">
              {s.toward ?? `segment ${s.segment}`}
            </th>
            {s.velocities.map((v, k) => (
              <td key={k} className="py-1 pr-2">
                {ms(v)} <span className="text-paper-600">/</span> <span className="text-paper-700">{ms(s.groupNearGamma[k])}</span>
              </td>
            ))}
          </tr>
        ))}
      </tbody>
    </table>
  );
}

function MeshCharts({ d, unit }: { d: DerivedResponse; unit: FrequencyUnit }) {
  const dos = useMemo<SmallSeries[]>(
    () => (d.dos ? [{ name: 'DOS', data: d.dos.frequencies.map((f, i) => [fromTHz(f, unit), d.dos!.values[i]] as [number, number]) }] : []),
    [d, unit],
  );
  const t = d.thermo;
  const heat = useMemo<SmallSeries[]>(() => (t ? [{ name: 'C_V', data: t.temperatures.map((T, i) => [T, t.heatCapacity[i]]) }, { name: 'S', data: t.temperatures.map((T, i) => [T, t.entropy[i]]), dashed: true }] : []), [t]);
  const free = useMemo<SmallSeries[]>(() => (t ? [{ name: 'F', data: t.temperatures.map((T, i) => [T, t.freeEnergy[i]]) }] : []), [t]);
  if (!d.dos || !t) return null;
  return (
    <div className="grid gap-4 lg:grid-cols-2" data-testid="mesh-derived">
      <div>
        <h3 className="text-xs font-semibold text-paper-800">Density of states (Gaussian σ = {frequencyText(d.dos.sigmaTHz, unit)})</h3>
        <SmallLineChart series={dos} xName={unit === 'cm-1' ? 'cm⁻¹' : unit} yName="states / THz / cell" label="Phonon density of states" />
      </div>
      <div>
        <h3 className="text-xs font-semibold text-paper-800">Heat capacity C_V and entropy S, J/(mol·K) per mole of cells</h3>
        <SmallLineChart series={heat} xName="T (K)" yName="J/(mol·K)" label="Heat capacity and entropy against temperature" />
      </div>
      <div>
        <h3 className="text-xs font-semibold text-paper-800">Helmholtz free energy F, kJ/mol per mole of cells</h3>
        <SmallLineChart series={free} xName="T (K)" yName="kJ/mol" label="Free energy against temperature" />
      </div>
      <dl className="grid grid-cols-[auto_1fr] content-start gap-x-3 gap-y-1 text-sm">
        <dt className="text-paper-600">Zero-point energy</dt>
        <dd className="tabular text-paper-900" data-testid="zero-point">{t.zeroPointEnergy.toFixed(3)} kJ/mol per mole of cells</dd>
        <dt className="text-paper-600">Atoms per cell</dt>
        <dd className="tabular text-paper-900">{t.atoms}</dd>
        <dt className="text-paper-600">C_V at 300 K</dt>
        <dd className="tabular text-paper-900">{t.heatCapacity[t.temperatures.indexOf(300)]?.toFixed(2) ?? '—'} J/(mol·K)</dd>
        {t.excluded.imaginary > 0 && (
          <>
            <dt className="text-paper-600">Left out</dt>
            <dd className="text-paper-900">{t.excluded.imaginary.toFixed(3)} imaginary modes per cell</dd>
          </>
        )}
      </dl>
    </div>
  );
}

/** The reviewer's own measured points over the plot: read here, never uploaded. */
function MeasuredPicker({ data, unit, onRows }: { data: PlotData | null; unit: FrequencyUnit; onRows: (rows: MeasuredRow[] | null) => void }) {
  const [fileUnit, setFileUnit] = useState<FrequencyUnit>(unit);
  const [rows, setRows] = useState<MeasuredRow[] | null>(null);
  const [name, setName] = useState<string | null>(null);
  const [error, setError] = useState<string | null>(null);
  const dev = useMemo(() => (rows && data ? measuredDeviation(data, rows) : null), [rows, data]);
  const read = async (file: File) => {
    setName(file.name);
    try {
      const parsed = parseMeasuredCsv(await file.text(), fileUnit);
      setRows(parsed);
      setError(null);
      onRows(parsed);
    } catch (e) {
      setRows(null);
      onRows(null);
      setError(e instanceof MeasuredCsvError ? `${file.name}, ${e.message}` : `${file.name} could not be read.`);
    }
  };
  return (
    <div className="flex flex-col gap-2 border-t border-paper-200 pt-3" data-testid="measured">
      <h3 className="text-xs font-semibold text-paper-800">Measured points</h3>
      <p className="text-xs text-paper-600">
        A CSV of path distance (or a header <code>index</code> for q-point indices), frequency and an optional uncertainty, one point a line. It stays in this browser.
      </p>
      <div className="flex flex-wrap items-end gap-3">
        <Field label="Frequency unit in the file">
          <Select size="sm" value={fileUnit} onChange={(e) => setFileUnit(e.target.value as FrequencyUnit)} options={[{ value: 'THz', label: 'THz' }, { value: 'cm-1', label: 'cm⁻¹' }, { value: 'meV', label: 'meV' }]} />
        </Field>
        <Field label="CSV file" id="measured-file">
          <input
            id="measured-file"
            type="file"
            accept=".csv,.txt,.dat,text/csv,text/plain"
            className="text-xs file:mr-2 file:rounded file:border file:border-paper-300 file:bg-paper-0 file:px-2 file:py-1"
            onChange={(e) => {
              const f = e.target.files?.[0];
              if (f) void read(f);
            }}
            data-testid="measured-file"
          />
        </Field>
        {rows && (
          <Button variant="quiet" size="sm" onClick={() => (setRows(null), setName(null), onRows(null))}>
            Remove overlay
          </Button>
        )}
      </div>
      {error && <Alert tone="error" data-testid="measured-error">{error}</Alert>}
      {rows && dev && (
        <p className="text-sm text-paper-800" data-testid="measured-rms">
          {name}: {dev.used} points on the path, RMS deviation from the nearest branch {Number.isFinite(dev.rms) ? frequencyText(dev.rms, unit) : '—'}
          {dev.outside > 0 && ` (${dev.outside} outside the path, not counted)`}.
        </p>
      )}
    </div>
  );
}

export function DerivedPanel({ revisionId, data, unit, onMeasured }: { revisionId: string | null; data: PlotData | null; unit: FrequencyUnit; onMeasured: (rows: MeasuredRow[] | null) => void }) {
  const q = useDerived(revisionId, Boolean(data));
  return (
    <Panel title="Derived quantities" description="Computed from the current revision with the harmonic approximation; a guide for the review, not a result to cite unchecked." data-testid="derived">
      <div className="flex flex-col gap-4">
        {q.isError && <Alert tone="error">{q.error.message}</Alert>}
        {!data ? (
          <p className="text-sm text-paper-600">Available once the current revision is screened.</p>
        ) : !q.data ? (
          <p role="status" className="text-sm text-paper-600">Computing…</p>
        ) : (
          <>
            <SoundTable d={q.data} />
            <MeshCharts d={q.data} unit={unit} />
            {q.data.notes.length > 0 && (
              <ul className="list-disc pl-5 text-xs text-paper-600">
                {q.data.notes.map((n) => (
                  <li key={n}>{n}</li>
                ))}
              </ul>
            )}
          </>
        )}
        <MeasuredPicker data={data} unit={unit} onRows={onMeasured} />
      </div>
    </Panel>
  );
}
