/**
 * E-mail notifications on the job queue (pg-boss):
 * - `notify-drain` fans the outbox out into deliveries and hands each immediate one to
 *   `notify-send`; it runs every few seconds in the worker process and every minute by schedule
 *   (whichever process holds the worker), and also re-queues immediate mail whose job was lost;
 * - `notify-send` sends one delivery; a failure (mail server down) is retried with exponential
 *   backoff, and the delivery stays pending until sent, so mail is delayed, never lost;
 * - `notify-digest` sends the daily digests, on a cron schedule (07:00 UTC unless NOTIFY_DIGEST_CRON).
 * The `stately` policy keeps at most one queued job per key, so repeated kicks cost nothing.
 */
import type PgBoss from 'pg-boss';
import { fanOutOutbox, runDigest, sendDelivery, stalledImmediateDeliveries, type DigestResult, type FanOutResult, type SendFn } from '@/lib/services/notifications';
import { getBoss } from './boss';

export const NOTIFY_QUEUES = {
  drain: { name: 'notify-drain', policy: 'stately', retryLimit: 0, expireInSeconds: 120 },
  send: { name: 'notify-send', policy: 'stately', retryLimit: 12, retryDelay: 10, retryBackoff: true, expireInSeconds: 15 * 60 },
  digest: { name: 'notify-digest', policy: 'stately', retryLimit: 3, retryDelay: 300, retryBackoff: true, expireInSeconds: 30 * 60 },
} as const satisfies Record<string, PgBoss.Queue>;

export const DEFAULT_DIGEST_CRON = '0 7 * * *';
/** Pending immediate mail untouched this long is queued again (its job was lost or gave up). */
const STALLED_AFTER_MS = 15 * 60_000;

export interface NotifyWorkerOptions {
  /** How often workers poll their queue (pg-boss minimum 0.5 s). */
  pollingIntervalSeconds?: number;
  /** Kick the drain this often from this process; 0 turns the local timer off (the minute schedule stays). */
  drainEverySeconds?: number;
  /** First retry delay of a failed send, doubled on each retry. */
  retryDelaySeconds?: number;
  retryLimit?: number;
  /** Cron for the digest (UTC); null: no schedule from this process. */
  digestCron?: string | null;
  /** Whether to install the minute drain schedule (tests turn it off to drive the drain themselves). */
  schedule?: boolean;
  /** Which queues this process works (default all); tests take only 'send' and drain themselves. */
  queues?: readonly ('send' | 'drain' | 'digest')[];
}

interface NotifyState {
  boss: PgBoss;
  workerIds: string[];
  timer: NodeJS.Timeout | null;
  options: NotifyWorkerOptions;
}
const holder = globalThis as typeof globalThis & { __branchwiseNotify?: Promise<NotifyState> };

let sendOptions: { retryLimit: number; retryDelay: number } = {
  retryLimit: NOTIFY_QUEUES.send.retryLimit,
  retryDelay: NOTIFY_QUEUES.send.retryDelay,
};

async function ensureQueues(boss: PgBoss): Promise<void> {
  for (const q of Object.values(NOTIFY_QUEUES)) {
    if (!(await boss.getQueue(q.name))) await boss.createQueue(q.name, { ...q });
  }
}

/** Puts immediate deliveries on the send queue (one queued job per delivery at most). */
export async function enqueueSends(deliveryIds: readonly string[]): Promise<void> {
  if (!deliveryIds.length) return;
  const boss = await getBoss();
  await ensureQueues(boss);
  for (const id of deliveryIds) {
    await boss.send(NOTIFY_QUEUES.send.name, { deliveryId: id }, { singletonKey: id, retryBackoff: true, ...sendOptions });
  }
  const state = await holder.__branchwiseNotify?.catch(() => null);
  for (const w of state?.workerIds ?? []) boss.notifyWorker(w);
}

/**
 * Fans out the whole backlog now and queues its immediate mail; with `groupId`, only that
 * group's events (tests). Returns what the fan-out made.
 */
export async function drainOutboxNow(opts: { groupId?: string } = {}): Promise<FanOutResult> {
  const total: FanOutResult = { events: 0, deliveries: 0, immediate: [] };
  const limit = 50;
  for (;;) {
    const r = await fanOutOutbox({ groupId: opts.groupId, limit });
    total.events += r.events;
    total.deliveries += r.deliveries;
    total.immediate.push(...r.immediate);
    await enqueueSends(r.immediate);
    if (r.events < limit) break;
  }
  return total;
}

/** The daily digest, now, in this process (tests, or an admin script). */
export function runDigestNow(opts: { userIds?: string[]; send?: SendFn } = {}): Promise<DigestResult> {
  return runDigest(opts);
}

/** Asks the worker to drain soon (cheap: at most one drain job waits at a time). */
export async function kickNotifications(): Promise<void> {
  const boss = await getBoss();
  await boss.send(NOTIFY_QUEUES.drain.name, {}, { retryLimit: 0 });
}

async function drainJob(): Promise<void> {
  await drainOutboxNow();
  await enqueueSends(await stalledImmediateDeliveries(STALLED_AFTER_MS));
}

async function start(options: NotifyWorkerOptions): Promise<NotifyState> {
  const boss = await getBoss();
  await ensureQueues(boss);
  sendOptions = {
    retryLimit: options.retryLimit ?? NOTIFY_QUEUES.send.retryLimit,
    retryDelay: options.retryDelaySeconds ?? NOTIFY_QUEUES.send.retryDelay,
  };
  const pollingIntervalSeconds = options.pollingIntervalSeconds ?? 2;
  const queues = new Set(options.queues ?? ['send', 'drain', 'digest']);
  const workerIds: string[] = [];
  if (queues.has('send')) {
    // A batch, but each job succeeds or fails on its own: a failed one is moved to retry here, and
    // pg-boss then completes only the jobs still active.
    workerIds.push(await boss.work<{ deliveryId: string }>(NOTIFY_QUEUES.send.name, { batchSize: 10, pollingIntervalSeconds }, async (jobs) => {
      for (const job of jobs) {
        try {
          await sendDelivery(job.data.deliveryId);
        } catch (e) {
          await boss.fail(NOTIFY_QUEUES.send.name, job.id, { message: e instanceof Error ? e.message : String(e) });
        }
      }
    }));
  }
  if (queues.has('drain')) workerIds.push(await boss.work(NOTIFY_QUEUES.drain.name, { pollingIntervalSeconds }, drainJob));
  if (queues.has('digest')) {
    workerIds.push(await boss.work(NOTIFY_QUEUES.digest.name, { pollingIntervalSeconds: Math.max(pollingIntervalSeconds, 5) }, async () => {
      const r = await runDigest();
      if (r.failed) throw new Error(`${r.failed} digest(s) not sent; they are kept for the retry`);
    }));
  }
  if (options.schedule !== false) await boss.schedule(NOTIFY_QUEUES.drain.name, '* * * * *', {}, { tz: 'UTC' });
  const cron = options.digestCron === undefined ? (process.env.NOTIFY_DIGEST_CRON || DEFAULT_DIGEST_CRON) : options.digestCron;
  if (cron) await boss.schedule(NOTIFY_QUEUES.digest.name, cron, {}, { tz: 'UTC' });
  const every = options.drainEverySeconds ?? 5;
  let timer: NodeJS.Timeout | null = null;
  if (every > 0) {
    timer = setInterval(() => {
      kickNotifications().catch((e: unknown) => console.error('[branchwise] notifications: drain kick failed:', e));
    }, every * 1000);
    timer.unref();
  }
  return { boss, workerIds, timer, options };
}

/** Starts the notification workers in this process (idempotent). */
export function startNotifyWorker(options: NotifyWorkerOptions = {}): Promise<NotifyState> {
  holder.__branchwiseNotify ??= start(options).catch((e: unknown) => {
    holder.__branchwiseNotify = undefined;
    throw e;
  });
  return holder.__branchwiseNotify;
}

/** Stops this process's notification workers (the boss itself stays for other queues). */
export async function stopNotifyWorker(): Promise<void> {
  const pending = holder.__branchwiseNotify;
  holder.__branchwiseNotify = undefined;
  const state = await pending?.catch(() => null);
  if (!state) return;
  if (state.timer) clearInterval(state.timer);
  // The boss this worker started on; it may have been stopped already (stopBoss), which ends the workers too.
  for (const q of Object.values(NOTIFY_QUEUES)) await state.boss.offWork(q.name).catch(() => undefined);
}
