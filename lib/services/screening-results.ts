/** What the API reads back of a screened revision: the screening JSON and the plot data. */
import { Finding, type ScreeningErrorInfo } from '@/entities';
import type { Caller } from '@/lib/auth/caller';
import { verdictOf, type ScreeningResult, type Verdict } from '@/lib/checks';
import type { Em } from '@/lib/db/orm';
import { AppError } from '@/lib/errors';
import { pathGeometry } from '@/lib/physics/path';
import { encodePlotData } from '@/lib/plot/wire';
import { loadStoredDispersion } from './dispersion-store';
import { revisionAccess, type PersonDto } from './spectra';
import { waiversByFinding } from './waivers';

/** Why, by whom and when a finding was waived (lib/services/waivers.ts). */
export interface FindingWaiverDto {
  reason: string;
  by: PersonDto | null;
  at: string;
}

/**
 * A finding as in the screening JSON, plus its id (waivers and threads point at it) and its
 * waiver, or null.
 */
export type StoredFindingDto = ScreeningResult['findings'][number] & { id: string; waived: FindingWaiverDto | null };

/**
 * The command line's JSON plus `revision`, finding ids and waivers. `verdict` stays the verdict
 * as screened; `verdictWithWaivers` leaves waived findings out (what the queue shows).
 */
export type ScreeningDto =
  | { status: 'pending'; revision: string }
  | { status: 'error'; revision: string; error: ScreeningErrorInfo }
  | ({ status: 'done'; revision: string } & Omit<ScreeningResult, 'findings'> & { findings: StoredFindingDto[]; verdictWithWaivers: Verdict });

const num = (x: unknown): number | null => (x === null || x === undefined ? null : Number(x));

/** `{status, …the screening JSON}` of screening.md for one revision. */
export async function getScreening(em: Em, caller: Caller, revisionId: string): Promise<ScreeningDto> {
  const { revision } = await revisionAccess(em, caller, revisionId);
  if (revision.screeningStatus === 'pending') return { status: 'pending', revision: revision.id };
  if (revision.screeningStatus === 'error') {
    const error = revision.screeningError ?? { message: 'Screening failed.', line: null, column: null, expected: null, found: null };
    return { status: 'error', revision: revision.id, error };
  }
  const s = revision.summary!;
  const rows = await em.find(Finding, { revision: revision.id }, { orderBy: { ordinal: 'asc' } });
  const waivers = await waiversByFinding(em, rows.map((f) => f.id));
  const findings = rows.map((f): StoredFindingDto => {
    const w = waivers.get(f.id);
    return {
      id: f.id,
      check: f.check as StoredFindingDto['check'],
      severity: f.severity,
      segment: f.segment ?? null,
      index: f.index ?? null,
      branch: f.branch ?? null,
      q: f.q ?? null,
      value: num(f.value),
      limit: num(f.limit),
      message: f.message,
      waived: w ? { reason: w.reason, by: w.author, at: w.createdAt } : null,
    };
  });
  return {
    status: 'done',
    revision: revision.id,
    format: s.format,
    qpoints: s.qpoints,
    branches: s.branches,
    segments: s.segments,
    verdict: revision.verdict!,
    findings,
    folded: s.folded,
    verdictWithWaivers: verdictOf(findings.map((f) => ({ severity: f.severity, waived: f.waived !== null }))),
  };
}

/** The stored dispersion in the plot wire format (lib/plot/wire.ts); 409 until screening is done. */
export async function getPlotBytes(em: Em, caller: Caller, revisionId: string): Promise<Uint8Array> {
  const { revision } = await revisionAccess(em, caller, revisionId);
  if (revision.screeningStatus !== 'done') {
    throw new AppError('conflict', revision.screeningStatus === 'pending'
      ? 'This revision is still being screened; its data is not ready.'
      : 'This revision\'s file could not be read, so it has no data.');
  }
  // The plot needs no mesh weights.
  const d = await loadStoredDispersion(em, revision.id, ['q', 'distances']);
  if (!d) throw new AppError('not_found', 'This revision has no stored data.');
  const g = pathGeometry(d);
  return encodePlotData(d, { distance: g.distance, qFolded: g.qFolded ?? null });
}
