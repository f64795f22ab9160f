import { Badge, type BadgeTone } from '@/components/ui/badge';
import { cx } from '@/components/ui/cx';
import type { SpectrumStatus } from '@/lib/client/spectra-types';

type StatusShape = 'dashed-ring' | 'half' | 'back' | 'seal' | 'slash' | 'bar';

// Every status has its own word and its own shape; the colour only repeats them.
export const STATUS_LOOK: Record<SpectrumStatus, { word: string; tone: BadgeTone; shape: StatusShape; help: string }> = {
  screening: { word: 'screening', tone: 'neutral', shape: 'dashed-ring', help: 'The current revision is being checked automatically' },
  'in-review': { word: 'in review', tone: 'ink', shape: 'half', help: 'Screened; waiting for reviewers' },
  returned: { word: 'returned', tone: 'warn', shape: 'back', help: 'Sent back to the submitter for a new revision' },
  approved: { word: 'approved', tone: 'ok', shape: 'seal', help: 'Approved for use' },
  rejected: { word: 'rejected', tone: 'danger', shape: 'slash', help: 'Rejected by a reviewer' },
  withdrawn: { word: 'withdrawn', tone: 'neutral', shape: 'bar', help: 'Withdrawn by the submitter' },
};

export function StatusGlyph({ shape, className }: { shape: StatusShape; className?: string }) {
  return (
    <svg viewBox="0 0 12 12" className={cx('h-2.5 w-2.5 shrink-0', className)} aria-hidden="true" focusable="false">
      {shape === 'dashed-ring' && (
        <circle cx="6" cy="6" r="4.3" fill="none" stroke="currentColor" strokeWidth="1.6" strokeDasharray="2.2 1.6" />
      )}
      {shape === 'half' && (
        <>
          <circle cx="6" cy="6" r="4.4" fill="none" stroke="currentColor" strokeWidth="1.4" />
          <path d="M6 1.6 A4.4 4.4 0 0 1 6 10.4 Z" fill="currentColor" />
        </>
      )}
      {shape === 'back' && (
        <path d="M4.6 2 L1.4 5 L4.6 8 M1.6 5 H7.4 A3 3 0 0 1 7.4 11 H5.6" fill="none" stroke="currentColor" strokeWidth="1.6" strokeLinecap="round" strokeLinejoin="round" />
      )}
      {shape === 'seal' && (
        <>
          <circle cx="6" cy="6" r="5.2" fill="currentColor" />
          <path d="M3.4 6.2 L5.2 7.9 L8.7 4.2" fill="none" stroke="white" strokeWidth="1.5" strokeLinecap="round" strokeLinejoin="round" />
        </>
      )}
      {shape === 'slash' && (
        <>
          <circle cx="6" cy="6" r="4.4" fill="none" stroke="currentColor" strokeWidth="1.6" />
          <path d="M2.9 9.1 L9.1 2.9" stroke="currentColor" strokeWidth="1.6" />
        </>
      )}
      {shape === 'bar' && <path d="M1.8 6 H10.2" stroke="currentColor" strokeWidth="2" strokeLinecap="round" />}
    </svg>
  );
}

export function StatusBadge({ status, className }: { status: SpectrumStatus; className?: string }) {
  const look = STATUS_LOOK[status];
  return (
    <Badge tone={look.tone} className={className} title={look.help} data-testid={`status-${status}`}>
      <StatusGlyph shape={look.shape} />
      {look.word}
    </Badge>
  );
}
