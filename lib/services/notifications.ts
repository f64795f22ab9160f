/**
 * From the outbox to people's inboxes. Three steps, each safe to repeat:
 * 1. fan-out: each unprocessed outbox event becomes one delivery row per recipient (unique per
 *    event and person, so a repeated fan-out adds nothing), with the text fixed then; the event is
 *    marked processed in the same transaction;
 * 2. an immediate delivery is sent under its row lock and marked `sent` right after the SMTP server
 *    accepts it: a failure leaves it pending for the queue's next retry, a second job finds it sent;
 * 3. the daily digest sends each person one mail with all their pending digest deliveries.
 * The job queue (lib/jobs/notify-queue.ts) decides when; this file decides what.
 */
import { randomUUID } from 'node:crypto';
import { Decision, Group, Membership, Reply, Revision, Spectrum, Thread, User } from '@/entities';
import { env } from '@/lib/config/env';
import type { Em } from '@/lib/db/orm';
import { getEm } from '@/lib/db/orm';
import { sendMail, type OutgoingMail } from '@/lib/mail/transport';
import {
  describeEvent,
  isNotificationKind,
  recipientsFor,
  renderDigest,
  renderImmediate,
  resolveModeFor,
  type AudienceContext,
  type DigestEntry,
  type MessageContext,
} from '@/lib/notifications';
import type { ReviewDomainEvent } from '@/lib/review/events';
import { storedPreferences } from './notification-preferences';

export type SendFn = (mail: OutgoingMail) => Promise<void>;

/** An event that keeps failing to fan out (a bug, not an outage) stops being retried after this. */
export const MAX_FANOUT_ATTEMPTS = 5;

interface ClaimedEvent {
  id: string;
  event: ReviewDomainEvent;
  attempts: number;
  createdAt: Date;
}

export interface FanOutResult {
  events: number;
  deliveries: number;
  /** Immediate deliveries made by this run, to be sent by the queue. */
  immediate: string[];
}

function personName(u: { name?: string | null; email: string } | null | undefined): string | null {
  return u ? (u.name?.trim() || u.email) : null;
}

async function mentionedIn(tx: Em, threadId: string, replyId: string | null): Promise<string[]> {
  const rows = await tx.execute<{ ids: string[] | null }[]>(
    `select payload->'mentionedIds' as ids from outbox where type = 'mention' and payload->>'threadId' = ? and coalesce(payload->>'replyId', '') = ?`,
    [threadId, replyId ?? ''],
  );
  return rows.flatMap((r) => r.ids ?? []);
}

/** The facts about an event that the rules and the text need; null when its spectrum is gone. */
async function loadContext(tx: Em, event: ReviewDomainEvent): Promise<{ audience: AudienceContext; message: MessageContext } | null> {
  const spectrum = await tx.findOne(Spectrum, { id: event.spectrumId });
  if (!spectrum) return null;
  const group = await tx.findOneOrFail(Group, { id: spectrum.group.id });
  const members = await tx.find(Membership, { group: group.id });
  const audience: AudienceContext = {
    submitterId: spectrum.submitter?.id ?? null,
    reviewerIds: spectrum.reviewerIds ?? [],
    adminIds: members.filter((m) => m.role === 'admin').map((m) => m.user.id),
    memberIds: new Set(members.map((m) => m.user.id)),
  };
  const actor = event.actorId ? await tx.findOne(User, { id: event.actorId }) : null;
  const message: MessageContext = {
    appUrl: env().APP_URL,
    group: { slug: group.slug, name: group.name },
    spectrum: { id: spectrum.id, title: spectrum.title, material: spectrum.material },
    actorName: event.actorId ? (personName(actor) ?? 'A former member') : null,
  };

  if ('threadId' in event) {
    const thread = await tx.findOne(Thread, { id: event.threadId });
    if (thread) {
      message.thread = { body: thread.body, blocking: thread.blocking };
      const replies = await tx.find(Reply, { thread: thread.id }, { fields: ['author'] });
      audience.threadParticipantIds = [thread.author?.id, ...replies.map((r) => r.author?.id)].filter((x): x is string => !!x);
    }
  }
  if ('replyId' in event && event.replyId) {
    const reply = await tx.findOne(Reply, { id: event.replyId });
    if (reply) message.reply = { body: reply.body };
  }
  if (event.type === 'thread.opened') audience.mentionedIds = await mentionedIn(tx, event.threadId, null);
  if (event.type === 'thread.replied') audience.mentionedIds = await mentionedIn(tx, event.threadId, event.replyId);
  if (event.type === 'revision.created') {
    const revision = await tx.findOne(Revision, { id: event.revisionId });
    message.revision = { number: event.number, note: revision?.note ?? null };
    const decisions = await tx.find(Decision, { spectrum: spectrum.id }, { fields: ['reviewer'] });
    audience.deciderIds = decisions.map((d) => d.reviewer?.id).filter((x): x is string => !!x);
  }
  if (event.type === 'decision.made') {
    const decision = await tx.findOne(Decision, { id: event.decisionId }, { populate: ['revision'] });
    message.decision = { verdict: event.verdict, note: decision?.note ?? '', revisionNumber: decision?.revision.number ?? null };
  }
  return { audience, message };
}

async function fanOutOne(tx: Em, claimed: ClaimedEvent): Promise<{ deliveries: number; immediate: string[] }> {
  const { event } = claimed;
  const ctx = await loadContext(tx, event);
  if (!ctx) return { deliveries: 0, immediate: [] };
  const recipients = recipientsFor(event, ctx.audience);
  if (!recipients.length) return { deliveries: 0, immediate: [] };
  const ids = recipients.map((r) => r.userId);
  const [prefs, users] = await Promise.all([storedPreferences(tx, ids), tx.find(User, { id: { $in: ids } })]);
  const known = new Set(users.map((u) => u.id));
  const item = describeEvent(event, ctx.message);
  let deliveries = 0;
  const immediate: string[] = [];
  for (const r of recipients) {
    if (!known.has(r.userId)) continue;
    const mode = resolveModeFor(prefs.get(r.userId), r.kind, r.alsoKind);
    if (mode === 'off') continue;
    const rows = await tx.execute<{ id: string }[]>(
      `insert into notification_delivery
         (id, event_id, user_id, group_id, spectrum_id, spectrum_title, kind, mode, subject, summary, detail, link, status, attempts, occurred_at, created_at)
       values (?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, 'pending', 0, ?, now())
       on conflict (event_id, user_id) do nothing
       returning id`,
      [randomUUID(), claimed.id, r.userId, event.groupId, event.spectrumId, ctx.message.spectrum.title.slice(0, 200), r.kind, mode,
        item.subject, item.summary, item.detail, item.link, claimed.createdAt],
    );
    if (rows.length) {
      deliveries++;
      if (mode === 'immediate') immediate.push(rows[0]!.id);
    }
  }
  return { deliveries, immediate };
}

/**
 * Fans out up to `limit` unprocessed outbox events, oldest first. Rows are locked with SKIP LOCKED,
 * so two workers never take the same event. `groupId` limits the run to one group (tests).
 */
export async function fanOutOutbox(opts: { groupId?: string; limit?: number } = {}): Promise<FanOutResult> {
  const em = await getEm();
  return em.transactional(async (tx) => {
    const params: unknown[] = [];
    let where = 'processed_at is null';
    if (opts.groupId) {
      where += ' and group_id = ?';
      params.push(opts.groupId);
    }
    params.push(opts.limit ?? 50);
    const rows = await tx.execute<{ id: string; payload: ReviewDomainEvent; attempts: number; created_at: Date }[]>(
      `select id, payload, attempts, created_at from outbox where ${where} order by created_at, id limit ? for update skip locked`,
      params,
    );
    const result: FanOutResult = { events: rows.length, deliveries: 0, immediate: [] };
    for (const row of rows) {
      const claimed: ClaimedEvent = { id: row.id, event: row.payload, attempts: row.attempts, createdAt: new Date(row.created_at) };
      try {
        // A savepoint: one bad event rolls back only its own rows.
        const one = await tx.transactional((inner) => fanOutOne(inner, claimed));
        result.deliveries += one.deliveries;
        result.immediate.push(...one.immediate);
        await tx.execute('update outbox set processed_at = now() where id = ?', [row.id]);
      } catch (e) {
        const message = e instanceof Error ? e.message : String(e);
        console.error(`[branchwise] notifications: event ${row.id} (${row.payload?.type}) failed to fan out:`, e);
        const giveUp = row.attempts + 1 >= MAX_FANOUT_ATTEMPTS;
        await tx.execute(
          `update outbox set attempts = attempts + 1, last_error = ?${giveUp ? ', processed_at = now()' : ''} where id = ?`,
          [message.slice(0, 2000), row.id],
        );
      }
    }
    return result;
  });
}

interface DeliveryRow {
  id: string;
  kind: string;
  mode: 'immediate' | 'digest';
  status: 'pending' | 'sent';
  subject: string;
  summary: string;
  detail: string | null;
  link: string;
  spectrum_id: string;
  spectrum_title: string;
  occurred_at: Date;
  email: string;
  name: string | null;
}

const deliverySelect = `select d.id, d.kind, d.mode, d.status, d.subject, d.summary, d.detail, d.link, d.spectrum_id, d.spectrum_title,
  d.occurred_at, u.email, u.name from notification_delivery d join app_user u on u.id = d.user_id`;

export type SendOutcome = 'sent' | 'already-sent' | 'missing';

/**
 * Sends one immediate delivery. The row stays locked while the SMTP server takes the message,
 * so a second job for it waits and then finds it sent. A failure is recorded and thrown (the
 * queue retries with backoff); the delivery stays pending, so nothing is lost.
 */
export async function sendDelivery(deliveryId: string, send: SendFn = sendMail): Promise<SendOutcome> {
  const em = await getEm();
  let failure: unknown = null;
  const outcome = await em.transactional(async (tx): Promise<SendOutcome> => {
    const [row] = await tx.execute<DeliveryRow[]>(`${deliverySelect} where d.id = ? for update of d`, [deliveryId]);
    if (!row) return 'missing';
    if (row.status === 'sent') return 'already-sent';
    const kind = isNotificationKind(row.kind) ? row.kind : 'thread';
    const mail = renderImmediate(
      { subject: row.subject, summary: row.summary, detail: row.detail, link: row.link },
      { email: row.email, name: row.name },
      kind,
      env().APP_URL,
    );
    try {
      await send(mail);
    } catch (e) {
      failure = e;
      await tx.execute(
        'update notification_delivery set attempts = attempts + 1, last_error = ?, last_attempt_at = now() where id = ?',
        [(e instanceof Error ? e.message : String(e)).slice(0, 2000), deliveryId],
      );
      return 'missing';
    }
    await tx.execute(
      `update notification_delivery set status = 'sent', sent_at = now(), attempts = attempts + 1, last_error = null, last_attempt_at = now() where id = ?`,
      [deliveryId],
    );
    return 'sent';
  });
  if (failure) throw failure;
  return outcome;
}

/**
 * Immediate deliveries still pending whose last try is older than `quietMs` (or that were never
 * tried and are older than that): their job was lost or gave up; the queue sends them again.
 */
export async function stalledImmediateDeliveries(quietMs: number, limit = 500): Promise<string[]> {
  const em = await getEm();
  const rows = await em.execute<{ id: string }[]>(
    `select id from notification_delivery
      where status = 'pending' and mode = 'immediate'
        and coalesce(last_attempt_at, created_at) < now() - (? * interval '1 millisecond')
      order by created_at limit ?`,
    [quietMs, limit],
  );
  return rows.map((r) => r.id);
}

export interface DigestResult {
  /** Digest mails sent (one per person). */
  mails: number;
  /** Deliveries they carried. */
  items: number;
  /** People whose digest could not be sent this time (kept for the next run). */
  failed: number;
}

/**
 * Sends every person with pending digest deliveries one mail holding all of them, and marks them
 * sent. Rows are locked while sending, so two runs at once never send the same items twice.
 * `userIds` limits the run (tests).
 */
export async function runDigest(opts: { userIds?: string[]; send?: SendFn } = {}): Promise<DigestResult> {
  const send = opts.send ?? sendMail;
  const em = await getEm();
  const params: unknown[] = [];
  let filter = '';
  if (opts.userIds) {
    if (!opts.userIds.length) return { mails: 0, items: 0, failed: 0 };
    filter = ` and user_id in (${opts.userIds.map(() => '?').join(',')})`;
    params.push(...opts.userIds);
  }
  const people = await em.execute<{ user_id: string }[]>(
    `select distinct user_id from notification_delivery where status = 'pending' and mode = 'digest'${filter}`,
    params,
  );
  const result: DigestResult = { mails: 0, items: 0, failed: 0 };
  for (const { user_id: userId } of people) {
    const fork = em.fork();
    let failed = false;
    const items = await fork.transactional(async (tx) => {
      const rows = await tx.execute<DeliveryRow[]>(
        `${deliverySelect} where d.user_id = ? and d.status = 'pending' and d.mode = 'digest' order by d.occurred_at, d.id for update of d skip locked`,
        [userId],
      );
      if (!rows.length) return 0;
      const entries: DigestEntry[] = rows.map((r) => ({
        item: { subject: r.subject, summary: r.summary, detail: r.detail, link: r.link },
        kind: isNotificationKind(r.kind) ? r.kind : 'thread',
        at: new Date(r.occurred_at),
        spectrum: { id: r.spectrum_id, title: r.spectrum_title },
      }));
      const ids = rows.map((r) => r.id);
      const marks = ids.map(() => '?').join(',');
      try {
        await send(renderDigest(entries, { email: rows[0]!.email, name: rows[0]!.name }, env().APP_URL));
      } catch (e) {
        failed = true;
        console.error(`[branchwise] notifications: digest for ${userId} not sent:`, e);
        await tx.execute(
          `update notification_delivery set attempts = attempts + 1, last_error = ?, last_attempt_at = now() where id in (${marks})`,
          [(e instanceof Error ? e.message : String(e)).slice(0, 2000), ...ids],
        );
        return 0;
      }
      await tx.execute(
        `update notification_delivery set status = 'sent', sent_at = now(), attempts = attempts + 1, last_error = null, last_attempt_at = now() where id in (${marks})`,
        ids,
      );
      return rows.length;
    });
    if (failed) result.failed++;
    else if (items) {
      result.mails++;
      result.items += items;
    }
  }
  return result;
}
