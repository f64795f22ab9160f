import { formatMinute } from '@/components/ui/format';
import { Panel } from '@/components/ui/panel';
import type { RevisionDto } from '@/lib/client/spectra-types';
import { formatBytes } from './format-bytes';
import { FindingCountsText } from './severity-mark';
import { VerdictBadge } from './verdict-badge';

/** Every revision, newest first, each with its own file and screening. */
export function RevisionList({ revisions, currentId }: { revisions: RevisionDto[]; currentId: string | null }) {
  return (
    <Panel title={`Revisions (${revisions.length})`} flush data-testid="revisions">
      <ol className="divide-y divide-paper-200">
        {revisions.map((r) => (
          <li key={r.id} className="px-4 py-2.5 text-sm" data-testid={`revision-${r.number}`}>
            <div className="flex items-center justify-between gap-2">
              <span className="font-semibold text-paper-900">
                Revision {r.number}
                {r.id === currentId && <span className="ml-1.5 text-xs font-normal text-paper-600">(current)</span>}
              </span>
              <VerdictBadge verdict={r.verdict} screening={r.screeningStatus} />
            </div>
            <div className="mt-0.5 truncate font-mono text-xs text-paper-700" title={r.originalName}>
              {r.originalName} · {formatBytes(r.size)}
            </div>
            <div className="mt-0.5 flex flex-wrap items-center justify-between gap-x-3 text-xs text-paper-600">
              <span>{formatMinute(r.createdAt)}</span>
              {r.screeningStatus === 'done' && <FindingCountsText counts={r.findings} />}
            </div>
            {r.note && <p className="mt-1 whitespace-pre-wrap text-xs text-paper-800">{r.note}</p>}
          </li>
        ))}
      </ol>
    </Panel>
  );
}
