import { SEVERITY_LOOK, type Severity } from '@/components/plot/plot-style';
import { Glyph } from '@/components/ui/glyph';
import { cx } from '@/components/ui/cx';

const textTone: Record<Severity, string> = {
  fail: 'text-brick-700',
  warn: 'text-ochre-700',
  info: 'text-ink-700',
};

/**
 * A finding's severity as the plot marks it: its shape and its word. `muted` (a waived finding)
 * drops the colour for a neutral tone that still reads at AA contrast; fading it would not.
 */
export function SeverityMark({ severity, muted = false, className }: { severity: Severity; muted?: boolean; className?: string }) {
  const look = SEVERITY_LOOK[severity];
  return (
    <span className={cx('inline-flex items-center gap-1.5 font-semibold', muted ? 'text-paper-700' : textTone[severity], className)} data-testid={`severity-${severity}`}>
      <Glyph shape={look.glyph} />
      {look.word.toLowerCase()}
    </span>
  );
}

/** "2 fail · 1 warn": only the severities present; shapes and words. */
export function FindingCountsText({ counts }: { counts: Record<Severity, number> }) {
  const present = (['fail', 'warn', 'info'] as const).filter((s) => counts[s] > 0);
  if (present.length === 0) return <span className="text-paper-600">none</span>;
  return (
    <span className="inline-flex flex-wrap items-center gap-x-2.5 gap-y-0.5 tabular">
      {present.map((s) => (
        <span key={s} className={cx('inline-flex items-center gap-1', textTone[s])}>
          <Glyph shape={SEVERITY_LOOK[s].glyph} className="h-2.5 w-2.5" />
          {counts[s]} {s}
        </span>
      ))}
    </span>
  );
}
