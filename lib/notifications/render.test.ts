import { describe, expect, it } from 'vitest';
import type { ReviewDomainEvent } from '@/lib/review/events';
import { describeEvent, excerpt, renderDigest, renderImmediate, spectrumLink, type MessageContext } from './render';

const ctx: MessageContext = {
  appUrl: 'http://127.0.0.1:3100/',
  group: { slug: 'invented-lab', name: 'Invented Lab' },
  spectrum: { id: '0b3c', title: 'Rock-salt <model> A', material: 'Invented rock-salt solid' },
  actorName: 'Rhea Vance',
  thread: { body: 'Branch 2 dips <b>below</b> zero near Γ & X.', blocking: true },
  reply: { body: 'Fixed in the next revision.' },
  decision: { verdict: 'return', note: 'Please converge the supercell.', revisionNumber: 2 },
};
const base = { groupId: 'g', spectrumId: '0b3c', actorId: 'a' };

describe('render', () => {
  it('links to the spectrum page under the group', () => {
    expect(spectrumLink('http://host:3000/', 'a b', 'x')).toBe('http://host:3000/groups/a%20b/spectra/x');
  });

  it('describes a decision with its verdict, revision and note', () => {
    const item = describeEvent({ ...base, type: 'decision.made', decisionId: 'd', revisionId: 'v', verdict: 'return' }, ctx);
    expect(item.subject).toBe('Decision on Rock-salt <model> A: returned for fixes');
    expect(item.summary).toBe('Rhea Vance returned for fixes revision 2 of “Rock-salt <model> A”.');
    expect(item.detail).toBe('Please converge the supercell.');
    expect(item.link).toBe('http://127.0.0.1:3100/groups/invented-lab/spectra/0b3c');
  });

  it('an approval that leaves the spectrum in review says what it still waits on', () => {
    const event: ReviewDomainEvent = {
      ...base,
      type: 'decision.made',
      decisionId: 'd',
      revisionId: 'v',
      verdict: 'approve',
      outcome: { status: 'in-review', waiting: { approvals: { count: 1, required: 2 }, openBlockingThreads: 1, blockingFindings: 1 } },
    };
    const item = describeEvent(event, { ...ctx, decision: { verdict: 'approve', note: 'Fine by me.', revisionNumber: 1 } });
    expect(item.subject).toBe('Decision on Rock-salt <model> A: approved, still in review');
    expect(item.summary).toBe(
      'Rhea Vance approved revision 1 of “Rock-salt <model> A”. It stays in review, waiting for 2 approvals (1 of 2 so far), ' +
        'a blocking thread to be resolved and an unwaived blocking finding to be fixed or waived.',
    );
    expect(item.summary).not.toMatch(/can be exported/);
  });

  it('a decision that ends the review says so in the one mail it makes', () => {
    const approved = describeEvent(
      { ...base, type: 'decision.made', decisionId: 'd', revisionId: 'v', verdict: 'approve', outcome: { status: 'approved' } },
      { ...ctx, decision: { verdict: 'approve', note: 'Good.', revisionNumber: 3 } },
    );
    expect(approved.subject).toBe('Approved: Rock-salt <model> A');
    expect(approved.summary).toBe("Rhea Vance approved revision 3 of “Rock-salt <model> A”. With that it is approved under the group's review policy and can be exported.");
    expect(approved.detail).toBe('Good.');
    const rejected = describeEvent(
      { ...base, type: 'decision.made', decisionId: 'd', revisionId: 'v', verdict: 'reject', outcome: { status: 'rejected' } },
      { ...ctx, decision: { verdict: 'reject', note: 'Wrong structure.', revisionNumber: 1 } },
    );
    expect(rejected.subject).toBe('Rejected: Rock-salt <model> A');
    expect(rejected.summary).toContain('Rhea Vance rejected revision 1 of');
    expect(rejected.detail).toBe('Wrong structure.');
  });

  it('an automatic approval names no person', () => {
    const item = describeEvent({ ...base, actorId: null, type: 'spectrum.status', from: 'in-review', to: 'approved', reason: 'auto-approved' }, { ...ctx, actorName: null });
    expect(item.subject).toBe('Approved: Rock-salt <model> A');
    expect(item.summary).toContain('can be exported');
  });

  it('a mention quotes the message it came in', () => {
    const onThread = describeEvent({ ...base, type: 'mention', threadId: 't', replyId: null, mentionedIds: ['m'] }, ctx);
    const onReply = describeEvent({ ...base, type: 'mention', threadId: 't', replyId: 'r', mentionedIds: ['m'] }, ctx);
    expect(onThread.detail).toBe(ctx.thread!.body);
    expect(onReply.detail).toBe(ctx.reply!.body);
  });

  it('an immediate mail has text and escaped HTML with the link', () => {
    const event: ReviewDomainEvent = { ...base, type: 'thread.opened', threadId: 't', blocking: true };
    const mail = renderImmediate(describeEvent(event, ctx), { email: 'ana@lab.test', name: 'Ana' }, 'thread', ctx.appUrl);
    expect(mail.to).toBe('ana@lab.test');
    expect(mail.text).toContain('Hello Ana,');
    expect(mail.text).toContain('> Branch 2 dips <b>below</b> zero near Γ & X.');
    expect(mail.text).toContain('Open the spectrum: http://127.0.0.1:3100/groups/invented-lab/spectra/0b3c');
    expect(mail.html).toContain('&lt;b&gt;below&lt;/b&gt; zero near Γ &amp; X.');
    expect(mail.html).toContain('Rock-salt &lt;model&gt; A');
    expect(mail.html).not.toContain('<b>below');
    expect(mail.html).toContain('href="http://127.0.0.1:3100/groups/invented-lab/spectra/0b3c"');
    // The footer quotes the setting with the account page's own words.
    expect(mail.text).toContain('"Threads and replies" is set to "At once"');
  });

  it('a digest holds every item, grouped by spectrum, oldest first', () => {
    const a = describeEvent({ ...base, type: 'thread.replied', threadId: 't', replyId: 'r' }, ctx);
    const b = describeEvent({ ...base, type: 'thread.opened', threadId: 't', blocking: false }, ctx);
    const other = describeEvent({ ...base, spectrumId: 'zz', type: 'thread.opened', threadId: 'u', blocking: false }, { ...ctx, spectrum: { id: 'zz', title: 'Chain B', material: 'x' } });
    const mail = renderDigest([
      { item: a, kind: 'thread', at: new Date('2026-01-02T10:00:00Z'), spectrum: ctx.spectrum },
      { item: other, kind: 'thread', at: new Date('2026-01-02T09:30:00Z'), spectrum: { id: 'zz', title: 'Chain B' } },
      { item: b, kind: 'thread', at: new Date('2026-01-02T09:00:00Z'), spectrum: ctx.spectrum },
    ], { email: 'ana@lab.test', name: null }, ctx.appUrl);
    expect(mail.subject).toBe('Your Branchwise digest: 3 updates on 2 spectra');
    const t = mail.text;
    expect(t.indexOf('opened a thread')).toBeLessThan(t.indexOf('replied in a thread'));
    expect(t.indexOf('Rock-salt <model> A')).toBeLessThan(t.indexOf('Chain B'));
    expect(mail.html).toContain('/groups/invented-lab/spectra/zz');
  });

  it('excerpts long text on one line', () => {
    expect(excerpt('a\n\nb   c')).toBe('a b c');
    expect(excerpt('x'.repeat(500), 10)).toBe(`${'x'.repeat(9)}…`);
  });
});
