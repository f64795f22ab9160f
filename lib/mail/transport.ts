import nodemailer, { type Transporter } from 'nodemailer';
import { env } from '@/lib/config/env';

const holder = globalThis as typeof globalThis & { __branchwiseMail?: Transporter };

/** SMTP on the configured host and port; plain SMTP (the demo and tests talk to the local fake). */
export function transport(): Transporter {
  if (!holder.__branchwiseMail) {
    const e = env();
    holder.__branchwiseMail = nodemailer.createTransport({
      host: e.SMTP_HOST,
      port: e.SMTP_PORT,
      secure: false,
      ignoreTLS: true,
    });
  }
  return holder.__branchwiseMail;
}

export interface OutgoingMail {
  to: string;
  subject: string;
  text: string;
  html: string;
}

export async function sendMail(mail: OutgoingMail): Promise<void> {
  await transport().sendMail({ from: env().MAIL_FROM, ...mail });
}
