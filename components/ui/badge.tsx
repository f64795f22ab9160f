import type { ReactNode } from 'react';
import { cx } from './cx';
import { Glyph, type GlyphShape } from './glyph';

export type BadgeTone = 'ink' | 'strong' | 'ember' | 'neutral' | 'ok' | 'warn' | 'danger';

const tones: Record<BadgeTone, string> = {
  strong: 'bg-ink-800 text-paper-50 border-ink-900',
  ink: 'bg-ink-50 text-ink-800 border-ink-200',
  ember: 'bg-ember-50 text-ember-700 border-ember-200',
  neutral: 'bg-paper-100 text-paper-700 border-paper-300',
  ok: 'bg-moss-50 text-moss-800 border-moss-200',
  warn: 'bg-ochre-50 text-ochre-800 border-ochre-200',
  danger: 'bg-brick-50 text-brick-800 border-brick-200',
};

export type BadgeProps = {
  tone?: BadgeTone;
  shape?: GlyphShape;
  children: ReactNode;
  className?: string;
  title?: string;
  'data-testid'?: string;
};

export function Badge({ tone = 'neutral', shape, children, className, ...rest }: BadgeProps) {
  return (
    <span
      className={cx(
        'inline-flex h-5 items-center gap-1 whitespace-nowrap rounded border px-1.5 text-2xs font-semibold uppercase tracking-wide',
        tones[tone],
        className,
      )}
      {...rest}
    >
      {shape && <Glyph shape={shape} className="h-2.5 w-2.5" />}
      {children}
    </span>
  );
}

export type Role = 'admin' | 'reviewer' | 'submitter' | 'observer';

export const ROLES: readonly Role[] = ['admin', 'reviewer', 'submitter', 'observer'];

// Each role has its own shape as well as its word: admin a diamond, reviewer a target,
// submitter a triangle (sends work up), observer an open ring.
const roleLook: Record<Role, { tone: BadgeTone; shape: GlyphShape }> = {
  admin: { tone: 'strong', shape: 'diamond' },
  reviewer: { tone: 'ember', shape: 'target' },
  submitter: { tone: 'ink', shape: 'triangle' },
  observer: { tone: 'neutral', shape: 'ring' },
};

export const ROLE_HELP: Record<Role, string> = {
  admin: 'Manages members, roles and the review policy',
  reviewer: 'Reviews and decides on spectra of others',
  submitter: 'Uploads spectra and revisions of their own',
  observer: 'Reads everything in the group, changes nothing',
};

export function RoleBadge({ role, className }: { role: Role; className?: string }) {
  const look = roleLook[role];
  return (
    <Badge tone={look.tone} shape={look.shape} className={className} title={ROLE_HELP[role]} data-testid={`role-${role}`}>
      {role}
    </Badge>
  );
}
