import PgBoss from 'pg-boss';
import { databaseUrl } from '@/lib/config/env';

/**
 * One pg-boss per process, kept on globalThis (dev reloads must not open new pools or start a
 * second set of workers). Its tables live in their own schema, `pgboss`, created on first start.
 */
export const BOSS_SCHEMA = 'pgboss';

interface Holder {
  __branchwiseBoss?: Promise<PgBoss>;
}
const holder = globalThis as typeof globalThis & Holder;

/** Queues and their retry rules. A job that crashes or runs past expireInSeconds is retried. */
export const QUEUES = {
  screening: { name: 'screen-revision', retryLimit: 2, retryDelay: 5, expireInSeconds: 5 * 60 },
  sweep: { name: 'sweep-stale-screenings', retryLimit: 0, expireInSeconds: 60 },
} as const;

async function create(): Promise<PgBoss> {
  const boss = new PgBoss({ connectionString: databaseUrl(), schema: BOSS_SCHEMA, max: 4 });
  boss.on('error', (e) => console.error('[branchwise] job queue:', e));
  await boss.start();
  for (const q of Object.values(QUEUES)) await boss.createQueue(q.name, { ...q });
  return boss;
}

export function getBoss(): Promise<PgBoss> {
  if (!holder.__branchwiseBoss) {
    holder.__branchwiseBoss = create().catch((e: unknown) => {
      holder.__branchwiseBoss = undefined;
      throw e;
    });
  }
  return holder.__branchwiseBoss;
}

/** Stops workers (finishing running jobs) and closes the pool; tests and scripts call it. */
export async function stopBoss(): Promise<void> {
  const pending = holder.__branchwiseBoss;
  holder.__branchwiseBoss = undefined;
  if (!pending) return;
  const boss = await pending.catch(() => null);
  if (boss) await boss.stop({ graceful: true, wait: true, timeout: 30_000 });
}
