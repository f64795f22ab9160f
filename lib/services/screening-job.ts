/**
 * The screening of one revision, run by the queue's worker (lib/jobs): read the stored file,
 * parse, screen, and write the dispersion, the findings and the new states in ONE transaction.
 * A file that does not parse sets the revision to `error` (line, column, expectation) and
 * writes nothing else. Anything unexpected is thrown so that the queue retries the job.
 */
import { LockMode } from '@mikro-orm/core';
import type { Knex } from '@mikro-orm/postgresql';
import { Finding, Revision, Spectrum, type ScreeningErrorInfo } from '@/entities';
import { screen, type ScreeningResult } from '@/lib/checks';
import type { Dispersion } from '@/lib/dispersion/types';
import { getEm, type Em } from '@/lib/db/orm';
import { parseBandFile, ParseError } from '@/lib/parsers';
import { takeStored } from '@/lib/storage/handoff';
import { readStoredFile, StoredFileError } from '@/lib/storage/read-file';
import { MAX_BAND_FILE_BYTES } from '@/lib/storage/limits';
import { timed, timedSync } from '@/lib/timing';
import { toStoredColumns } from './dispersion-store';
import { getGroupPolicy } from './policy';

/** A revision still `pending` after this long is set to `error` by the sweep. */
export const SCREENING_TIMEOUT_MS = 20 * 60_000;

export type ScreeningOutcome = 'done' | 'error' | 'skipped';

export interface RunScreeningOptions {
  /** The queue's last attempt: a failure is recorded on the revision rather than thrown. */
  finalAttempt?: boolean;
}

/** The group's screening thresholds as they are when this screening starts (lib/services/policy). */
async function policyFor(em: Em, groupId: string) {
  return (await getGroupPolicy(em, groupId)).checks;
}

async function markError(revisionId: string, info: ScreeningErrorInfo): Promise<ScreeningOutcome> {
  const em = await getEm();
  const n = await em.nativeUpdate(
    Revision,
    { id: revisionId, screeningStatus: 'pending' },
    { screeningStatus: 'error', screeningError: info, screenedAt: new Date() },
  );
  return n === 1 ? 'error' : 'skipped';
}

function parseErrorInfo(e: ParseError): ScreeningErrorInfo {
  return { message: e.message, line: e.line, column: e.column, expected: e.expected, found: e.found };
}

/**
 * A check can compute ±Infinity from absurd values near the largest double; the database column
 * would refuse it and the job would fail on every retry. The command line's JSON writes it as
 * null too (JSON has no Infinity), so the stored finding matches it.
 */
const finiteOrNull = (x: number | null): number | null => (x === null || Number.isFinite(x) ? x : null);

async function store(revisionId: string, d: Dispersion, result: ScreeningResult): Promise<ScreeningOutcome> {
  const em = await getEm();
  return em.transactional(async (tx) => {
    // Lock the revision so a replayed job (or a sweep) cannot write the same results twice.
    const revision = await tx.findOne(Revision, { id: revisionId }, { lockMode: LockMode.PESSIMISTIC_WRITE, refresh: true });
    if (!revision || revision.screeningStatus !== 'pending') return 'skipped';
    const spectrum = await tx.findOneOrFail(Spectrum, { id: revision.spectrum.id }, { lockMode: LockMode.PESSIMISTIC_WRITE, refresh: true });

    // Written with one plain INSERT in this transaction: the ORM's unit of work would snapshot
    // and log tens of megabytes of bytea (seconds for a 3 M-value file; see bench:upload).
    // The frequencies are the last parameter: the driver copies each parameter into one growing
    // message buffer, and a parameter after them would make it copy their 24 MB once more.
    const c = toStoredColumns(d);
    const trx = tx.getTransactionContext<Knex.Transaction>()!;
    await timed('screen.store.dispersion', () =>
      trx.raw(
        `insert into stored_dispersion (revision_id, meta, byte_size, q, distances, weights, frequencies) values (?, ?::jsonb, ?, ?, ?, ?, ?)`,
        [revision.id, JSON.stringify(c.meta), c.byteSize, c.q, c.distances, c.weights, c.frequencies],
      ),
    );
    const counts = { fail: 0, warn: 0, info: 0 };
    result.findings.forEach((f, ordinal) => {
      counts[f.severity]++;
      tx.create(Finding, {
        revision,
        ordinal,
        check: f.check,
        severity: f.severity,
        segment: f.segment,
        index: f.index,
        branch: f.branch,
        q: f.q,
        value: finiteOrNull(f.value),
        limit: finiteOrNull(f.limit),
        message: f.message,
      });
    });
    revision.screeningStatus = 'done';
    revision.screeningError = null;
    revision.verdict = result.verdict;
    revision.summary = {
      format: result.format,
      qpoints: result.qpoints,
      branches: result.branches,
      segments: result.segments,
      folded: result.folded,
    };
    revision.failCount = counts.fail;
    revision.warnCount = counts.warn;
    revision.infoCount = counts.info;
    revision.screenedAt = new Date();
    // Only the current revision moves the spectrum; an older one finishing late changes nothing.
    if (spectrum.currentRevisionId === revision.id) {
      spectrum.verdict = result.verdict;
      if (spectrum.status === 'screening') spectrum.status = 'in-review';
    }
    await timed('screen.store.rows', () => tx.flush());
    return 'done';
  });
}

/** Screens one revision; safe to run twice (a revision that is no longer pending is skipped). */
export async function runScreening(revisionId: string, options: RunScreeningOptions = {}): Promise<ScreeningOutcome> {
  const em = await getEm();
  const revision = await timed('screen.load', () => em.findOne(Revision, { id: revisionId }, { populate: ['spectrum'] }));
  if (!revision || revision.screeningStatus !== 'pending') return 'skipped';
  try {
    const bytes =
      takeStored(revision.fileKey, Number(revision.size)) ??
      (await timed('screen.read-file', () => readStoredFile(revision.ufsUrl, MAX_BAND_FILE_BYTES)));
    let d: Dispersion;
    try {
      d = timedSync('screen.parse', () => parseBandFile(bytes, { filename: revision.originalName, maxBytes: MAX_BAND_FILE_BYTES }));
    } catch (e) {
      if (e instanceof ParseError) return markError(revisionId, parseErrorInfo(e));
      throw e;
    }
    const policy = await timed('screen.policy', () => policyFor(em, revision.spectrum.group.id));
    const result = timedSync('screen.checks', () => screen(d, policy));
    return await timed('screen.store', () => store(revisionId, d, result));
  } catch (e) {
    const permanent = e instanceof StoredFileError && !e.retryable;
    if (!permanent && !options.finalAttempt) throw e;
    console.error(`[branchwise] screening of revision ${revisionId} failed:`, e);
    const why = e instanceof StoredFileError ? `the uploaded file could not be read back: ${e.message}` : 'an internal error';
    return markError(revisionId, {
      message: `Screening failed (${why}). Upload the file again; if it keeps failing, tell an admin.`,
      line: null,
      column: null,
      expected: null,
      found: null,
    });
  }
}

/** Sets every revision pending for longer than `timeoutMs` to `error`, with a message. */
export async function sweepStaleScreenings(timeoutMs = SCREENING_TIMEOUT_MS): Promise<number> {
  const em = await getEm();
  const minutes = Math.round(timeoutMs / 60_000);
  return em.nativeUpdate(
    Revision,
    { screeningStatus: 'pending', createdAt: { $lt: new Date(Date.now() - timeoutMs) } },
    {
      screeningStatus: 'error',
      screenedAt: new Date(),
      screeningError: {
        message: `Screening did not finish within ${minutes} minute${minutes === 1 ? '' : 's'}. Upload the file again; if it keeps happening, tell an admin.`,
        line: null,
        column: null,
        expected: null,
        found: null,
      },
    },
  );
}
