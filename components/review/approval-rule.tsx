import type { ApprovalState } from '@/lib/client/review/review-types';

const plural = (n: number, one: string, many = `${one}s`) => `${n} ${n === 1 ? one : many}`;

/** The automatic approval rule in one line, with the group's numbers. */
export function approvalRuleText(required: number, blockingSeverities: readonly string[]): string {
  const kinds = blockingSeverities.length > 1 ? `${blockingSeverities.join(' or ')} finding` : 'fail finding';
  return `Approved automatically once the current revision has ${plural(required, 'approval')}, no open blocking thread and no unwaived ${kinds}.`;
}

/** Where this spectrum stands against the rule: three counts, each with a mark and words. */
export function ApprovalProgress({ approval }: { approval: ApprovalState }) {
  const rows = [
    { ok: approval.approvals.count >= approval.approvals.required, text: `Approvals ${approval.approvals.count} of ${approval.approvals.required}` },
    { ok: approval.openBlockingThreads === 0, text: `${plural(approval.openBlockingThreads, 'open blocking thread')}` },
    { ok: approval.blockingFindings === 0, text: `${plural(approval.blockingFindings, 'unwaived blocking finding')}` },
  ];
  return (
    <ul className="flex flex-col gap-1 text-sm" data-testid="approval-progress">
      {rows.map((r) => (
        <li key={r.text} className="flex items-center gap-2">
          <span aria-hidden="true" className={r.ok ? 'text-moss-700' : 'text-ochre-700'}>
            {r.ok ? '✓' : '○'}
          </span>
          <span className={r.ok ? 'text-paper-800' : 'font-medium text-paper-900'}>{r.text}</span>
          <span className="sr-only">{r.ok ? '(met)' : '(not yet)'}</span>
        </li>
      ))}
    </ul>
  );
}
