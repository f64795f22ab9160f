import { route } from '@/lib/http/route';

export const dynamic = 'force-dynamic';

/**
 * Liveness for scripts and monitors: 200 when the database answers, 503 otherwise. (When the
 * ORM cannot even connect, the wrapper itself answers 503 with code "unavailable".)
 */
export const GET = route({ auth: 'none' }, async ({ em }) => {
  try {
    await em.getConnection().execute('select 1');
    return { ok: true, db: 'up' };
  } catch (e) {
    console.error('[branchwise] health: database down:', e instanceof Error ? e.message : e);
    return Response.json({ ok: false, db: 'down' }, { status: 503 });
  }
});
