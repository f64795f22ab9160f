import NextAuth from 'next-auth';
import { getAuthOptions } from '@/lib/auth/options';

// next-auth's own handler (sign-in, callback, sign-out, session, csrf); the options are built on
// the first request so that the build never needs the environment.
type Args = { params: Promise<{ nextauth: string[] }> };

async function handler(req: Request, args: Args): Promise<Response> {
  return NextAuth(req as never, args as never, getAuthOptions()) as Promise<Response>;
}

export { handler as GET, handler as POST };
