import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { z } from 'zod';
import { Group, User } from '@/entities';
import { assertCan } from '@/lib/auth/permissions';
import { closeOrm, getEm } from '@/lib/db/orm';
import { AppError } from '@/lib/errors';
import { runAction } from '@/lib/http/action';
import { route } from '@/lib/http/route';
import { groupAccess } from '@/lib/services/access';
import { makeGroup, makeLab, request, routeArgs, sessionCookie, uniq } from './helpers';

let lab: Awaited<ReturnType<typeof makeLab>>;
let foreign: { id: string; slug: string; name: string };

beforeAll(async () => {
  lab = await makeLab('wrap');
  foreign = await makeGroup(await getEm(), 'wrap-foreign');
});
afterAll(closeOrm);

// A handler as a feature would write it: the group from the path, a role check, a JSON body.
const renameGroup = route(
  { params: z.object({ slug: z.string() }), body: z.object({ name: z.string().min(3) }) },
  async ({ em, caller, params, body }) => {
    const { group, role } = await groupAccess(em, caller, { slug: params.slug });
    assertCan(role, 'policy.edit');
    const g = await em.findOneOrFail(Group, { id: group.id });
    g.name = body.name;
    return { slug: g.slug, name: g.name };
  },
);

describe('route() wrapper', () => {
  it('passes parsed params and body, authenticates, and flushes', async () => {
    const name = `Renamed ${uniq()}`;
    const res = await renameGroup(
      request(`/x/${lab.group.slug}`, { method: 'POST', cookie: await sessionCookie(lab.admin), body: { name } }),
      routeArgs({ slug: lab.group.slug }),
    );
    expect(res.status).toBe(200);
    expect(await res.json()).toEqual({ slug: lab.group.slug, name });
    expect((await (await getEm()).findOneOrFail(Group, { id: lab.group.id })).name).toBe(name);
  });

  it('400 with field errors for a bad body', async () => {
    const res = await renameGroup(
      request(`/x/${lab.group.slug}`, { method: 'POST', cookie: await sessionCookie(lab.admin), body: { name: 'x' } }),
      routeArgs({ slug: lab.group.slug }),
    );
    expect(res.status).toBe(400);
    const body = await res.json();
    expect(body).toMatchObject({ error: { code: 'invalid_input', details: { fieldErrors: { name: [expect.any(String)] } } } });
  });

  it('401 without a session', async () => {
    const res = await renameGroup(request(`/x/${lab.group.slug}`, { method: 'POST', body: { name: 'abcd' } }), routeArgs({ slug: lab.group.slug }));
    expect(res.status).toBe(401);
    expect(res.headers.get('www-authenticate')).toBe('Bearer');
  });

  it('403 for a member whose role does not allow it, and nothing written', async () => {
    const res = await renameGroup(
      request(`/x/${lab.group.slug}`, { method: 'POST', cookie: await sessionCookie(lab.reviewer), body: { name: 'Hijacked name' } }),
      routeArgs({ slug: lab.group.slug }),
    );
    expect(res.status).toBe(403);
    expect((await res.json()).error.code).toBe('forbidden');
    expect((await (await getEm()).findOneOrFail(Group, { id: lab.group.id })).name).not.toBe('Hijacked name');
  });

  it("404 for another group's record, identical to a missing one", async () => {
    const cookie = await sessionCookie(lab.admin);
    const a = await renameGroup(request(`/x/${foreign.slug}`, { method: 'POST', cookie, body: { name: 'abcd' } }), routeArgs({ slug: foreign.slug }));
    const b = await renameGroup(request('/x/nope', { method: 'POST', cookie, body: { name: 'abcd' } }), routeArgs({ slug: 'nope' }));
    expect(a.status).toBe(404);
    expect(await a.json()).toEqual(await b.json());
  });

  it('500 hides the internal message and stack', async () => {
    const boom = route({ auth: 'none' }, async () => {
      throw new Error('password=hunter2 at /srv/secret/path.ts:12');
    });
    const errors: unknown[] = [];
    const original = console.error;
    console.error = (...args: unknown[]) => errors.push(args);
    try {
      const res = await boom(request('/boom'), routeArgs());
      expect(res.status).toBe(500);
      const text = await res.text();
      expect(text).not.toContain('hunter2');
      expect(text).not.toContain('/srv/secret');
      expect(JSON.parse(text)).toEqual({ error: { code: 'internal', message: expect.any(String) } });
    } finally {
      console.error = original;
    }
    expect(errors).toHaveLength(1); // the details go to the server log
  });

  it('maps each AppError code to its status', async () => {
    const cases = [['conflict', 409], ['too_large', 413], ['unparsable', 422]] as const;
    for (const [code, status] of cases) {
      const h = route({ auth: 'none' }, async () => {
        throw new AppError(code, `msg ${code}`, { line: 3, column: 7, expected: 'a number' });
      });
      const res = await h(request('/e'), routeArgs());
      expect(res.status).toBe(status);
      expect(await res.json()).toEqual({ error: { code, message: `msg ${code}`, details: { line: 3, column: 7, expected: 'a number' } } });
    }
  });
});

describe('runAction() (the server action core)', () => {
  const schema = z.object({ name: z.string().trim().min(2, 'Too short.'), age: z.coerce.number().int().min(0) });

  it('coerces FormData strings and runs the body', async () => {
    const fd = new FormData();
    fd.set('name', '  Ada ');
    fd.set('age', '36');
    const state = await runAction(schema, async (input) => ({ message: 'done', data: input }), null, fd);
    expect(state).toEqual({ ok: true, message: 'done', data: { name: 'Ada', age: 36 } });
  });

  it('returns field errors and never calls the body on bad input', async () => {
    const fd = new FormData();
    fd.set('name', 'A');
    fd.set('age', 'old');
    let called = false;
    const state = await runAction(schema, async () => {
      called = true;
    }, null, fd);
    expect(called).toBe(false);
    expect(state.ok).toBe(false);
    expect(Object.keys(state.fieldErrors ?? {}).sort()).toEqual(['age', 'name']);
  });

  it('nothing is written when the body fails after changing entities', async () => {
    const email = `ghost-${uniq()}@lab.test`;
    const state = await runAction(z.object({}), async (_input, { em }) => {
      em.create(User, { email, name: 'Ghost' });
      throw new AppError('conflict', 'Stopped on purpose.');
    }, null, new FormData());
    expect(state).toEqual({ ok: false, message: 'Stopped on purpose.' });
    expect(await (await getEm()).count(User, { email })).toBe(0);
  });

  it('passes service field errors through to the form', async () => {
    const state = await runAction(z.object({}), async () => {
      throw new AppError('invalid_input', 'The current password is not right.', { fieldErrors: { current: ['The current password is not right.'] } });
    }, null, new FormData());
    expect(state).toEqual({ ok: false, message: 'The current password is not right.', fieldErrors: { current: ['The current password is not right.'] } });
  });
});
