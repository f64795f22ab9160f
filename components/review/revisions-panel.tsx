'use client';

import { VerdictBadge } from '@/components/spectra/verdict-badge';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { Field } from '@/components/ui/field';
import { formatMinute } from '@/components/ui/format';
import { Panel } from '@/components/ui/panel';
import { Select } from '@/components/ui/select';
import type { FrequencyUnit } from '@/lib/dispersion/types';
import { useComparison } from '@/lib/client/review/use-review';
import type { RevisionDto } from '@/lib/client/spectra-types';
import { frequencyText } from './anchor-text';
import { personName } from './person-name';

export interface ComparePair {
  a: string;
  b: string;
}

const samplingText = {
  same: 'same q-points: compared point by point',
  interpolated: 'different samplings: the later revision interpolated along the path',
  'matched-q': 'meshes: equal q-points matched',
} as const;

/** Who uploaded each revision, when, with what note and verdict; and any two compared. */
export function RevisionsPanel({
  spectrumId,
  revisions,
  currentId,
  pair,
  onPair,
  unit,
}: {
  spectrumId: string;
  revisions: RevisionDto[];
  currentId: string | null;
  pair: ComparePair | null;
  onPair: (p: ComparePair | null) => void;
  unit: FrequencyUnit;
}) {
  const screened = revisions.filter((r) => r.screeningStatus === 'done');
  const cmp = useComparison(spectrumId, pair?.a ?? null, pair?.b ?? null);
  const options = screened.map((r) => ({ value: r.id, label: `Revision ${r.number}` }));
  const numberOf = (id: string) => revisions.find((r) => r.id === id)?.number;
  const start = () => {
    const [newest, previous] = screened;
    if (newest && previous) onPair({ a: previous.id, b: newest.id });
  };

  return (
    <Panel title={`Revisions (${revisions.length})`} flush data-testid="revision-history">
      <div className="overflow-x-auto">
        <table className="w-full text-sm">
          <caption className="sr-only">Revision history</caption>
          <thead className="border-b border-paper-200 text-left text-2xs uppercase tracking-wide text-paper-600">
            <tr>
              <th scope="col" className="px-4 py-2">Revision</th>
              <th scope="col" className="px-2 py-2">Uploaded by</th>
              <th scope="col" className="px-2 py-2">When</th>
              <th scope="col" className="px-2 py-2">Note</th>
              <th scope="col" className="px-4 py-2">Verdict</th>
            </tr>
          </thead>
          <tbody className="divide-y divide-paper-200">
            {revisions.map((r) => (
              <tr key={r.id} data-testid={`revision-${r.number}`}>
                <td className="whitespace-nowrap px-4 py-2 font-semibold text-paper-900">
                  {r.number}
                  {r.id === currentId && <span className="ml-1 text-xs font-normal text-paper-600">(current)</span>}
                </td>
                <td className="px-2 py-2 text-paper-800">{personName(r.uploader)}</td>
                <td className="whitespace-nowrap px-2 py-2 text-paper-700">{formatMinute(r.createdAt)}</td>
                <td className="max-w-xs px-2 py-2 text-paper-800">{r.note ?? <span className="text-paper-600">—</span>}</td>
                <td className="px-4 py-2">
                  <VerdictBadge verdict={r.verdict} screening={r.screeningStatus} />
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>

      <div className="border-t border-paper-200 px-4 py-3" data-testid="compare">
        {screened.length < 2 ? (
          <p className="text-xs text-paper-600">Compare needs two screened revisions.</p>
        ) : !pair ? (
          <Button variant="secondary" size="sm" onClick={start} data-testid="compare-start">
            Compare two revisions
          </Button>
        ) : (
          <div className="flex flex-col gap-3">
            <div className="flex flex-wrap items-end gap-3">
              <Field label="From (dashed on the plot)">
                <Select size="sm" options={options} value={pair.a} onChange={(e) => onPair({ ...pair, a: e.target.value })} data-testid="compare-a" />
              </Field>
              <Field label="To">
                <Select size="sm" options={options} value={pair.b} onChange={(e) => onPair({ ...pair, b: e.target.value })} data-testid="compare-b" />
              </Field>
              <Button variant="quiet" size="sm" onClick={() => onPair(null)}>
                End compare
              </Button>
            </div>
            {pair.a === pair.b ? (
              <p className="text-xs text-paper-700">Choose two different revisions.</p>
            ) : cmp.isError ? (
              <Alert tone="error">{cmp.error.message}</Alert>
            ) : !cmp.data ? (
              <p role="status" className="text-xs text-paper-600">Comparing…</p>
            ) : (
              <div className="flex flex-col gap-2">
                <p className="text-xs text-paper-700">
                  Revision {numberOf(pair.a)} → {numberOf(pair.b)}: {cmp.data.compared} q-points, {samplingText[cmp.data.sampling]}. Deviations above the continuity tolerance (
                  {frequencyText(cmp.data.tolerance, unit)}) are marked.
                  {cmp.data.branchesOnlyInA + cmp.data.branchesOnlyInB > 0 &&
                    ` Branch counts differ: ${cmp.data.branchesOnlyInA || cmp.data.branchesOnlyInB} branch(es) not compared.`}
                </p>
                <table className="w-full text-sm" data-testid="compare-table">
                  <caption className="sr-only">Largest deviation per branch</caption>
                  <thead className="text-left text-2xs uppercase tracking-wide text-paper-600">
                    <tr>
                      <th scope="col" className="py-1 pr-2">Branch</th>
                      <th scope="col" className="py-1 pr-2">Largest |Δω|</th>
                      <th scope="col" className="py-1 pr-2">Direction</th>
                      <th scope="col" className="py-1">At q-point</th>
                    </tr>
                  </thead>
                  <tbody className="tabular divide-y divide-paper-100">
                    {cmp.data.branches.map((b) => {
                      const over = b.maxDeviation > cmp.data!.tolerance;
                      return (
                        <tr key={b.branch} data-over={over ? 'yes' : 'no'}>
                          <td className="py-1 pr-2">{b.branch}</td>
                          <td className={over ? 'py-1 pr-2 font-semibold text-ochre-800' : 'py-1 pr-2'}>
                            {over && <span aria-hidden="true">▲ </span>}
                            {frequencyText(b.maxDeviation, unit)}
                            {over && <span className="sr-only"> (above tolerance)</span>}
                          </td>
                          <td className="py-1 pr-2 text-paper-700">{b.signed > 0 ? 'up' : b.signed < 0 ? 'down' : '—'}</td>
                          <td className="py-1 text-paper-700">{b.at.index >= 0 ? b.at.index : '—'}</td>
                        </tr>
                      );
                    })}
                  </tbody>
                </table>
              </div>
            )}
          </div>
        )}
      </div>
    </Panel>
  );
}
