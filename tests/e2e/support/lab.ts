/**
 * Test data for the browser tests: an invented lab created straight in the test database, with a
 * fresh suffix per call so tests never share people or groups and can run again on the same
 * database. Only people, groups and memberships are written here; everything the tests check
 * (invitations, roles, tokens, sign-in) goes through the app itself.
 */
import { randomBytes } from 'node:crypto';
import { Group, Membership, User } from '@/entities';
import { hashPassword } from '@/lib/auth/password';
import { closeOrm, getEm } from '@/lib/db/orm';

export type Role = 'admin' | 'reviewer' | 'submitter' | 'observer';

export interface Person {
  name: string;
  email: string;
  password: string;
  userId: string;
}

export interface Lab {
  group: { slug: string; name: string };
  people: Record<Role, Person>;
  /** Admin of another group, member of nothing in `group`. */
  outsider: Person;
  otherGroup: { slug: string; name: string };
}

// Invented people for an invented lab (test data only).
const cast: Record<Role, string> = {
  admin: 'Ilse Varga',
  reviewer: 'Kofi Brandt',
  submitter: 'Mira Okonjo',
  observer: 'Tomas Leclair',
};

export async function seedLab(tag = 'lab'): Promise<Lab> {
  const suffix = `${tag}-${Date.now().toString(36)}${randomBytes(2).toString('hex')}`;
  const em = await getEm();
  const group = em.create(Group, { slug: `fjordlight-${suffix}`, name: `Fjordlight Phonon Lab ${suffix}` });
  const otherGroup = em.create(Group, { slug: `saltmarsh-${suffix}`, name: `Saltmarsh Theory Group ${suffix}` });

  const users: { person: Omit<Person, 'userId'>; user: User }[] = [];
  const makePerson = async (name: string, local: string) => {
    const email = `${local}.${suffix}@fjordlight.example`;
    const password = `pw-${local}-${suffix}`;
    const user = em.create(User, { email, name, passwordHash: await hashPassword(password), emailVerified: new Date() });
    users.push({ person: { name, email, password }, user });
    return user;
  };

  for (const role of Object.keys(cast) as Role[]) {
    em.create(Membership, { user: await makePerson(cast[role], role), group, role, joinedAt: new Date() });
  }
  em.create(Membership, { user: await makePerson('Ruth Ambler', 'outsider'), group: otherGroup, role: 'admin', joinedAt: new Date() });
  await em.flush();

  // Ids exist only after the flush.
  const done = users.map(({ person, user }) => ({ ...person, userId: user.id }));
  const roleList = Object.keys(cast) as Role[];
  return {
    group: { slug: group.slug, name: group.name },
    otherGroup: { slug: otherGroup.slug, name: otherGroup.name },
    people: Object.fromEntries(roleList.map((r, i) => [r, done[i]])) as Record<Role, Person>,
    outsider: done[roleList.length],
  };
}

export async function closeLab(): Promise<void> {
  await closeOrm();
}

/** A fresh address nobody has used, for invitations and unknown-e-mail checks. */
export function freshEmail(local: string): string {
  return `${local}.${Date.now().toString(36)}${randomBytes(2).toString('hex')}@fjordlight.example`;
}
