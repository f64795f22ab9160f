import { cx } from '@/components/ui/cx';
import type { UploadPhase } from '@/lib/client/use-band-file-upload';
import { formatBytes } from './format-bytes';

const phaseWords: Record<UploadPhase, string> = {
  idle: 'Waiting',
  uploading: 'Sending',
  recording: 'Stored; recording the revision',
  done: 'Uploaded',
  error: 'Stopped',
};

/** One file's upload: name, size, a bar with its percentage (role=progressbar) and the phase in words. */
export function UploadProgress({
  name,
  size,
  progress,
  phase,
}: {
  name: string;
  size: number;
  progress: number;
  phase: UploadPhase;
}) {
  const pct = Math.max(0, Math.min(100, Math.round(progress)));
  return (
    <div className="rounded-md border border-paper-300 bg-paper-0 px-3 py-2.5" data-testid="upload-progress">
      <div className="flex items-baseline justify-between gap-3 text-xs">
        <span className="min-w-0 truncate font-mono text-paper-900" title={name}>
          {name}
        </span>
        <span className="shrink-0 tabular text-paper-600">{formatBytes(size)}</span>
      </div>
      <div
        role="progressbar"
        aria-label={`Upload of ${name}`}
        aria-valuemin={0}
        aria-valuemax={100}
        aria-valuenow={pct}
        aria-valuetext={`${pct} percent, ${phaseWords[phase].toLowerCase()}`}
        className="mt-2 h-2 overflow-hidden rounded-full bg-paper-200"
        data-testid="upload-progressbar"
      >
        <div
          className={cx('h-full rounded-full transition-[width] duration-150', phase === 'error' ? 'bg-brick-600' : phase === 'done' ? 'bg-moss-600' : 'bg-ink-700')}
          style={{ width: `${pct}%` }}
        />
      </div>
      <div className="mt-1.5 flex items-center justify-between text-xs text-paper-700">
        <span aria-live="polite">{phaseWords[phase]}</span>
        <span className="tabular font-semibold" aria-hidden="true">
          {pct} %
        </span>
      </div>
    </div>
  );
}
