/**
 * The e-mail sign-in link limit through next-auth's real request handling (CSRF check, signIn
 * callback, token, mail to the SMTP fake): per address and per client, in a sliding window whose
 * clock the test moves.
 */
import NextAuth from 'next-auth';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { SignInLinkRequest } from '@/entities';
import { clientAddress } from '@/lib/auth/client-address';
import { LINK_LIMIT_ERROR, LINK_LIMITS } from '@/lib/auth/link-limits';
import { authOptionsFor } from '@/lib/auth/options';
import { closeOrm, getEm } from '@/lib/db/orm';
import { listMessages } from '@/lib/mail/mailbox';
import type { SmtpFake } from '@/fakes/smtp/server';
import { ensureSmtpFake, makeUser, uniq } from './helpers';

let fake: SmtpFake | null;
let clock = new Date();
const minutes = (n: number) => n * 60_000;

beforeAll(async () => {
  fake = await ensureSmtpFake();
});
afterAll(async () => {
  await fake?.close();
  await closeOrm();
});

interface Answer {
  status: number;
  body: unknown;
  setCookie: string[];
}

/**
 * One request through next-auth's Node handler with the options our route builds; `client` is
 * the x-forwarded-for Next's server sets (null: none).
 */
async function nextAuth(client: string | null, action: string[], method: 'GET' | 'POST', body?: Record<string, string>, cookies: Record<string, string> = {}): Promise<Answer> {
  const out: Answer = { status: 200, body: undefined, setCookie: [] };
  const headers = new Map<string, unknown>();
  const res = {
    status(n: number) {
      out.status = n;
      return res;
    },
    setHeader(k: string, v: unknown) {
      headers.set(k.toLowerCase(), v);
      if (k.toLowerCase() === 'set-cookie') out.setCookie = v as string[];
      return res;
    },
    getHeader: (k: string) => headers.get(k.toLowerCase()),
    json(b: unknown) {
      out.body = b;
      return res;
    },
    send(b: unknown) {
      out.body = b;
      return res;
    },
    end: () => res,
  };
  const forwarded = new Headers(client ? { 'x-forwarded-for': client } : {});
  const req = { query: { nextauth: action }, body, cookies, headers: { host: new URL(process.env.APP_URL!).host }, method };
  await NextAuth(req as never, res as never, authOptionsFor({ client: clientAddress(forwarded), now: () => clock }));
  return out;
}

/** Asks for a link as the sign-in form does (JSON answer); the error code next-auth hands back, or null. */
async function askForLink(email: string, client: string | null): Promise<string | null> {
  const csrf = await nextAuth(client, ['csrf'], 'GET');
  const cookie = csrf.setCookie.map((c) => c.split(';')[0]!).find((c) => c.startsWith('next-auth.csrf-token='))!;
  const [name, value] = [cookie.slice(0, cookie.indexOf('=')), decodeURIComponent(cookie.slice(cookie.indexOf('=') + 1))];
  const answer = await nextAuth(
    client,
    ['signin', 'email'],
    'POST',
    { email, csrfToken: (csrf.body as { csrfToken: string }).csrfToken, callbackUrl: `${process.env.APP_URL}/`, json: 'true' },
    { [name]: value },
  );
  expect(answer.status).toBe(200);
  return new URL((answer.body as { url: string }).url).searchParams.get('error');
}

const mailsTo = async (email: string) => (await listMessages()).filter((m) => m.to.some((t) => t.toLowerCase() === email.toLowerCase())).length;

describe('e-mail sign-in link limit', () => {
  it(`sends ${LINK_LIMITS.perEmail} links to an address in the window, not the next; after the window it works again`, async () => {
    const person = await makeUser(await getEm(), 'limited');
    const client = `198.51.100.${Math.floor(Math.random() * 200) + 1}`;
    const start = new Date();
    for (let i = 0; i < LINK_LIMITS.perEmail; i++) {
      clock = new Date(start.getTime() + minutes(i));
      expect(await askForLink(i % 2 ? person.email.toUpperCase() : person.email, client)).toBeNull();
    }
    expect(await mailsTo(person.email)).toBe(LINK_LIMITS.perEmail);

    clock = new Date(start.getTime() + minutes(LINK_LIMITS.windowMinutes) - 1000);
    expect(await askForLink(person.email, client)).toBe(LINK_LIMIT_ERROR);
    expect(await mailsTo(person.email)).toBe(LINK_LIMITS.perEmail);

    // The first request has left the window: one more fits, then the limit holds again.
    clock = new Date(start.getTime() + minutes(LINK_LIMITS.windowMinutes));
    expect(await askForLink(person.email, client)).toBeNull();
    expect(await mailsTo(person.email)).toBe(LINK_LIMITS.perEmail + 1);
    expect(await askForLink(person.email, client)).toBe(LINK_LIMIT_ERROR);
    expect(await mailsTo(person.email)).toBe(LINK_LIMITS.perEmail + 1);
  });

  it('an address without an account is limited the same way (the answer does not tell them apart)', async () => {
    const stranger = `nobody-${uniq()}@lab.test`;
    clock = new Date();
    for (let i = 0; i < LINK_LIMITS.perEmail; i++) expect(await askForLink(stranger, null)).toBeNull();
    expect(await askForLink(stranger, null)).toBe(LINK_LIMIT_ERROR);
    expect(await mailsTo(stranger)).toBe(LINK_LIMITS.perEmail);
  });

  it(`a client gets ${LINK_LIMITS.perClient} links in the window whatever the addresses; others are not held up`, async () => {
    const client = `2001:db8:${(Math.floor(Math.random() * 0xffff) + 1).toString(16)}:1::`;
    clock = new Date();
    for (let i = 0; i < LINK_LIMITS.perClient; i++) expect(await askForLink(`nobody-${uniq()}@lab.test`, `${client}${i + 1}`)).toBeNull();
    const next = `nobody-${uniq()}@lab.test`;
    // Another address of the same /64 is the same client.
    expect(await askForLink(next, `${client}ffff`)).toBe(LINK_LIMIT_ERROR);
    expect(await mailsTo(next)).toBe(0);
    expect(await askForLink(next, '203.0.113.77')).toBeNull();
    expect(await mailsTo(next)).toBe(1);
  });

  it('requests at the same moment cannot slip past the limit together', async () => {
    const stranger = `nobody-${uniq()}@lab.test`;
    clock = new Date();
    const answers = await Promise.all(Array.from({ length: LINK_LIMITS.perEmail + 3 }, () => askForLink(stranger, null)));
    expect(answers.filter((a) => a === null)).toHaveLength(LINK_LIMITS.perEmail);
    expect(answers.filter((a) => a === LINK_LIMIT_ERROR)).toHaveLength(3);
    expect(await mailsTo(stranger)).toBe(LINK_LIMITS.perEmail);
  });

  it('stores neither the e-mail nor the client address, and forgets requests once out of the window', async () => {
    const stranger = `nobody-${uniq()}@lab.test`;
    clock = new Date();
    await askForLink(stranger, '192.0.2.44');
    const em = await getEm();
    const rows = await em.find(SignInLinkRequest, {});
    expect(rows.some((r) => r.key.includes('@') || r.key.includes('192.0.2.44'))).toBe(false);
    clock = new Date(clock.getTime() + minutes(LINK_LIMITS.windowMinutes) + 1000);
    await askForLink(`nobody-${uniq()}@lab.test`, null);
    expect(await em.fork().count(SignInLinkRequest, { at: { $lt: new Date(clock.getTime() - minutes(LINK_LIMITS.windowMinutes)) } })).toBe(0);
  });
});
