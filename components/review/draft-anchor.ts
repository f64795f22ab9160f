import type { FrequencyUnit } from '@/lib/dispersion/types';
import type { ScreeningStatus } from '@/lib/client/spectra-types';
import { frequencyText } from './anchor-text';

/** Where a new thread will sit: a point the reviewer clicked, a finding, or the whole spectrum. */
export type DraftAnchor =
  | { kind: 'point'; revision: string; revisionNumber: number; index: number; branch: number; frequencyTHz: number }
  | { kind: 'finding'; finding: string; label: string }
  | { kind: 'spectrum' };

export function draftAnchorText(a: DraftAnchor, unit: FrequencyUnit): string {
  if (a.kind === 'point') return `q-point ${a.index}, branch ${a.branch} at ${frequencyText(a.frequencyTHz, unit)} (revision ${a.revisionNumber})`;
  if (a.kind === 'finding') return `the finding ${a.label}`;
  return 'the spectrum as a whole';
}

/**
 * Where the composer of a draft is shown. A thread on the spectrum as a whole needs only a
 * revision, so it can be opened while the file is being screened or after it failed to parse
 * ("which code wrote this file?"): its composer sits in the threads panel, in every state. A
 * point or a finding exists only once screening is done, beside the plot; otherwise nowhere.
 */
export function draftPlace(draft: DraftAnchor | null, screening: ScreeningStatus | undefined, hasRevision: boolean): 'threads' | 'plot' | null {
  if (!draft || !hasRevision) return null;
  if (draft.kind === 'spectrum') return 'threads';
  return screening === 'done' ? 'plot' : null;
}
