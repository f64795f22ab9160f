import { readdir, readFile } from 'node:fs/promises';
import path from 'node:path';

/** One message as the SMTP fake stores it (fakes/smtp/server.ts). */
export interface StoredMessage {
  id: string;
  date: string;
  from: string;
  to: string[];
  subject: string;
  text: string;
  html: string;
}

function mailboxDir(dir?: string): string {
  // Read directly (not through env()): scripts and tests use the mailbox without the app's settings.
  const d = dir ?? process.env.MAILBOX_DIR;
  if (!d) throw new Error('MAILBOX_DIR is not set (source scripts/env.sh demo|test)');
  return d;
}

/** Newest first. An absent folder is an empty mailbox. */
export async function listMessages(dir?: string): Promise<StoredMessage[]> {
  const folder = mailboxDir(dir);
  let names: string[];
  try {
    names = (await readdir(folder)).filter((n) => n.endsWith('.json'));
  } catch (e) {
    if ((e as NodeJS.ErrnoException).code === 'ENOENT') return [];
    throw e;
  }
  const messages = await Promise.all(
    names.map(async (n) => JSON.parse(await readFile(path.join(folder, n), 'utf8')) as StoredMessage),
  );
  return messages.sort((a, b) => (a.date < b.date ? 1 : a.date > b.date ? -1 : b.id.localeCompare(a.id)));
}

/** The newest message to an address (case-insensitive), or null. */
export async function latestTo(email: string, dir?: string): Promise<StoredMessage | null> {
  const wanted = email.toLowerCase();
  const all = await listMessages(dir);
  return all.find((m) => m.to.some((t) => t.toLowerCase() === wanted)) ?? null;
}

/** The first http(s) link in a message's text, e.g. a sign-in or invitation link. */
export function firstLink(message: StoredMessage): string | null {
  return message.text.match(/https?:\/\/\S+/)?.[0] ?? null;
}
