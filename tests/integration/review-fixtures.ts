/**
 * Screened spectra for the review tests, written the way the screening worker writes them
 * (lib/services/screening-job.ts): stored dispersion, findings in engine order, revision `done`,
 * spectrum `in-review` with the revision's verdict. Model spectra come from lib/models.
 */
import { Finding, Group, Revision, Spectrum, StoredDispersion, User } from '@/entities';
import { screen } from '@/lib/checks';
import type { Dispersion } from '@/lib/dispersion/types';
import { getEm, type Em } from '@/lib/db/orm';
import { buildModelSpectrum, type DefectName } from '@/lib/models/cli';
import { toStoredColumns } from '@/lib/services/dispersion-store';
import { request, routeArgs, sessionCookie, uniq, type TestUser } from './helpers';

export function model(opts: { points?: number; defect?: DefectName } = {}): Dispersion {
  return buildModelSpectrum({ model: 'fcc', points: opts.points ?? 20, polar: false, defect: opts.defect });
}

async function addRevision(spectrumId: string, uploader: { id: string }, d: Dispersion): Promise<{ revisionId: string; findingIds: string[] }> {
  const em = await getEm();
  return em.transactional(async (tx) => {
    const spectrum = await tx.findOneOrFail(Spectrum, { id: spectrumId });
    const number = spectrum.revisionCount + 1;
    const result = screen(d);
    const counts = { fail: 0, warn: 0, info: 0 };
    for (const f of result.findings) counts[f.severity]++;
    const revision = tx.create(Revision, {
      spectrum,
      number,
      fileKey: `test-${uniq()}-${uniq()}`,
      ufsUrl: 'http://127.0.0.1:1/none',
      originalName: `fcc-${number}.dat`,
      size: 1000,
      format: 'columns',
      note: null,
      uploader: tx.getReference(User, uploader.id),
      screeningStatus: 'done',
      screeningError: null,
      verdict: result.verdict,
      summary: { format: 'columns', qpoints: d.nq, branches: d.nb, segments: d.segments.length, folded: [] },
      failCount: counts.fail,
      warnCount: counts.warn,
      infoCount: counts.info,
      screenedAt: new Date(),
    });
    tx.create(StoredDispersion, { revision, ...toStoredColumns(d) });
    const findings = result.findings.map((f, ordinal) =>
      tx.create(Finding, { revision, ordinal, check: f.check, severity: f.severity, segment: f.segment, index: f.index, branch: f.branch, q: f.q, value: f.value, limit: f.limit, message: f.message }),
    );
    await tx.flush();
    spectrum.revisionCount = number;
    spectrum.currentRevisionId = revision.id;
    spectrum.status = 'in-review';
    spectrum.verdict = result.verdict;
    await tx.flush();
    return { revisionId: revision.id, findingIds: findings.map((f) => f.id) };
  });
}

/** A new spectrum row in `screening`, as creating one through the app leaves it. */
function newSpectrum(em: Em, group: { id: string }, submitter: TestUser, revisionCount: number): Spectrum {
  return em.create(Spectrum, {
    group: em.getReference(Group, group.id),
    submitter: em.getReference(User, submitter.id),
    title: `Invented crystal ${uniq()}`,
    material: 'Invented fcc solid (demo model)',
    status: 'screening',
    reviewerIds: [],
    revisionCount,
    verdict: null,
  });
}

/** A spectrum in review with one screened revision. */
export async function screenedSpectrum(group: { id: string }, submitter: TestUser, d: Dispersion = model()) {
  const em = await getEm();
  const s = newSpectrum(em, group, submitter, 0);
  await em.flush();
  const rev = await addRevision(s.id, submitter, d);
  return { id: s.id, ...rev };
}

/**
 * A spectrum still `screening` whose only revision is `pending`, or whose file did not parse
 * (`error`): as the upload leaves it, and as the worker leaves an unparsable file.
 */
export async function unscreenedSpectrum(group: { id: string }, submitter: TestUser, state: 'pending' | 'error') {
  const em = await getEm();
  return em.transactional(async (tx) => {
    const spectrum = newSpectrum(tx, group, submitter, 1);
    const revision = tx.create(Revision, {
      spectrum,
      number: 1,
      fileKey: `test-${uniq()}-${uniq()}`,
      ufsUrl: 'http://127.0.0.1:1/none',
      originalName: 'bands.dat',
      size: 1000,
      format: 'columns',
      note: null,
      uploader: tx.getReference(User, submitter.id),
      screeningStatus: state,
      screeningError: state === 'error' ? { message: 'Expected 4 columns, found 3.', line: 7, column: 1, expected: '4 columns', found: '3 columns' } : null,
      verdict: null,
      summary: null,
      screenedAt: state === 'error' ? new Date() : null,
    });
    await tx.flush();
    spectrum.currentRevisionId = revision.id;
    await tx.flush();
    return { id: spectrum.id, revisionId: revision.id };
  });
}

/** A new screened revision, as an upload followed by the worker would leave it. */
export const newScreenedRevision = (spectrumId: string, submitter: TestUser, d: Dispersion) => addRevision(spectrumId, submitter, d);

type Handler = (req: Request, args: { params: Promise<Record<string, string>> }) => Promise<Response>;

/** Calls a route handler as `who` (null: signed out) and returns the status and JSON body. */
export async function call(
  handler: Handler,
  who: TestUser | null,
  opts: { path?: string; params?: Record<string, string>; method?: string; body?: unknown; query?: Record<string, string> } = {},
): Promise<{ status: number; body: any }> {
  const qs = opts.query ? `?${new URLSearchParams(opts.query)}` : '';
  const req = request(`${opts.path ?? '/api/v1/test'}${qs}`, {
    method: opts.method ?? (opts.body === undefined ? 'GET' : 'POST'),
    body: opts.body,
    cookie: who ? await sessionCookie(who) : undefined,
  });
  const res = await handler(req, routeArgs(opts.params ?? {}));
  const text = await res.text();
  return { status: res.status, body: text ? JSON.parse(text) : null };
}
