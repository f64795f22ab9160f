/** Counts of findings that still count toward the verdict (not waived), per revision. */
import type { Em } from '@/lib/db/orm';

export interface FindingCounts {
  fail: number;
  warn: number;
  info: number;
}

export const noFindings = (): FindingCounts => ({ fail: 0, warn: 0, info: 0 });

/** Unwaived findings by severity for each of these revisions (absent revisions have none). */
export async function unwaivedCounts(em: Em, revisionIds: string[]): Promise<Map<string, FindingCounts>> {
  const out = new Map<string, FindingCounts>();
  const ids = [...new Set(revisionIds)];
  if (!ids.length) return out;
  const rows = await em.getConnection().execute<{ revision_id: string; severity: keyof FindingCounts; n: string }[]>(
    `select f.revision_id, f.severity, count(*) as n from finding f
      where f.revision_id in (${ids.map(() => '?').join(',')})
        and not exists (select 1 from waiver w where w.finding_id = f.id)
      group by f.revision_id, f.severity`,
    ids,
  );
  for (const r of rows) {
    const c = out.get(r.revision_id) ?? noFindings();
    c[r.severity] = Number(r.n);
    out.set(r.revision_id, c);
  }
  return out;
}
