import { formatMinute } from '@/components/ui/format';
import { Panel } from '@/components/ui/panel';
import type { SpectrumDetail } from '@/lib/client/spectra-types';

/** The metadata the submitter gave, as given. */
export function SpectrumFacts({ spectrum: s }: { spectrum: SpectrumDetail }) {
  const rows: [string, string | null, boolean?][] = [
    ['Material', s.material],
    ['Formula', s.formula, true],
    ['Method', s.method],
    ['Code and version', s.code],
    ['Supercell', s.supercell, true],
    ['q-mesh', s.qmesh, true],
    ['Submitter', s.submitter ? s.submitter.name || s.submitter.email : null],
    ['Created', formatMinute(s.createdAt)],
    ['Updated', formatMinute(s.updatedAt)],
  ];
  return (
    <Panel title="Calculation" level={2} data-testid="spectrum-facts">
      <dl className="grid grid-cols-[auto_1fr] gap-x-4 gap-y-1.5 text-sm">
        {rows.map(([k, v, mono]) => (
          <div key={k} className="contents">
            <dt className="text-paper-600">{k}</dt>
            <dd className={v ? (mono ? 'font-mono text-paper-900' : 'text-paper-900') : 'text-paper-600'}>{v || 'not given'}</dd>
          </div>
        ))}
      </dl>
      {s.notes && (
        <div className="mt-3 border-t border-paper-200 pt-3">
          <h3 className="text-xs font-semibold text-paper-800">Notes</h3>
          <p className="mt-1 whitespace-pre-wrap text-sm text-paper-800">{s.notes}</p>
        </div>
      )}
    </Panel>
  );
}
