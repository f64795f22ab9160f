import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { AuditEvent, User, VerificationToken } from '@/entities';
import { branchwiseAdapter } from '@/lib/auth/adapter';
import { checkPassword, getAuthOptions, sendSignInLink } from '@/lib/auth/options';
import { hashPassword } from '@/lib/auth/password';
import { closeOrm, getEm } from '@/lib/db/orm';
import { AppError } from '@/lib/errors';
import { firstLink, latestTo } from '@/lib/mail/mailbox';
import { changePassword, getProfile, updateProfile } from '@/lib/services/account';
import type { SmtpFake } from '@/fakes/smtp/server';
import { ensureSmtpFake, makeUser, uniq, type TestUser } from './helpers';

let fake: SmtpFake | null;
let person: TestUser;

beforeAll(async () => {
  fake = await ensureSmtpFake();
  person = await makeUser(await getEm(), 'signer');
});
afterAll(async () => {
  await fake?.close();
  await closeOrm();
});

describe('password sign-in', () => {
  it('accepts the right password, case-insensitively on the e-mail', async () => {
    expect(await checkPassword(person.email.toUpperCase(), person.password)).toEqual({ id: person.id, email: person.email, name: person.name });
  });

  it('an unknown e-mail and a wrong password are indistinguishable', async () => {
    expect(await checkPassword(person.email, 'wrong password!')).toBeNull();
    expect(await checkPassword(`nobody-${uniq()}@lab.test`, person.password)).toBeNull();
    // authorize() is what next-auth calls; both cases give the same null (→ one "CredentialsSignin" message).
    const provider = getAuthOptions().providers.find((p) => p.id === 'credentials') as unknown as {
      options: { authorize: (c: Record<string, string>) => Promise<unknown> };
    };
    const unknown = await provider.options.authorize({ email: `nobody-${uniq()}@lab.test`, password: 'x' });
    const wrong = await provider.options.authorize({ email: person.email, password: 'x' });
    expect(unknown).toBeNull();
    expect(wrong).toBeNull();
  });

  it('hashes are argon2id and the hash is not loaded unless asked for', async () => {
    expect(await hashPassword('something long')).toMatch(/^\$argon2id\$/);
    const u = await (await getEm()).findOneOrFail(User, { id: person.id });
    expect(JSON.stringify(u)).not.toContain('argon2');
  });

  it('a sign-in writes an audit event', async () => {
    await getAuthOptions().events!.signIn!({ user: { id: person.id, email: person.email }, account: { provider: 'credentials', type: 'credentials', providerAccountId: person.id }, isNewUser: false } as never);
    const events = await (await getEm()).find(AuditEvent, { action: 'auth.sign-in', actor: person.id });
    expect(events.length).toBeGreaterThanOrEqual(1);
    expect(events[0]!.data).toMatchObject({ method: 'password' });
  });
});

describe('e-mail link sign-in', () => {
  it('sends the link to an existing account, and a "no account" note otherwise', async () => {
    const url = `${process.env.APP_URL}/api/auth/callback/email?token=abc${uniq()}&email=${encodeURIComponent(person.email)}`;
    await sendSignInLink(person.email, url);
    const mail = await latestTo(person.email);
    expect(mail?.subject).toBe('Your Branchwise sign-in link');
    expect(firstLink(mail!)).toBe(url);

    const stranger = `stranger-${uniq()}@lab.test`;
    await sendSignInLink(stranger, `${process.env.APP_URL}/api/auth/callback/email?token=zzz`);
    const note = await latestTo(stranger);
    expect(note?.subject).toMatch(/no account/);
    expect(note?.text).not.toContain('token=zzz');
  });

  it('only an existing account may complete an e-mail sign-in (no open sign-up)', async () => {
    const signIn = getAuthOptions().callbacks!.signIn!;
    const account = { provider: 'email', type: 'email', providerAccountId: 'x' } as never;
    expect(await signIn({ user: { id: person.email, email: person.email }, account } as never)).toBe(true);
    expect(await signIn({ user: { id: 'n', email: `new-${uniq()}@lab.test` }, account } as never)).toBe(false);
    await expect(branchwiseAdapter().createUser!({ email: 'x@lab.test', emailVerified: null } as never)).rejects.toBeInstanceOf(AppError);
  });

  it('a link token is used once, even with two clicks at the same time', async () => {
    const adapter = branchwiseAdapter();
    const token = `hash-${uniq()}`;
    const expires = new Date(Date.now() + 60_000);
    await adapter.createVerificationToken!({ identifier: person.email, token, expires });
    const [a, b] = await Promise.all([
      adapter.useVerificationToken!({ identifier: person.email, token }),
      adapter.useVerificationToken!({ identifier: person.email, token }),
    ]);
    expect([a, b].filter(Boolean)).toHaveLength(1);
    expect(await adapter.useVerificationToken!({ identifier: person.email, token })).toBeNull();
    expect(await (await getEm()).count(VerificationToken, { token })).toBe(0);
  });

  it('an expired link token is still returned so next-auth can refuse it as expired', async () => {
    const adapter = branchwiseAdapter();
    const token = `old-${uniq()}`;
    await adapter.createVerificationToken!({ identifier: person.email, token, expires: new Date(Date.now() - 1000) });
    const row = await adapter.useVerificationToken!({ identifier: person.email, token });
    expect(row?.expires.getTime()).toBeLessThan(Date.now());
  });

  it('adapter users are plain objects without the password hash; bad ids are null', async () => {
    const adapter = branchwiseAdapter();
    const u = await adapter.getUserByEmail!(person.email.toUpperCase());
    expect(u).toEqual({ id: person.id, email: person.email, name: person.name, emailVerified: expect.any(Date) });
    expect(await adapter.getUser!('not-a-uuid')).toBeNull();
  });
});

describe('account', () => {
  it('changes the name', async () => {
    const em = await getEm();
    const u = await makeUser(em, 'renamer');
    await updateProfile(await getEm(), { id: u.id, email: u.email, name: u.name }, { name: '  Ada Renamed ' });
    expect((await getProfile(await getEm(), u.id)).name).toBe('Ada Renamed');
  });

  it('changes the password only with the current one; the old one stops working', async () => {
    const u = await makeUser(await getEm(), 'changer');
    const me = { id: u.id, email: u.email, name: u.name };
    await expect(changePassword(await getEm(), me, { current: 'not it at all', password: 'brand-new-secret' })).rejects.toMatchObject({
      code: 'invalid_input',
      details: { fieldErrors: { current: [expect.any(String)] } },
    });
    expect(await checkPassword(u.email, u.password)).not.toBeNull();

    await changePassword(await getEm(), me, { current: u.password, password: 'brand-new-secret' });
    expect(await checkPassword(u.email, u.password)).toBeNull();
    expect(await checkPassword(u.email, 'brand-new-secret')).toMatchObject({ id: u.id });
    expect(await (await getEm()).count(AuditEvent, { action: 'auth.password-changed', actor: u.id })).toBe(1);
  });
});
