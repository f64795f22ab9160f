/**
 * Mail text for notifications, plain text with a simple HTML twin. An event becomes an item
 * (subject, one-line summary, optional quoted detail, link); one item makes an immediate mail,
 * a person's pending items make their daily digest. Everything user-written is escaped.
 */
import type { OutgoingMail } from '@/lib/mail/transport';
import type { DecisionOutcome, DecisionVerdict, ReviewDomainEvent } from '@/lib/review/events';
import { kindDescriptions, modeLabels, type NotificationKind } from './kinds';

export interface MessageContext {
  appUrl: string;
  group: { slug: string; name: string };
  spectrum: { id: string; title: string; material: string };
  /** Null when the application itself acted (automatic approval). */
  actorName: string | null;
  revision?: { number: number; note: string | null };
  thread?: { body: string; blocking: boolean };
  reply?: { body: string };
  decision?: { verdict: DecisionVerdict; note: string; revisionNumber: number | null };
}

export interface NotificationItem {
  subject: string;
  summary: string;
  detail: string | null;
  link: string;
}

export interface MailRecipient {
  email: string;
  name: string | null;
}

const EXCERPT = 400;

export function excerpt(text: string, max = EXCERPT): string {
  const flat = text.replace(/\s+/g, ' ').trim();
  return flat.length <= max ? flat : `${flat.slice(0, max - 1).trimEnd()}…`;
}

export function escapeHtml(s: string): string {
  return s.replace(/[&<>"']/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c]!);
}

function origin(appUrl: string): string {
  return appUrl.replace(/\/+$/, '');
}

export function spectrumLink(appUrl: string, groupSlug: string, spectrumId: string): string {
  return `${origin(appUrl)}/groups/${encodeURIComponent(groupSlug)}/spectra/${encodeURIComponent(spectrumId)}`;
}

export function settingsLink(appUrl: string): string {
  return `${origin(appUrl)}/account#notifications`;
}

const verdictWords: Record<DecisionVerdict, string> = {
  approve: 'approved',
  return: 'returned for fixes',
  reject: 'rejected',
};

const count = (n: number, one: string, many: string) => (n === 1 ? `${/^[aeiou]/.test(one) ? 'an' : 'a'} ${one}` : `${n} ${many}`);

/** What an approval that did not complete the rule still waits on, in the page's terms. */
export function waitingWords(w: NonNullable<DecisionOutcome['waiting']>): string[] {
  const out: string[] = [];
  if (w.approvals.count < w.approvals.required) out.push(`${w.approvals.required} approvals (${w.approvals.count} of ${w.approvals.required} so far)`);
  if (w.openBlockingThreads > 0) out.push(`${count(w.openBlockingThreads, 'blocking thread', 'blocking threads')} to be resolved`);
  if (w.blockingFindings > 0) out.push(`${count(w.blockingFindings, 'unwaived blocking finding', 'unwaived blocking findings')} to be fixed or waived`);
  return out;
}

function joinWords(parts: string[]): string {
  return parts.length <= 1 ? (parts[0] ?? '') : `${parts.slice(0, -1).join(', ')} and ${parts[parts.length - 1]}`;
}

/** What happened, in our words. */
export function describeEvent(event: ReviewDomainEvent, ctx: MessageContext): NotificationItem {
  const who = ctx.actorName ?? 'Branchwise';
  const title = `“${ctx.spectrum.title}”`;
  const link = spectrumLink(ctx.appUrl, ctx.group.slug, ctx.spectrum.id);
  const item = (subject: string, summary: string, detail: string | null = null): NotificationItem => ({
    subject,
    summary,
    detail: detail && detail.trim() ? excerpt(detail) : null,
    link,
  });
  switch (event.type) {
    case 'reviewer.assigned':
      return item(`Review requested: ${ctx.spectrum.title}`, `${who} asked you to review ${title} (${ctx.spectrum.material}) in ${ctx.group.name}.`);
    case 'revision.created':
      return item(
        `Revision ${event.number} of ${ctx.spectrum.title}`,
        `${who} uploaded revision ${event.number} of ${title}; it is screened before review.`,
        ctx.revision?.note ?? null,
      );
    case 'thread.opened':
      return item(
        `New thread on ${ctx.spectrum.title}`,
        `${who} opened a ${event.blocking ? 'blocking ' : ''}thread on ${title}.`,
        ctx.thread?.body ?? null,
      );
    case 'thread.replied':
      return item(`Reply on ${ctx.spectrum.title}`, `${who} replied in a thread on ${title}.`, ctx.reply?.body ?? null);
    case 'mention':
      return item(
        `${who} mentioned you on ${ctx.spectrum.title}`,
        `${who} mentioned you in a ${event.replyId ? 'reply' : 'thread'} on ${title}.`,
        (event.replyId ? ctx.reply?.body : ctx.thread?.body) ?? null,
      );
    case 'decision.made': {
      const rev = ctx.decision?.revisionNumber != null ? ` revision ${ctx.decision.revisionNumber} of` : '';
      const words = verdictWords[event.verdict];
      const said = `${who} ${words}${rev} ${title}.`;
      const note = ctx.decision?.note ?? null;
      // The decision mail is the one mail of its event (kinds.ts), so it says where the spectrum
      // ended up; events stored before outcomes were recorded keep the plain text.
      const outcome = event.outcome;
      if (outcome?.status === 'approved') {
        return item(`Approved: ${ctx.spectrum.title}`, `${said} With that it is approved under the group's review policy and can be exported.`, note);
      }
      if (outcome?.status === 'rejected') {
        return item(`Rejected: ${ctx.spectrum.title}`, `${said} The review is closed; an admin can reopen it.`, note);
      }
      if (event.verdict === 'approve' && outcome?.status === 'in-review') {
        const waiting = outcome.waiting ? waitingWords(outcome.waiting) : [];
        return item(
          `Decision on ${ctx.spectrum.title}: approved, still in review`,
          `${said} It stays in review${waiting.length ? `, waiting for ${joinWords(waiting)}` : ''}.`,
          note,
        );
      }
      return item(`Decision on ${ctx.spectrum.title}: ${words}`, said, note);
    }
    case 'spectrum.status':
      switch (event.to) {
        case 'approved':
          return item(`Approved: ${ctx.spectrum.title}`, `${title} is approved under the group's review policy and can be exported.`);
        case 'rejected':
          return item(`Rejected: ${ctx.spectrum.title}`, `${title} was rejected by ${who}.`);
        case 'withdrawn':
          return item(`Withdrawn: ${ctx.spectrum.title}`, `${who} withdrew ${title} from review.`);
        default:
          return event.reason === 'reopened'
            ? item(`Reopened: ${ctx.spectrum.title}`, `${who} reopened ${title} for review.`)
            : item(`${ctx.spectrum.title} is now ${event.to}`, `${title} moved from ${event.from} to ${event.to}.`);
      }
    default:
      return item(`Update on ${ctx.spectrum.title}`, `There is news on ${title}.`);
  }
}

function greeting(to: MailRecipient): string {
  return to.name ? `Hello ${to.name},` : 'Hello,';
}

function quote(detail: string): string {
  return detail.split('\n').map((l) => `> ${l}`).join('\n');
}

const shell = (title: string, inner: string, footer: string) =>
  `<!doctype html><html><body style="font-family:system-ui,sans-serif;color:#1d2321;max-width:600px;margin:0 auto;padding:24px">` +
  `<h1 style="font-size:18px;margin:0 0 18px">${escapeHtml(title)}</h1>${inner}` +
  `<p style="margin:28px 0 0;font-size:12px;color:#666">${footer}</p></body></html>`;

const blockquote = (detail: string) =>
  `<blockquote style="margin:0 0 14px;padding:8px 12px;border-left:3px solid #9ab0aa;color:#333">${escapeHtml(detail)}</blockquote>`;

const linkHtml = (href: string, label: string) => `<a href="${escapeHtml(href)}">${escapeHtml(label)}</a>`;

/** One event, one mail. */
export function renderImmediate(item: NotificationItem, to: MailRecipient, kind: NotificationKind, appUrl: string): OutgoingMail {
  const why = `You get this because "${kindDescriptions[kind].label}" is set to "${modeLabels.immediate}" in your notification settings.`;
  const settings = settingsLink(appUrl);
  const text = [
    greeting(to),
    item.summary,
    ...(item.detail ? [quote(item.detail)] : []),
    `Open the spectrum: ${item.link}`,
    `--\n${why}\nChange them: ${settings}`,
  ].join('\n\n');
  const html = shell(
    item.subject,
    `<p style="margin:0 0 14px">${escapeHtml(greeting(to))}</p>` +
      `<p style="margin:0 0 14px">${escapeHtml(item.summary)}</p>` +
      (item.detail ? blockquote(item.detail) : '') +
      `<p style="margin:18px 0">${linkHtml(item.link, 'Open the spectrum')}</p>`,
    `${escapeHtml(why)} ${linkHtml(settings, 'Change your settings')}.`,
  );
  return { to: to.email, subject: item.subject, text: `${text}\n`, html };
}

export interface DigestEntry {
  item: NotificationItem;
  kind: NotificationKind;
  at: Date;
  spectrum: { id: string; title: string };
}

function hhmm(d: Date): string {
  return `${d.toISOString().slice(0, 16).replace('T', ' ')} UTC`;
}

/** Everything one person collected since their last digest, grouped by spectrum, oldest first. */
export function renderDigest(entries: readonly DigestEntry[], to: MailRecipient, appUrl: string): OutgoingMail {
  const sorted = [...entries].sort((a, b) => a.at.getTime() - b.at.getTime());
  const bySpectrum = new Map<string, DigestEntry[]>();
  for (const e of sorted) {
    const list = bySpectrum.get(e.spectrum.id) ?? [];
    list.push(e);
    bySpectrum.set(e.spectrum.id, list);
  }
  const n = sorted.length;
  const subject = `Your Branchwise digest: ${n} update${n === 1 ? '' : 's'} on ${bySpectrum.size} spectr${bySpectrum.size === 1 ? 'um' : 'a'}`;
  const why = `You get this once a day for the kinds set to "${modeLabels.digest}" in your notification settings.`;
  const settings = settingsLink(appUrl);

  const textBlocks: string[] = [greeting(to), 'Here is what happened since your last digest.'];
  let htmlBody = `<p style="margin:0 0 14px">${escapeHtml(greeting(to))}</p><p style="margin:0 0 14px">Here is what happened since your last digest.</p>`;
  for (const list of bySpectrum.values()) {
    const first = list[0]!;
    const lines = list.map((e) => `- ${hhmm(e.at)}  ${e.item.summary}${e.item.detail ? `\n  ${quote(e.item.detail).replace(/\n/g, '\n  ')}` : ''}`);
    textBlocks.push(`${first.spectrum.title}\n${lines.join('\n')}\nOpen: ${first.item.link}`);
    htmlBody +=
      `<h2 style="font-size:15px;margin:22px 0 8px">${linkHtml(first.item.link, first.spectrum.title)}</h2><ul style="margin:0 0 10px;padding-left:20px">` +
      list
        .map((e) => `<li style="margin:0 0 8px"><span style="color:#666">${escapeHtml(hhmm(e.at))}</span> ${escapeHtml(e.item.summary)}${e.item.detail ? blockquote(e.item.detail) : ''}</li>`)
        .join('') +
      '</ul>';
  }
  textBlocks.push(`--\n${why}\nChange them: ${settings}`);
  return {
    to: to.email,
    subject,
    text: `${textBlocks.join('\n\n')}\n`,
    html: shell('Your daily Branchwise digest', htmlBody, `${escapeHtml(why)} ${linkHtml(settings, 'Change your settings')}.`),
  };
}

