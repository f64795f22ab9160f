import { MikroORM, type EntityManager } from '@mikro-orm/postgresql';

export type Em = EntityManager;

// One ORM per process, kept on globalThis so that dev reloads do not open new pools.
const holder = globalThis as typeof globalThis & { __branchwiseOrm?: Promise<MikroORM> };

export function getOrm(): Promise<MikroORM> {
  if (!holder.__branchwiseOrm) {
    // Imported on first use so that a build without DATABASE_URL never evaluates the config.
    holder.__branchwiseOrm = import('@/mikro-orm.config')
      .then(({ default: config }) => MikroORM.init(config))
      .catch((e: unknown) => {
      // Do not cache a failure: the next request tries again (the database may come back).
      holder.__branchwiseOrm = undefined;
      throw e;
    });
  }
  return holder.__branchwiseOrm;
}

/** A fresh EntityManager fork: one per request, action or page render. */
export async function getEm(): Promise<Em> {
  const orm = await getOrm();
  return orm.em.fork();
}

/** For scripts and tests: close the pool so the process can exit. */
export async function closeOrm(): Promise<void> {
  const pending = holder.__branchwiseOrm;
  holder.__branchwiseOrm = undefined;
  if (pending) await (await pending).close(true);
}
