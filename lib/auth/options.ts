import type { NextAuthOptions } from 'next-auth';
import CredentialsProvider from 'next-auth/providers/credentials';
import EmailProvider from 'next-auth/providers/email';
import { z } from 'zod';
import { User } from '@/entities';
import { env } from '@/lib/config/env';
import { getEm } from '@/lib/db/orm';
import { noAccountMail, signInLinkMail } from '@/lib/mail/templates';
import { sendMail } from '@/lib/mail/transport';
import { recordAudit } from '@/lib/services/audit';
import { branchwiseAdapter } from './adapter';
import { normalizeEmail } from './email';
import { LINK_LIMIT_ERROR } from './link-limits';
import { takeLinkRequest } from './link-requests';
import { burnPasswordCheck, PASSWORD_MAX, verifyPassword } from './password';

export const SIGN_IN_LINK_MINUTES = 30;

const credentialsSchema = z.object({
  email: z.string().trim().max(320),
  password: z.string().max(PASSWORD_MAX),
});

/**
 * The person for an e-mail and password, or null. Unknown address, no password set and wrong
 * password all give null after the same work, so neither the message nor the timing differs.
 */
export async function checkPassword(email: string, password: string): Promise<{ id: string; email: string; name: string | null } | null> {
  const em = await getEm();
  const user = await em.findOne(User, { email: normalizeEmail(email) }, { populate: ['passwordHash'] });
  if (!user || !user.passwordHash) {
    await burnPasswordCheck(password);
    return null;
  }
  if (!(await verifyPassword(user.passwordHash, password))) return null;
  return { id: user.id, email: user.email, name: user.name ?? null };
}

/** The e-mail link, or for an address without an account a note saying how accounts are made. */
export async function sendSignInLink(email: string, url: string): Promise<void> {
  const em = await getEm();
  const exists = await em.count(User, { email: normalizeEmail(email) });
  await sendMail(exists ? signInLinkMail(email, url, SIGN_IN_LINK_MINUTES) : noAccountMail(email));
}

/** What the options know of the request they serve (authOptionsFor). */
export interface AuthRequestContext {
  /** The client's address key (lib/auth/client-address.ts), or null when not known. */
  client: string | null;
  /** The clock of the link limit; tests move it instead of waiting. */
  now?: () => Date;
}

function buildAuthOptions(ctx: AuthRequestContext): NextAuthOptions {
  const e = env();
  return {
    secret: e.NEXTAUTH_SECRET,
    session: { strategy: 'jwt' }, // explicit: with an adapter next-auth would switch to database sessions
    adapter: branchwiseAdapter(),
    pages: { signIn: '/sign-in', verifyRequest: '/sign-in/check-email', error: '/sign-in' },
    providers: [
      CredentialsProvider({
        id: 'credentials',
        name: 'E-mail and password',
        credentials: { email: { label: 'E-mail', type: 'email' }, password: { label: 'Password', type: 'password' } },
        async authorize(raw) {
          const parsed = credentialsSchema.safeParse(raw ?? {});
          if (!parsed.success) return null;
          return checkPassword(parsed.data.email, parsed.data.password);
        },
      }),
      EmailProvider({
        // The transport is ours (sendVerificationRequest); `server` is only read by the default sender.
        server: { host: e.SMTP_HOST, port: e.SMTP_PORT, secure: false, ignoreTLS: true },
        from: e.MAIL_FROM,
        maxAge: SIGN_IN_LINK_MINUTES * 60,
        async sendVerificationRequest({ identifier, url }) {
          await sendSignInLink(identifier, url);
        },
      }),
    ],
    callbacks: {
      async signIn({ user, account, email }) {
        if (account?.provider === 'email' && email?.verificationRequest) {
          // Asking for a link: every address is answered by mail (link or "no account" note),
          // within the limit. Over it nothing is sent and the form says why.
          const verdict = await takeLinkRequest(await getEm(), { email: user.email ?? '', client: ctx.client }, ctx.now?.() ?? new Date());
          return verdict.allowed ? true : `${e.APP_URL}/sign-in?error=${LINK_LIMIT_ERROR}`;
        }
        // An e-mail link only signs in an existing account.
        if (account?.provider === 'email') {
          const em = await getEm();
          return (await em.count(User, { email: normalizeEmail(user.email ?? '') })) === 1;
        }
        return true;
      },
      async jwt({ token, user }) {
        if (user) {
          token.sub = user.id;
          token.email = user.email;
          token.name = user.name;
        }
        return token;
      },
      async session({ session, token }) {
        if (session.user && token.sub) session.user.id = token.sub;
        return session;
      },
    },
    events: {
      async signIn({ user, account }) {
        const em = await getEm();
        recordAudit(em, {
          actorId: user.id,
          action: 'auth.sign-in',
          target: `user:${user.id}`,
          data: { method: account?.provider === 'email' ? 'email-link' : 'password' },
        });
        await em.flush();
      },
    },
  };
}

let cached: NextAuthOptions | undefined;
/**
 * Built on first use, so that importing this module never reads the environment at build time.
 * For sessions and anything else that does not know the request's client; next-auth's own route
 * uses authOptionsFor.
 */
export function getAuthOptions(): NextAuthOptions {
  cached ??= buildAuthOptions({ client: null });
  return cached;
}

/** Options for one request to next-auth's route: the link limit then counts its client too. */
export function authOptionsFor(ctx: AuthRequestContext): NextAuthOptions {
  return buildAuthOptions(ctx);
}
