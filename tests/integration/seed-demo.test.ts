/** The demo seed: the audit log names each seeded member by the id the person really has. */
import { randomBytes } from 'node:crypto';
import { afterAll, describe, expect, it } from 'vitest';
import { AuditEvent, User } from '@/entities';
import { closeOrm, getEm } from '@/lib/db/orm';
import { seedDemo } from '@/lib/services/seed';

afterAll(closeOrm);

describe('seedDemo', () => {
  it('records member.seeded against the new user, and a second run adds nothing', async () => {
    const tag = randomBytes(3).toString('hex');
    const groups = [{ slug: `larkspur-${tag}`, name: `Larkspur Lattice Lab ${tag} (invented)` }];
    const people = [
      { role: 'admin' as const, name: 'Edda Quill', email: `edda.${tag}@larkspur.example`, password: `pw-edda-${tag}`, group: groups[0].slug },
      { role: 'reviewer' as const, name: 'Bram Osei', email: `bram.${tag}@larkspur.example`, password: `pw-bram-${tag}`, group: groups[0].slug },
    ];
    expect((await seedDemo(await getEm(), groups, people)).created).toBe(3);

    const em = await getEm();
    for (const p of people) {
      const user = await em.findOneOrFail(User, { email: p.email });
      const events = await em.find(AuditEvent, { action: 'member.seeded', target: `user:${user.id}` });
      expect(events, p.email).toHaveLength(1);
      expect(events[0].data).toMatchObject({ email: p.email, role: p.role });
    }
    expect((await seedDemo(await getEm(), groups, people)).created).toBe(0);
  });
});
