import NextAuth from 'next-auth';
import { clientAddress } from '@/lib/auth/client-address';
import { authOptionsFor } from '@/lib/auth/options';

// next-auth's own handler (sign-in, callback, sign-out, session, csrf); the options are built per
// request (never at build time) so that the sign-in link limit knows the client.
type Args = { params: Promise<{ nextauth: string[] }> };

async function handler(req: Request, args: Args): Promise<Response> {
  return NextAuth(req as never, args as never, authOptionsFor({ client: clientAddress(req.headers) })) as Promise<Response>;
}

export { handler as GET, handler as POST };
