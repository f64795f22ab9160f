/**
 * A local SMTP server standing in for a real one in demo, tests and CI. nodemailer talks real
 * SMTP to it; each message is written, atomically, as one JSON file into MAILBOX_DIR, which
 * /dev/mail and the tests read (lib/mail/mailbox.ts).
 *   SMTP_PORT=2526 MAILBOX_DIR=.data/test/mail tsx fakes/smtp/server.ts
 */
import { randomUUID } from 'node:crypto';
import { mkdir, rename, writeFile } from 'node:fs/promises';
import path from 'node:path';
import { pathToFileURL } from 'node:url';
import { simpleParser, type AddressObject } from 'mailparser';
import { SMTPServer } from 'smtp-server';

function addresses(a: AddressObject | AddressObject[] | undefined): string[] {
  if (!a) return [];
  return (Array.isArray(a) ? a : [a]).flatMap((o) => o.value.map((v) => v.address ?? '')).filter(Boolean);
}

export interface SmtpFake {
  port: number;
  close(): Promise<void>;
}

export async function startSmtpFake(opts: { port: number; dir: string; host?: string; quiet?: boolean }): Promise<SmtpFake> {
  await mkdir(opts.dir, { recursive: true });
  const server = new SMTPServer({
    secure: false,
    disabledCommands: ['STARTTLS', 'AUTH'],
    authOptional: true,
    logger: false,
    onData(stream, session, callback) {
      simpleParser(stream)
        .then(async (parsed) => {
          const envelopeTo = session.envelope.rcptTo.map((r) => r.address);
          const message = {
            id: `${Date.now()}-${randomUUID()}`,
            date: new Date().toISOString(),
            from: addresses(parsed.from)[0] ?? session.envelope.mailFrom?.valueOf().toString() ?? '',
            to: envelopeTo.length ? envelopeTo : addresses(parsed.to),
            subject: parsed.subject ?? '',
            text: parsed.text ?? '',
            html: typeof parsed.html === 'string' ? parsed.html : '',
          };
          // Write then rename: a reader never sees half a file.
          const final = path.join(opts.dir, `${message.id}.json`);
          const temp = `${final}.tmp`;
          await writeFile(temp, JSON.stringify(message, null, 2));
          await rename(temp, final);
          if (!opts.quiet) console.log(`[smtp-fake] ${message.date} to=${message.to.join(',')} subject=${JSON.stringify(message.subject)}`);
          callback();
        })
        .catch((e: unknown) => callback(e instanceof Error ? e : new Error(String(e))));
    },
  });
  await new Promise<void>((resolve, reject) => {
    server.once('error', reject);
    server.listen(opts.port, opts.host ?? '127.0.0.1', () => resolve());
  });
  const address = server.server.address();
  const port = typeof address === 'object' && address ? address.port : opts.port;
  return { port, close: () => new Promise<void>((resolve) => server.close(() => resolve())) };
}

const isMain = process.argv[1] && import.meta.url === pathToFileURL(path.resolve(process.argv[1])).href;
if (isMain) {
  const port = Number(process.env.SMTP_PORT);
  const dir = process.env.MAILBOX_DIR;
  if (!Number.isInteger(port) || port <= 0 || !dir) {
    console.error('[smtp-fake] set SMTP_PORT and MAILBOX_DIR (source scripts/env.sh demo|test)');
    process.exit(2);
  }
  startSmtpFake({ port, dir }).then(
    (fake) => {
      console.log(`[smtp-fake] listening on 127.0.0.1:${fake.port}, writing to ${dir}`);
      const stop = () => fake.close().then(() => process.exit(0));
      process.on('SIGTERM', stop);
      process.on('SIGINT', stop);
    },
    (e: unknown) => {
      console.error('[smtp-fake] could not start:', e);
      process.exit(1);
    },
  );
}
