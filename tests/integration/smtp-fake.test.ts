import { mkdtemp, readdir, rm } from 'node:fs/promises';
import os from 'node:os';
import path from 'node:path';
import nodemailer from 'nodemailer';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startSmtpFake, type SmtpFake } from '@/fakes/smtp/server';
import { firstLink, latestTo, listMessages } from '@/lib/mail/mailbox';

let dir: string;
let fake: SmtpFake;

beforeAll(async () => {
  dir = await mkdtemp(path.join(os.tmpdir(), 'bw-mail-'));
  fake = await startSmtpFake({ port: 0, dir, quiet: true }); // port 0: any free port
});
afterAll(async () => {
  await fake.close();
  await rm(dir, { recursive: true, force: true });
});

describe('SMTP fake', () => {
  it('receives a real nodemailer message over SMTP and the mailbox reads it', async () => {
    const transport = nodemailer.createTransport({ host: '127.0.0.1', port: fake.port, secure: false, ignoreTLS: true });
    await transport.sendMail({
      from: 'Branchwise <no-reply@branchwise.invalid>',
      to: 'Ada <ada@lab.test>, bob@lab.test',
      subject: 'Grüße: a link',
      text: 'Open http://127.0.0.1:3100/invitations/abc_DEF-123 please.',
      html: '<p>Open <a href="http://127.0.0.1:3100/invitations/abc_DEF-123">this</a></p>',
    });
    await transport.sendMail({ from: 'no-reply@branchwise.invalid', to: 'ada@lab.test', subject: 'second', text: 'later' });

    expect((await readdir(dir)).filter((f) => f.endsWith('.json'))).toHaveLength(2);
    expect((await readdir(dir)).some((f) => f.endsWith('.tmp'))).toBe(false);
    const all = await listMessages(dir);
    expect(all.map((m) => m.subject)).toEqual(['second', 'Grüße: a link']);
    const first = all[1]!;
    expect(first).toMatchObject({ from: 'no-reply@branchwise.invalid', to: ['ada@lab.test', 'bob@lab.test'] });
    expect(first.html).toContain('<a href=');
    expect(firstLink(first)).toBe('http://127.0.0.1:3100/invitations/abc_DEF-123');
    expect((await latestTo('BOB@lab.test', dir))?.subject).toBe('Grüße: a link');
    expect((await latestTo('ada@lab.test', dir))?.subject).toBe('second');
    expect(await latestTo('nobody@lab.test', dir)).toBeNull();
  });

  it('an absent mailbox folder is an empty mailbox', async () => {
    expect(await listMessages(path.join(dir, 'missing'))).toEqual([]);
  });
});
