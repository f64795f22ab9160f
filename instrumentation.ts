/**
 * Next calls register() once per server process: the screening worker runs beside the app
 * (pg-boss on the same PostgreSQL). Set BRANCHWISE_WORKER=off to run the app without it
 * (e.g. several app processes with one worker elsewhere). Not during `next build`.
 */
export async function register(): Promise<void> {
  if (process.env.NEXT_RUNTIME !== 'nodejs') return;
  if (process.env.BRANCHWISE_WORKER === 'off' || process.env.NEXT_PHASE === 'phase-production-build') return;
  const { startWorker } = await import('./lib/jobs/screening-queue');
  try {
    await startWorker({ pollingIntervalSeconds: 1 });
    console.log('[branchwise] screening worker started');
  } catch (e) {
    // The app still serves pages; queued revisions wait (or time out to `error`) until it starts.
    console.error('[branchwise] screening worker did not start:', e);
  }
  const { startNotifyWorker } = await import('./lib/jobs/notify-queue');
  try {
    await startNotifyWorker();
    console.log('[branchwise] notification worker started');
  } catch (e) {
    // Events wait in the outbox until a worker starts; no mail is lost.
    console.error('[branchwise] notification worker did not start:', e);
  }
}
