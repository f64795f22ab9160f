import { NextResponse, type NextRequest } from 'next/server';

/**
 * Passes the requested path to server components (they cannot read the URL otherwise), so a
 * signed-out visitor sent to /sign-in comes back to the page they asked for: a link in an
 * e-mail should open the spectrum after sign-in, not the home page. Nothing is decided here.
 */
export function proxy(req: NextRequest) {
  const headers = new Headers(req.headers);
  headers.set('x-branchwise-path', `${req.nextUrl.pathname}${req.nextUrl.search}`);
  return NextResponse.next({ request: { headers } });
}

export const config = {
  matcher: ['/((?!api/|_next/|dev/|sign-in|favicon).*)'],
};
