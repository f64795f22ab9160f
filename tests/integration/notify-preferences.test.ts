/** The caller's notification settings through the API and the account page's server action. */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import * as prefs from '@/app/api/v1/account/notifications/route';
import { notificationPreferencesSchema } from '@/app/(board)/account/notification-schema';
import { closeOrm, getEm } from '@/lib/db/orm';
import { runAction } from '@/lib/http/action';
import { defaultModes, notificationKinds } from '@/lib/notifications';
import { createApiToken } from '@/lib/services/api-tokens';
import { getNotificationPreferences, updateNotificationPreferences } from '@/lib/services/notification-preferences';
import { makeLab, request, routeArgs, sessionCaller, sessionCookie } from './helpers';

let lab: Awaited<ReturnType<typeof makeLab>>;
beforeAll(async () => {
  lab = await makeLab('prefs');
});
afterAll(closeOrm);

async function call(handler: typeof prefs.GET, opts: { cookie?: string; bearer?: string; method?: string; body?: unknown; rawBody?: string }) {
  const res = await handler(request('/api/v1/account/notifications', opts), routeArgs());
  const text = await res.text();
  return { status: res.status, body: text ? JSON.parse(text) : null };
}

describe('notification preferences', () => {
  it('GET gives every kind with the defaults; PUT changes only the kinds sent', async () => {
    const cookie = await sessionCookie(lab.reviewer);
    const before = await call(prefs.GET, { cookie });
    expect(before.status).toBe(200);
    expect(before.body.items.map((i: { kind: string }) => i.kind)).toEqual([...notificationKinds]);
    for (const i of before.body.items) expect(i).toMatchObject({ mode: defaultModes[i.kind as keyof typeof defaultModes], chosen: false });

    const put = await call(prefs.PUT, { cookie, method: 'PUT', body: { mention: 'digest', thread: 'off' } });
    expect(put.status).toBe(200);
    const modes = Object.fromEntries(put.body.items.map((i: { kind: string; mode: string }) => [i.kind, i.mode]));
    expect(modes).toEqual({ ...defaultModes, mention: 'digest', thread: 'off' });

    await call(prefs.PUT, { cookie, method: 'PUT', body: { mention: 'immediate' } });
    const after = await getNotificationPreferences(await getEm(), lab.reviewer.id);
    expect(after.items.find((i) => i.kind === 'mention')).toMatchObject({ mode: 'immediate', chosen: true });
    expect(after.items.find((i) => i.kind === 'thread')).toMatchObject({ mode: 'off', chosen: true });
  });

  it('refuses an unknown kind or mode with 400 and changes nothing', async () => {
    const cookie = await sessionCookie(lab.observer);
    const bad = await call(prefs.PUT, { cookie, method: 'PUT', body: { mention: 'sometimes', decision: 'off' } });
    expect(bad.status).toBe(400);
    expect(JSON.stringify(bad.body.error)).toContain('mention');
    expect((await call(prefs.PUT, { cookie, method: 'PUT', body: { 'weekly-news': 'off' } })).status).toBe(400);
    const now = await getNotificationPreferences(await getEm(), lab.observer.id);
    expect(now.items.every((i) => !i.chosen)).toBe(true);
  });

  it('401 signed out; 403 with an API token (sessions only)', async () => {
    expect((await call(prefs.GET, {})).status).toBe(401);
    const { token } = await createApiToken(await getEm(), sessionCaller(lab.submitter), { group: lab.group.slug, name: 'script' });
    expect((await call(prefs.GET, { bearer: token })).status).toBe(403);
    expect((await call(prefs.PUT, { bearer: token, method: 'PUT', body: { mention: 'off' } })).status).toBe(403);
  });

  it('the account form: one field per kind, checked like the API', async () => {
    const fd = new FormData();
    fd.set('decision', 'digest');
    fd.set('outcome', 'off');
    const ok = await runAction(notificationPreferencesSchema, async (input, { em, user }) => ({ data: await updateNotificationPreferences(em, user!.id, input) }), lab.admin, fd);
    expect(ok.ok).toBe(true);
    expect(ok.data!.items.find((i) => i.kind === 'outcome')!.mode).toBe('off');
    const bad = new FormData();
    bad.set('decision', 'loud');
    const refused = await runAction(notificationPreferencesSchema, async () => undefined, lab.admin, bad);
    expect(refused.ok).toBe(false);
    expect(Object.keys(refused.fieldErrors ?? {})).toContain('decision');
  });
});
