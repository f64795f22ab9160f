import type PgBoss from 'pg-boss';
import { runScreening, sweepStaleScreenings, SCREENING_TIMEOUT_MS } from '@/lib/services/screening-job';
import { timed } from '@/lib/timing';
import { getBoss, QUEUES, stopBoss } from './boss';

export interface ScreeningJobData {
  revisionId: string;
}

interface WorkerState {
  workerIds: string[];
}
const holder = globalThis as typeof globalThis & { __branchwiseWorker?: Promise<WorkerState> };

/** Puts a revision on the screening queue (after its row is committed). */
export async function enqueueScreening(revisionId: string): Promise<void> {
  const boss = await getBoss();
  await timed('upload.enqueue', () => boss.send(QUEUES.screening.name, { revisionId } satisfies ScreeningJobData, { singletonKey: revisionId }));
  // A worker in this process starts at once instead of waiting for its next poll.
  const state = await holder.__branchwiseWorker?.catch(() => null);
  for (const id of state?.workerIds ?? []) boss.notifyWorker(id);
}

async function handleScreening(jobs: PgBoss.JobWithMetadata<ScreeningJobData>[]): Promise<void> {
  for (const job of jobs) {
    // The last attempt records a failure on the revision instead of leaving it pending.
    await timed('screen.job', () => runScreening(job.data.revisionId, { finalAttempt: job.retryCount >= job.retryLimit }));
  }
}

async function start(options: { pollingIntervalSeconds?: number }): Promise<WorkerState> {
  const boss = await getBoss();
  const pollingIntervalSeconds = options.pollingIntervalSeconds ?? 1;
  const screeningId = await boss.work<ScreeningJobData>(
    QUEUES.screening.name,
    { batchSize: 1, includeMetadata: true, pollingIntervalSeconds },
    handleScreening,
  );
  const sweepId = await boss.work(QUEUES.sweep.name, { pollingIntervalSeconds: 10 }, async () => {
    await sweepStaleScreenings(SCREENING_TIMEOUT_MS);
  });
  // Every minute (cron resolution); pg-boss keeps one schedule per queue name across processes.
  await boss.schedule(QUEUES.sweep.name, '* * * * *');
  await sweepStaleScreenings(SCREENING_TIMEOUT_MS);
  return { workerIds: [screeningId, sweepId] };
}

/** Starts the screening worker and the stale-screening sweep in this process (idempotent). */
export function startWorker(options: { pollingIntervalSeconds?: number } = {}): Promise<WorkerState> {
  holder.__branchwiseWorker ??= start(options).catch((e: unknown) => {
    holder.__branchwiseWorker = undefined;
    throw e;
  });
  return holder.__branchwiseWorker;
}

/** Stops the worker after the running job, and the queue's connections. */
export async function stopWorker(): Promise<void> {
  holder.__branchwiseWorker = undefined;
  await stopBoss();
}
