import { Badge, type BadgeTone } from '@/components/ui/badge';
import { cx } from '@/components/ui/cx';
import type { ScreeningStatus, SpectrumStatus } from '@/lib/client/spectra-types';

type StatusShape = 'dashed-ring' | 'half' | 'back' | 'seal' | 'slash' | 'bar' | 'torn-page';

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
      {shape === 'torn-page' && (
        <>
          <path d="M2.6 1.2 H7.4 L9.6 3.4 V10.8 H2.6 Z" fill="none" stroke="currentColor" strokeWidth="1.3" strokeLinejoin="round" />
          <path d="M4.3 5.2 L7.9 8.8 M7.9 5.2 L4.3 8.8" stroke="currentColor" strokeWidth="1.4" strokeLinecap="round" />
        </>
      )}
    </svg>
  );
}

/**
 * A spectrum stays `screening` when its current revision's file did not parse (the state machine
 * has nothing else to move to), but nothing is being checked then: it waits for a new revision.
 * This mark says so beside the status; it is not a status of its own.
 */
export const FILE_NOT_READ = {
  word: 'file not read',
  help: 'The current revision\'s file did not parse; upload a new revision',
} as const;

/** Whether the spectrum is `screening` only because its current file did not parse. */
export function fileNotRead(status: SpectrumStatus, screening: ScreeningStatus | null | undefined): boolean {
  return status === 'screening' && screening === 'error';
}

export function FileNotReadMark({ className }: { className?: string }) {
  return (
    <Badge tone="danger" className={className} title={FILE_NOT_READ.help} data-testid="file-not-read">
      <StatusGlyph shape="torn-page" />
      {FILE_NOT_READ.word}
      <span className="sr-only">: upload a new revision</span>
    </Badge>
  );
}

/**
 * The status word and shape; pass the current revision's screening status so that a spectrum
 * whose file did not parse says so instead of claiming to be checked.
 */
export function StatusBadge({ status, screening, className }: { status: SpectrumStatus; screening?: ScreeningStatus | null; className?: string }) {
  const look = STATUS_LOOK[status];
  const notRead = fileNotRead(status, screening);
  const badge = (
    <Badge tone={look.tone} className={notRead ? undefined : className} title={notRead ? 'Waiting for a new revision: the current file did not parse' : look.help} data-testid={`status-${status}`}>
      <StatusGlyph shape={look.shape} />
      {look.word}
    </Badge>
  );
  if (!notRead) return badge;
  return (
    <span className={cx('inline-flex flex-wrap items-center gap-1', className)}>
      {badge}
      <FileNotReadMark />
    </span>
  );
}
