import type { OutgoingMail } from './transport';

function escapeHtml(s: string): string {
  return s.replace(/[&<>"']/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c]!);
}

function layout(title: string, paragraphs: string[], link?: { href: string; label: string }): string {
  const body = paragraphs.map((p) => `<p style="margin:0 0 14px">${escapeHtml(p)}</p>`).join('');
  const button = link
    ? `<p style="margin:22px 0"><a href="${escapeHtml(link.href)}" style="background:#1f4d46;color:#fff;padding:10px 18px;border-radius:6px;text-decoration:none">${escapeHtml(link.label)}</a></p>` +
      `<p style="margin:0 0 14px;font-size:13px;color:#555">Or paste this address into your browser:<br>${escapeHtml(link.href)}</p>`
    : '';
  return `<!doctype html><html><body style="font-family:system-ui,sans-serif;color:#1d2321;max-width:560px;margin:0 auto;padding:24px">` +
    `<h1 style="font-size:18px;margin:0 0 18px">${escapeHtml(title)}</h1>${body}${button}` +
    `<p style="margin:28px 0 0;font-size:12px;color:#777">Branchwise: the review board for phonon spectra.</p></body></html>`;
}

export function signInLinkMail(to: string, url: string, minutes: number): OutgoingMail {
  const lines = [
    'Someone (hopefully you) asked to sign in to Branchwise with this address.',
    `The link below signs you in once and stops working after ${minutes} minutes.`,
    'If you did not ask for it, ignore this message: nothing happens until the link is opened.',
  ];
  return {
    to,
    subject: 'Your Branchwise sign-in link',
    text: `${lines.join('\n\n')}\n\nSign in: ${url}\n`,
    html: layout('Sign in to Branchwise', lines, { href: url, label: 'Sign in' }),
  };
}

/** Sent instead of a link when the address has no account: sign-up is by invitation only. */
export function noAccountMail(to: string): OutgoingMail {
  const lines = [
    'Someone asked for a Branchwise sign-in link for this address, but it has no account.',
    'Accounts are made by invitation: ask an admin of your group to invite this address.',
  ];
  return {
    to,
    subject: 'Branchwise: no account for this address',
    text: `${lines.join('\n\n')}\n`,
    html: layout('No Branchwise account yet', lines),
  };
}

export function invitationMail(input: {
  to: string;
  url: string;
  groupName: string;
  role: string;
  invitedBy: string;
  expiresAt: Date;
}): OutgoingMail {
  const lines = [
    `${input.invitedBy} invites you to review phonon spectra with ${input.groupName} on Branchwise, as ${input.role}.`,
    `The invitation is valid until ${input.expiresAt.toISOString().slice(0, 16).replace('T', ' ')} UTC and can be used once.`,
  ];
  return {
    to: input.to,
    subject: `Invitation to ${input.groupName} on Branchwise`,
    text: `${lines.join('\n\n')}\n\nAccept: ${input.url}\n`,
    html: layout(`Join ${input.groupName}`, lines, { href: input.url, label: 'Accept the invitation' }),
  };
}
