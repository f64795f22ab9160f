import { Badge, type BadgeTone } from '@/components/ui/badge';
import type { GlyphShape } from '@/components/ui/glyph';
import type { ScreeningStatus, VerdictValue } from '@/lib/client/spectra-types';

// The same shapes as the findings' severities (and the plot's markers): pass a check,
// warn a triangle, fail a cross.
export const VERDICT_LOOK: Record<VerdictValue, { tone: BadgeTone; shape: GlyphShape; help: string }> = {
  pass: { tone: 'ok', shape: 'check', help: 'No finding above info' },
  warn: { tone: 'warn', shape: 'triangle', help: 'At least one warning, no failure' },
  fail: { tone: 'danger', shape: 'cross', help: 'At least one failed check' },
};

/**
 * The current revision's verdict; before there is one, what screening is doing instead
 * (`pending`, or `unreadable` when the file did not parse).
 */
export function VerdictBadge({
  verdict,
  screening,
  className,
}: {
  verdict: VerdictValue | null;
  screening?: ScreeningStatus | null;
  className?: string;
}) {
  if (verdict) {
    const look = VERDICT_LOOK[verdict];
    return (
      <Badge tone={look.tone} shape={look.shape} className={className} title={look.help} data-testid={`verdict-${verdict}`}>
        {verdict}
      </Badge>
    );
  }
  if (screening === 'error') {
    return (
      <Badge tone="danger" shape="bang" className={className} title="The file did not parse" data-testid="verdict-unreadable">
        unreadable
      </Badge>
    );
  }
  return (
    <Badge tone="neutral" shape="ring" className={className} title="Not screened yet" data-testid="verdict-pending">
      pending
    </Badge>
  );
}
