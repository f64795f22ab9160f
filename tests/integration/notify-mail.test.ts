/**
 * Notifications end to end: review services write events to the outbox, the queue fans them out
 * by the recipients' preferences and sends real SMTP to the fake started here on a free port
 * (the app's transport reaches it through SMTP_PORT), and the mail is read from the fake's folder.
 */
import { mkdtemp, rm } from 'node:fs/promises';
import os from 'node:os';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { Finding, NotificationDelivery, Spectrum } from '@/entities';
import { freePort } from '@/fakes/free-port';
import { startSmtpFake, type SmtpFake } from '@/fakes/smtp/server';
import { closeOrm, getEm } from '@/lib/db/orm';
import { stopBoss } from '@/lib/jobs/boss';
import { drainOutboxNow, runDigestNow, startNotifyWorker, stopNotifyWorker } from '@/lib/jobs/notify-queue';
import { listMessages, type StoredMessage } from '@/lib/mail/mailbox';
import { decide } from '@/lib/services/decisions';
import { updateNotificationPreferences } from '@/lib/services/notification-preferences';
import { updatePolicy } from '@/lib/services/policy';
import { sendDelivery } from '@/lib/services/notifications';
import { setReviewers } from '@/lib/services/reviewers';
import { openThread, replyToThread } from '@/lib/services/threads';
import { waiveFinding } from '@/lib/services/waivers';
import { addMember, makeLab, makeUser, sessionCaller, type TestUser } from './helpers';
import { model, screenedSpectrum } from './review-fixtures';

let dir: string;
let port: number;
let fake: SmtpFake | null = null;
let lab: Awaited<ReturnType<typeof makeLab>>;
let reviewer2: TestUser;

const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

async function mailTo(who: TestUser): Promise<StoredMessage[]> {
  return (await listMessages(dir)).filter((m) => m.to.some((t) => t.toLowerCase() === who.email.toLowerCase())).reverse();
}

/** Waits until `check` holds (mail arrives through the queue, so not at once). */
async function until<T>(what: string, fn: () => Promise<T>, check: (v: T) => boolean, ms = 20_000): Promise<T> {
  const end = Date.now() + ms;
  for (;;) {
    const v = await fn();
    if (check(v)) return v;
    if (Date.now() > end) throw new Error(`timed out waiting for ${what}: ${JSON.stringify(v).slice(0, 500)}`);
    await sleep(200);
  }
}

beforeAll(async () => {
  dir = await mkdtemp(path.join(os.tmpdir(), 'bw-notify-'));
  port = await freePort();
  // The app's transport reads SMTP_PORT on first use; point it at this file's fake.
  process.env.SMTP_PORT = String(port);
  process.env.SMTP_HOST = '127.0.0.1';
  delete (globalThis as { __branchwiseMail?: unknown }).__branchwiseMail;
  fake = await startSmtpFake({ port, dir, quiet: true });
  lab = await makeLab('notify');
  const em = await getEm();
  reviewer2 = await makeUser(em, 'reviewer');
  await addMember(em, reviewer2, lab.group, 'reviewer');
  // Only the send queue: this file drives the fan-out and the digest itself.
  await startNotifyWorker({ queues: ['send'], pollingIntervalSeconds: 0.5, drainEverySeconds: 0, schedule: false, digestCron: null, retryDelaySeconds: 1 });
});

afterAll(async () => {
  await stopNotifyWorker();
  await stopBoss();
  await fake?.close();
  await closeOrm();
  await rm(dir, { recursive: true, force: true });
});

describe('notifications by e-mail', () => {
  it('each event reaches the right people by their preferences, never the actor; digests collect the rest', async () => {
    const em = await getEm();
    // reviewer2 wants no review requests; the first reviewer wants thread traffic at once.
    await updateNotificationPreferences(em, reviewer2.id, { 'reviewer-assigned': 'off' });
    await updateNotificationPreferences(em, lab.reviewer.id, { thread: 'immediate' });

    const s = await screenedSpectrum(lab.group, lab.submitter);
    await setReviewers(await getEm(), sessionCaller(lab.admin), s.id, { reviewers: [lab.reviewer.id, reviewer2.id] });
    const handle = lab.submitter.email.split('@')[0];
    const t = await openThread(await getEm(), sessionCaller(lab.reviewer), s.id, {
      anchor: null,
      body: `@${handle} branch 3 <dips> below zero near Γ; is that a soft mode?`,
    });
    await replyToThread(await getEm(), sessionCaller(lab.submitter), t.id, { body: 'It is real: the invented structure is unstable there.' });
    await decide(await getEm(), sessionCaller(lab.reviewer), s.id, { verdict: 'approve', note: 'Soft mode kept on purpose.', revision: s.revisionId });

    const fanned = await drainOutboxNow({ groupId: lab.group.id });
    expect(fanned.events).toBeGreaterThanOrEqual(6);

    // Immediate mail: submitter: mention, the approving decision (one mail, not a second
    // "Approved"); reviewer: review request, reply; reviewer2: the decision; admin: approved.
    const expected = 6;
    await until('immediate mail', async () => (await listMessages(dir)).length, (n) => n >= expected);
    await sleep(1500); // nothing more should come
    const all = await listMessages(dir);
    expect(all).toHaveLength(expected);

    const subjects = async (who: TestUser) => (await mailTo(who)).map((m) => m.subject).sort();
    const title = (await em.findOneOrFail(NotificationDelivery, { spectrumId: s.id, user: lab.submitter.id, kind: 'mention' })).spectrumTitle;
    expect(await subjects(lab.submitter)).toEqual([`Approved: ${title}`, `${lab.reviewer.name} mentioned you on ${title}`].sort());
    expect(await subjects(lab.reviewer)).toEqual([`Reply on ${title}`, `Review requested: ${title}`].sort());
    expect(await subjects(reviewer2)).toEqual([`Approved: ${title}`]);
    expect(await subjects(lab.admin)).toEqual([`Approved: ${title}`]);
    // The submitter's one mail is the decision, with its note, and says the spectrum is approved.
    const approvedMail = (await mailTo(lab.submitter)).find((m) => m.subject.startsWith('Approved:'))!;
    expect(approvedMail.text).toContain(`${lab.reviewer.name} approved revision 1 of “${title}”. With that it is approved`);
    expect(approvedMail.text).toContain('> Soft mode kept on purpose.');
    // The admin, whom decisions do not reach, gets the approval itself.
    expect((await mailTo(lab.admin))[0]!.text).toContain('is approved under the group');
    expect(await mailTo(lab.observer)).toEqual([]);

    const mention = (await mailTo(lab.submitter)).find((m) => m.subject.includes('mentioned you'))!;
    expect(mention.text).toContain(`/groups/${lab.group.slug}/spectra/${s.id}`);
    expect(mention.text).toContain('branch 3 <dips> below zero');
    expect(mention.html).toContain('branch 3 &lt;dips&gt; below zero');

    // Digest: only in the digest run, one mail per person with all their items.
    const people = [lab.admin, lab.reviewer, reviewer2, lab.submitter, lab.observer].map((p) => p.id);
    const digest = await runDigestNow({ userIds: people });
    expect(digest).toEqual({ mails: 1, items: 2, failed: 0 });
    const digests = (await mailTo(reviewer2)).filter((m) => m.subject.startsWith('Your Branchwise digest'));
    expect(digests).toHaveLength(1);
    expect(digests[0]!.subject).toBe('Your Branchwise digest: 2 updates on 1 spectrum');
    expect(digests[0]!.text).toContain(`${lab.reviewer.name} opened a thread on “${title}”.`);
    expect(digests[0]!.text).toContain(`${lab.submitter.name} replied in a thread on “${title}”.`);
    // "off" means never, not even in the digest.
    expect(digests[0]!.text).not.toContain('asked you to review');
    // A second run has nothing left to send.
    expect(await runDigestNow({ userIds: people })).toEqual({ mails: 0, items: 0, failed: 0 });
    expect(await listMessages(dir)).toHaveLength(expected + 1);
  });

  it('one decision, one mail per person; an approval that leaves the spectrum in review says what it waits on', async () => {
    const em = await getEm();
    await updatePolicy(em, sessionCaller(lab.admin), lab.group.slug, { requiredApprovals: 2 });
    try {
      const mailsOn = async (who: TestUser, title: string) => (await mailTo(who)).filter((m) => m.subject.includes(title));
      const settle = async (title: string, n: number) => {
        await drainOutboxNow({ groupId: lab.group.id });
        const people = [lab.submitter, lab.reviewer, reviewer2, lab.admin, lab.observer];
        const count = async () => (await Promise.all(people.map((p) => mailsOn(p, title)))).flat().length;
        await until(`${n} mails on ${title}`, count, (c) => c >= n);
        await sleep(1500); // nothing more should come
        expect(await count()).toBe(n);
      };

      // A rejection: the submitter and the other reviewer get the decision only.
      const r = await screenedSpectrum(lab.group, lab.submitter);
      await setReviewers(await getEm(), sessionCaller(lab.admin), r.id, { reviewers: [lab.reviewer.id, reviewer2.id] });
      const rTitle = (await em.fork().findOneOrFail(Spectrum, { id: r.id })).title;
      // The review request to the first reviewer (the second turned those off).
      const rBefore = 1;
      await settle(rTitle, rBefore);
      await decide(await getEm(), sessionCaller(lab.reviewer), r.id, { verdict: 'reject', note: 'The structure is not the one named.', revision: r.revisionId });
      await settle(rTitle, rBefore + 2);
      const rejected = await mailsOn(lab.submitter, rTitle);
      expect(rejected.map((m) => m.subject)).toEqual([`Rejected: ${rTitle}`]);
      expect(rejected[0]!.text).toContain('> The structure is not the one named.');
      expect((await mailsOn(reviewer2, rTitle)).map((m) => m.subject)).toEqual([`Rejected: ${rTitle}`]);
      expect(await mailsOn(lab.admin, rTitle)).toEqual([]);

      // Approvals that do not complete the rule: the mail says the spectrum waits, and on what.
      const a = await screenedSpectrum(lab.group, lab.submitter, model({ defect: 'soft-mode' }));
      const fail = await em.fork().find(Finding, { revision: a.revisionId, severity: 'fail' });
      expect(fail.length).toBeGreaterThan(0);
      await setReviewers(await getEm(), sessionCaller(lab.admin), a.id, { reviewers: [lab.reviewer.id, reviewer2.id] });
      const aTitle = (await em.fork().findOneOrFail(Spectrum, { id: a.id })).title;
      // The review request to the first reviewer (the second turned those off).
      const aBefore = 1;
      await settle(aTitle, aBefore);
      await decide(await getEm(), sessionCaller(lab.reviewer), a.id, { verdict: 'approve', note: 'Fine by me.', revision: a.revisionId });
      await settle(aTitle, aBefore + 2);
      const first = await mailsOn(lab.submitter, aTitle);
      expect(first.map((m) => m.subject)).toEqual([`Decision on ${aTitle}: approved, still in review`]);
      expect(first[0]!.text).toContain(`${lab.reviewer.name} approved revision 1 of “${aTitle}”. It stays in review, waiting for 2 approvals (1 of 2 so far)`);
      expect(first[0]!.text).toMatch(/unwaived blocking findings? to be fixed or waived/);
      expect(first[0]!.text).not.toContain('can be exported');

      await decide(await getEm(), sessionCaller(reviewer2), a.id, { verdict: 'approve', note: 'Agreed.', revision: a.revisionId });
      await settle(aTitle, aBefore + 4);
      const second = (await mailsOn(lab.submitter, aTitle)).find((m) => m.text.includes('Agreed.'))!;
      expect(second.subject).toBe(`Decision on ${aTitle}: approved, still in review`);
      expect(second.text).not.toContain('approvals (');
      expect(second.text).toMatch(/waiting for an? .*unwaived blocking findings? to be fixed or waived\./);
      expect(await mailsOn(lab.admin, aTitle)).toEqual([]);

      // The last blocking finding waived: the approval comes from the waiver, with no decision
      // mail, so everyone but the actor gets "Approved".
      for (const f of fail) await waiveFinding(await getEm(), sessionCaller(lab.reviewer), f.id, { reason: 'The soft mode is physical here.' });
      expect((await em.fork().findOneOrFail(Spectrum, { id: a.id })).status).toBe('approved');
      await settle(aTitle, aBefore + 4 + 3);
      for (const who of [lab.submitter, reviewer2, lab.admin]) {
        expect((await mailsOn(who, aTitle)).filter((m) => m.subject === `Approved: ${aTitle}`)).toHaveLength(1);
      }
      expect((await mailsOn(lab.reviewer, aTitle)).filter((m) => m.subject.startsWith('Approved'))).toEqual([]);
    } finally {
      await updatePolicy(await getEm(), sessionCaller(lab.admin), lab.group.slug, { requiredApprovals: 1 });
    }
  });

  it('nothing is sent twice: a repeated fan-out adds no deliveries and a sent one is not sent again', async () => {
    const s = await screenedSpectrum(lab.group, lab.submitter);
    await setReviewers(await getEm(), sessionCaller(lab.admin), s.id, { reviewers: [lab.reviewer.id] });
    const first = await drainOutboxNow({ groupId: lab.group.id });
    expect(first.immediate).toHaveLength(1);
    const [id] = first.immediate;
    const em = await getEm();
    await until('the delivery sent', () => em.fork().findOneOrFail(NotificationDelivery, { id }), (d) => d.status === 'sent');

    // Replay the event as if a worker died before marking it: the unique key keeps one delivery.
    const delivery = await em.fork().findOneOrFail(NotificationDelivery, { id });
    await em.execute('update outbox set processed_at = null where id = ?', [delivery.eventId]);
    const again = await drainOutboxNow({ groupId: lab.group.id });
    expect(again.events).toBe(1);
    expect(again.deliveries).toBe(0);
    expect(await sendDelivery(id)).toBe('already-sent');
    await sleep(1000);
    const requests = (await mailTo(lab.reviewer)).filter((m) => m.subject === `Review requested: ${delivery.spectrumTitle}`);
    expect(requests).toHaveLength(1);
  });

  it('a mail server that is down delays the mail; after a retry it arrives exactly once', async () => {
    await fake!.close();
    fake = null;
    const s = await screenedSpectrum(lab.group, lab.submitter);
    await setReviewers(await getEm(), sessionCaller(lab.admin), s.id, { reviewers: [reviewer2.id] });
    await updateNotificationPreferences(await getEm(), reviewer2.id, { 'reviewer-assigned': 'immediate' });
    // The event was fanned out after the preference changed back, so reviewer2 gets it.
    const r = await drainOutboxNow({ groupId: lab.group.id });
    expect(r.immediate).toHaveLength(1);
    const id = r.immediate[0]!;
    const em = await getEm();
    const failed = await until('a failed attempt', () => em.fork().findOneOrFail(NotificationDelivery, { id }), (d) => d.attempts >= 1);
    expect(failed.status).toBe('pending');
    expect(failed.lastError).toMatch(/ECONNREFUSED|connect/i);

    fake = await startSmtpFake({ port, dir, quiet: true });
    const sent = await until('the retried delivery', () => em.fork().findOneOrFail(NotificationDelivery, { id }), (d) => d.status === 'sent', 30_000);
    expect(sent.attempts).toBeGreaterThanOrEqual(2);
    await sleep(2500); // a late duplicate would show up here
    const mails = (await mailTo(reviewer2)).filter((m) => m.subject === `Review requested: ${sent.spectrumTitle}`);
    expect(mails).toHaveLength(1);
  });

  it('the worker drains the outbox on its own: an event becomes mail without anyone calling the fan-out', async () => {
    await stopNotifyWorker();
    // Earlier test files (run before this one, never beside it) leave their own events in the
    // shared outbox; a worker that drains everything would first mail all of those, and under a
    // loaded CI machine that backlog outlasts any sensible wait. Set them aside: this test is about
    // the worker picking up an event by itself, not about throughput.
    await (await getEm())
      .getConnection()
      .execute('update outbox set processed_at = now() where processed_at is null and (group_id is null or group_id <> ?)', [lab.group.id]);
    await startNotifyWorker({ queues: ['send', 'drain'], pollingIntervalSeconds: 0.5, drainEverySeconds: 1, schedule: false, digestCron: null, retryDelaySeconds: 1 });
    const s = await screenedSpectrum(lab.group, lab.submitter);
    await setReviewers(await getEm(), sessionCaller(lab.admin), s.id, { reviewers: [lab.reviewer.id] });
    const em = await getEm();
    const delivery = await until(
      'the worker to send the review request',
      () => em.fork().findOne(NotificationDelivery, { spectrumId: s.id, user: lab.reviewer.id }),
      (d) => d?.status === 'sent',
      60_000,
    );
    const mails = (await mailTo(lab.reviewer)).filter((m) => m.subject === `Review requested: ${delivery!.spectrumTitle}`);
    expect(mails).toHaveLength(1);
    expect(mails[0]!.text).toContain(`/groups/${lab.group.slug}/spectra/${s.id}`);
  });
});
