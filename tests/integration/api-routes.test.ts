import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { ApiToken } from '@/entities';
import { GET as health } from '@/app/api/health/route';
import { GET as listGroups } from '@/app/api/v1/groups/route';
import { POST as createToken } from '@/app/api/v1/tokens/route';
import { sha256Hex } from '@/lib/auth/secret-token';
import { closeOrm, getEm } from '@/lib/db/orm';
import { addMember, makeGroup, makeLab, request, routeArgs, sessionCookie } from './helpers';

let lab: Awaited<ReturnType<typeof makeLab>>;
let other: { id: string; slug: string; name: string };

beforeAll(async () => {
  lab = await makeLab('api');
  const em = await getEm();
  other = await makeGroup(em, 'api-other');
  await addMember(em, lab.reviewer, other, 'observer');
});
afterAll(closeOrm);

describe('GET /api/health', () => {
  it('answers ok with the database up, without signing in', async () => {
    const res = await health(request('/api/health'), routeArgs());
    expect(res.status).toBe(200);
    expect(await res.json()).toEqual({ ok: true, db: 'up' });
  });
});

describe('GET /api/v1/groups', () => {
  it('401 with the one error shape when signed out', async () => {
    const res = await listGroups(request('/api/v1/groups'), routeArgs());
    expect(res.status).toBe(401);
    const body = await res.json();
    expect(body.error.code).toBe('unauthenticated');
    expect(typeof body.error.message).toBe('string');
  });

  it('401 for a forged session cookie', async () => {
    const res = await listGroups(request('/api/v1/groups', { cookie: 'next-auth.session-token=not-a-jwt' }), routeArgs());
    expect(res.status).toBe(401);
  });

  it("lists the session's groups with the role in each", async () => {
    const res = await listGroups(request('/api/v1/groups', { cookie: await sessionCookie(lab.reviewer) }), routeArgs());
    expect(res.status).toBe(200);
    const { items } = await res.json();
    expect(items).toEqual(
      expect.arrayContaining([
        { slug: lab.group.slug, name: lab.group.name, role: 'reviewer', members: 4 },
        { slug: other.slug, name: other.name, role: 'observer', members: 1 },
      ]),
    );
    expect(items).toHaveLength(2);
  });

  it("a token sees only its own group", async () => {
    const created = await createToken(
      request('/api/v1/tokens', { method: 'POST', cookie: await sessionCookie(lab.reviewer), body: { group: other.slug, name: 'cluster' } }),
      routeArgs(),
    );
    const { token } = await created.json();
    const res = await listGroups(request('/api/v1/groups', { bearer: token }), routeArgs());
    expect(res.status).toBe(200);
    expect((await res.json()).items.map((g: { slug: string }) => g.slug)).toEqual([other.slug]);
  });
});

describe('POST /api/v1/tokens', () => {
  it('201 with id and token; the token is stored only as its sha256', async () => {
    const res = await createToken(
      request('/api/v1/tokens', { method: 'POST', cookie: await sessionCookie(lab.submitter), body: { group: lab.group.slug, name: 'laptop' } }),
      routeArgs(),
    );
    expect(res.status).toBe(201);
    const body = await res.json();
    expect(Object.keys(body).sort()).toEqual(['id', 'token']);
    expect(body.token).toMatch(/^bw_[A-Za-z0-9_-]{43}$/);
    const em = await getEm();
    const row = await em.findOneOrFail(ApiToken, { id: body.id });
    expect(row.hash).toBe(sha256Hex(body.token));
    expect(JSON.stringify(await em.getConnection().execute('select * from api_token where id = ?', [body.id]))).not.toContain(body.token);
  });

  it('400 with field errors, and nothing written', async () => {
    const em = await getEm();
    const before = await em.count(ApiToken, { user: lab.submitter.id });
    const res = await createToken(
      request('/api/v1/tokens', { method: 'POST', cookie: await sessionCookie(lab.submitter), body: { group: 'Not A Slug!', name: '' } }),
      routeArgs(),
    );
    expect(res.status).toBe(400);
    const body = await res.json();
    expect(body.error.code).toBe('invalid_input');
    expect(Object.keys(body.error.details.fieldErrors).sort()).toEqual(['group', 'name']);
    expect(await em.fork().count(ApiToken, { user: lab.submitter.id })).toBe(before);
  });

  it('400 for a body that is not JSON', async () => {
    const res = await createToken(
      request('/api/v1/tokens', { method: 'POST', cookie: await sessionCookie(lab.submitter), rawBody: '{"group":' }),
      routeArgs(),
    );
    expect(res.status).toBe(400);
    expect((await res.json()).error.message).toMatch(/not valid JSON/);
  });

  it('404 for a group the person is not in (same as a group that does not exist)', async () => {
    const cookie = await sessionCookie(lab.submitter);
    const inOther = await createToken(request('/api/v1/tokens', { method: 'POST', cookie, body: { group: other.slug, name: 'x' } }), routeArgs());
    const absent = await createToken(request('/api/v1/tokens', { method: 'POST', cookie, body: { group: 'no-such-group-zz', name: 'x' } }), routeArgs());
    expect(inOther.status).toBe(404);
    expect(absent.status).toBe(404);
    expect(await inOther.json()).toEqual(await absent.json());
  });

  it('403 when an API token tries to create a token (session only)', async () => {
    const first = await createToken(
      request('/api/v1/tokens', { method: 'POST', cookie: await sessionCookie(lab.admin), body: { group: lab.group.slug, name: 'ci' } }),
      routeArgs(),
    );
    const { token } = await first.json();
    const res = await createToken(
      request('/api/v1/tokens', { method: 'POST', bearer: token, body: { group: lab.group.slug, name: 'again' } }),
      routeArgs(),
    );
    expect(res.status).toBe(403);
  });
});
