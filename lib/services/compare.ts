/** Revision compare (per-branch maximum deviation) and the stored dispersions it reads. */
import { Revision } from '@/entities';
import type { Caller } from '@/lib/auth/caller';
import type { Em } from '@/lib/db/orm';
import { AppError } from '@/lib/errors';
import { toleranceFor } from '@/lib/review/anchor-moved';
import { compareRevisions, type Comparison } from '@/lib/review/compare';
import { sampled, type Sampled } from '@/lib/review/sampling';
import { loadStoredDispersion } from './dispersion-store';
import { getGroupPolicy } from './policy';
import { spectrumAccess } from './spectra';

/** A revision's stored dispersion ready for comparing, or null when it has none (not screened). */
export async function loadSampled(em: Em, revisionId: string): Promise<Sampled | null> {
  const d = await loadStoredDispersion(em, revisionId, ['q', 'distances']);
  return d ? sampled(d) : null;
}

/** Loads each revision once per request. */
export function sampledCache(em: Em): (revisionId: string) => Promise<Sampled | null> {
  const cache = new Map<string, Promise<Sampled | null>>();
  return (id) => {
    let p = cache.get(id);
    if (!p) cache.set(id, (p = loadSampled(em, id)));
    return p;
  };
}

export interface ComparisonDto extends Comparison {
  a: { id: string; number: number };
  b: { id: string; number: number };
  /** The continuity tolerance δ (THz) of the group's policy for these two revisions, for reading the table. */
  tolerance: number;
}

export async function compareSpectrumRevisions(em: Em, caller: Caller, spectrumId: string, ids: { a: string; b: string }): Promise<ComparisonDto> {
  const { spectrum, group } = await spectrumAccess(em, caller, spectrumId);
  const revisions = await em.find(Revision, { id: { $in: [ids.a, ids.b].filter((x) => /^[0-9a-f-]{36}$/i.test(x)) }, spectrum: spectrum.id });
  const get = (id: string, which: string) => {
    const r = revisions.find((x) => x.id === id);
    if (!r) throw new AppError('not_found', `Revision ${which} is not a revision of this spectrum.`);
    if (r.screeningStatus !== 'done') throw new AppError('conflict', `Revision ${r.number} has no data to compare (screening ${r.screeningStatus}).`);
    return r;
  };
  const ra = get(ids.a, 'a');
  const rb = get(ids.b, 'b');
  const load = sampledCache(em);
  const [a, b] = await Promise.all([load(ra.id), load(rb.id)]);
  if (!a || !b) throw new AppError('conflict', 'A revision has no stored data to compare.');
  const policy = await getGroupPolicy(em, group.id);
  return {
    a: { id: ra.id, number: ra.number },
    b: { id: rb.id, number: rb.number },
    ...compareRevisions(a, b),
    tolerance: toleranceFor(a, b, policy.checks.continuity),
  };
}
