/**
 * Shared set-up for integration tests: real PostgreSQL (branchwise_test, migrated by
 * scripts/test.sh), real SMTP over loopback to the fake. Each test makes its own uniquely
 * named people and groups, so files do not depend on each other or on order.
 */
import { randomUUID } from 'node:crypto';
import net from 'node:net';
import { encode } from 'next-auth/jwt';
import { Group, Membership, User } from '@/entities';
import type { Caller } from '@/lib/auth/caller';
import { hashPassword } from '@/lib/auth/password';
import type { Role } from '@/lib/auth/permissions';
import { getEm, type Em } from '@/lib/db/orm';
import { startSmtpFake, type SmtpFake } from '@/fakes/smtp/server';

export function uniq(): string {
  return randomUUID().slice(0, 8);
}

export interface TestUser {
  id: string;
  email: string;
  name: string;
  password: string;
}

// One hash for every test person: argon2 costs ~75 ms a hash.
let sharedHash: Promise<string> | undefined;
export const TEST_PASSWORD = 'correct horse battery';

export async function makeUser(em: Em, label = 'person'): Promise<TestUser> {
  sharedHash ??= hashPassword(TEST_PASSWORD);
  const email = `${label}-${uniq()}@lab.test`;
  const name = `${label[0]!.toUpperCase()}${label.slice(1)} ${uniq().slice(0, 4)}`;
  const u = em.create(User, { email, name, passwordHash: await sharedHash, emailVerified: new Date() });
  await em.flush();
  return { id: u.id, email, name, password: TEST_PASSWORD };
}

export async function makeGroup(em: Em, label = 'lab'): Promise<{ id: string; slug: string; name: string }> {
  const slug = `${label}-${uniq()}`;
  const g = em.create(Group, { slug, name: `Test ${label} ${slug}` });
  await em.flush();
  return { id: g.id, slug, name: g.name };
}

export async function addMember(em: Em, user: { id: string }, group: { id: string }, role: Role): Promise<void> {
  em.create(Membership, { user: em.getReference(User, user.id), group: em.getReference(Group, group.id), role });
  await em.flush();
}

/** A group with one person per role. */
export async function makeLab(label = 'lab') {
  const em = await getEm();
  const group = await makeGroup(em, label);
  const people = {} as Record<Role, TestUser>;
  for (const role of ['admin', 'reviewer', 'submitter', 'observer'] as const) {
    people[role] = await makeUser(em, role);
    await addMember(em, people[role], group, role);
  }
  return { group, ...people };
}

export function sessionCaller(u: TestUser): Caller {
  return { userId: u.id, email: u.email, name: u.name, via: 'session' };
}

/** The session cookie next-auth would set after sign-in (JWT strategy). */
export async function sessionCookie(u: { id: string; email: string; name?: string | null }): Promise<string> {
  const token = await encode({ token: { sub: u.id, email: u.email, name: u.name ?? null }, secret: process.env.NEXTAUTH_SECRET! });
  return `next-auth.session-token=${token}`;
}

export function request(
  path: string,
  opts: { method?: string; body?: unknown; rawBody?: string; cookie?: string; bearer?: string } = {},
): Request {
  const headers = new Headers();
  if (opts.cookie) headers.set('cookie', opts.cookie);
  if (opts.bearer) headers.set('authorization', `Bearer ${opts.bearer}`);
  let body: string | undefined = opts.rawBody;
  if (opts.body !== undefined) {
    headers.set('content-type', 'application/json');
    body = JSON.stringify(opts.body);
  }
  return new Request(`${process.env.APP_URL ?? 'http://127.0.0.1:3100'}${path}`, { method: opts.method ?? 'GET', headers, body });
}

export function routeArgs(params: Record<string, string> = {}) {
  return { params: Promise.resolve(params) };
}

function listening(port: number): Promise<boolean> {
  return new Promise((resolve) => {
    const s = net.connect({ host: '127.0.0.1', port }, () => {
      s.end();
      resolve(true);
    });
    s.on('error', () => resolve(false));
  });
}

/**
 * The SMTP fake the app is configured for (SMTP_PORT, MAILBOX_DIR): scripts/test.sh starts it;
 * when it is not running (a single file run by hand), start one in this process.
 */
export async function ensureSmtpFake(): Promise<SmtpFake | null> {
  const port = Number(process.env.SMTP_PORT);
  if (await listening(port)) return null;
  return startSmtpFake({ port, dir: process.env.MAILBOX_DIR!, quiet: true });
}
