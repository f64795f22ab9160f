import { Group, Membership, User } from '@/entities';
import { hashPassword, verifyPassword } from '@/lib/auth/password';
import type { Em } from '@/lib/db/orm';
import { demoGroups, demoPeople, type DemoGroup, type DemoPerson } from './demo-people';
import { recordAudit } from './audit';

/**
 * Creates or brings back the demo lab: groups, people, passwords and roles as listed. Running it
 * again changes nothing that is already right (idempotent).
 */
export async function seedDemo(em: Em, groups: DemoGroup[] = demoGroups, people: DemoPerson[] = demoPeople): Promise<{ created: number }> {
  let created = 0;
  await em.transactional(async (tem) => {
    const bySlug = new Map<string, Group>();
    for (const g of groups) {
      let group = await tem.findOne(Group, { slug: g.slug });
      if (!group) {
        group = tem.create(Group, { slug: g.slug, name: g.name });
        created++;
      } else if (group.name !== g.name) group.name = g.name;
      bySlug.set(g.slug, group);
    }
    for (const p of people) {
      let user = await tem.findOne(User, { email: p.email }, { populate: ['passwordHash'] });
      if (!user) {
        user = tem.create(User, { email: p.email, name: p.name, passwordHash: await hashPassword(p.password), emailVerified: new Date() });
        // Ids are made on flush; the membership lookup and the audit target below need this one.
        await tem.flush();
        created++;
      } else if (!user.passwordHash || !(await verifyPassword(user.passwordHash, p.password))) {
        user.passwordHash = await hashPassword(p.password);
      }
      const group = bySlug.get(p.group)!;
      const membership = await tem.findOne(Membership, { user: user.id, group: group.id });
      if (!membership) {
        tem.create(Membership, { user, group, role: p.role });
        recordAudit(tem, { groupId: group.id, action: 'member.seeded', target: `user:${user.id}`, data: { email: p.email, role: p.role } });
      } else if (membership.role !== p.role) membership.role = p.role;
    }
  });
  return { created };
}
