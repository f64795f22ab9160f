/** Reads the SMTP fake's mailbox (JSON files in MAILBOX_DIR) the way the app's /dev/mail does. */
import { expect } from '@playwright/test';
import { firstLink, listMessages, type StoredMessage } from '@/lib/mail/mailbox';

/** Waits for a message to `email` that arrived after `since` and contains a link; returns it. */
export async function waitForMail(email: string, since: Date, timeoutMs = 15_000): Promise<StoredMessage & { link: string }> {
  const wanted = email.toLowerCase();
  let found: (StoredMessage & { link: string }) | null = null;
  await expect
    .poll(
      async () => {
        const all = await listMessages();
        const m = all.find((x) => x.to.some((t) => t.toLowerCase() === wanted) && new Date(x.date) >= since);
        const link = m ? firstLink(m) : null;
        found = m && link ? { ...m, link } : null;
        return Boolean(found);
      },
      { timeout: timeoutMs, message: `no e-mail with a link reached ${email}` },
    )
    .toBe(true);
  return found!;
}

/** Waits for a message to `email` with this subject that arrived after `since`; returns it. */
export async function waitForMailWithSubject(email: string, subject: string | RegExp, since: Date, timeoutMs = 30_000): Promise<StoredMessage> {
  const wanted = email.toLowerCase();
  let found: StoredMessage | null = null;
  await expect
    .poll(
      async () => {
        const matches = (m: StoredMessage) => (typeof subject === 'string' ? m.subject === subject : subject.test(m.subject));
        found = (await listMessages()).find((m) => m.to.some((t) => t.toLowerCase() === wanted) && matches(m) && new Date(m.date) >= since) ?? null;
        return Boolean(found);
      },
      { timeout: timeoutMs, message: `no e-mail "${subject}" reached ${email}` },
    )
    .toBe(true);
  return found!;
}
