/**
 * The one wrapper for route handlers: authenticates (session cookie or `Authorization: Bearer`),
 * forks the EntityManager, parses params, query and JSON body with zod, and maps every error
 * to `{"error": {"code", "message", "details"}}`. Group roles are checked by the services
 * (lib/services/access.ts → lib/auth/permissions.ts).
 */
import type { z } from 'zod';
import { callerFromUser, type Caller } from '@/lib/auth/caller';
import { getRequestUser } from '@/lib/auth/session';
import { authenticateApiToken, bearerFrom } from '@/lib/auth/tokens';
import { getEm, type Em } from '@/lib/db/orm';
import { AppError, toErrorBody } from '@/lib/errors';
import { invalidInput, toAppError } from './to-app-error';

/** 'required': session or API token; 'session': signed-in browser only; 'none': public. */
export type RouteAuth = 'required' | 'session' | 'none';

type Schema = z.ZodType | undefined;
type Out<S extends Schema> = S extends z.ZodType ? z.output<S> : undefined;

export interface RouteOptions<A extends RouteAuth, P extends Schema, Q extends Schema, B extends Schema> {
  auth?: A;
  params?: P;
  query?: Q;
  body?: B;
}

export interface RouteContext<A extends RouteAuth, P extends Schema, Q extends Schema, B extends Schema> {
  em: Em;
  caller: A extends 'none' ? Caller | null : Caller;
  params: Out<P>;
  query: Out<Q>;
  body: Out<B>;
  req: Request;
}

/** What Next passes as the second argument of a route handler. */
export interface NextRouteArgs {
  params: Promise<Record<string, string | string[] | undefined>>;
}

export type RouteHandler = (req: Request, args: NextRouteArgs) => Promise<Response>;

export function errorResponse(e: AppError): Response {
  const headers: HeadersInit = e.code === 'unauthenticated' ? { 'WWW-Authenticate': 'Bearer' } : {};
  return Response.json(toErrorBody(e), { status: e.status, headers });
}

/** A JSON answer with a status, e.g. `return json(dto, 201)`. */
export function json(data: unknown, status = 200): Response {
  return Response.json(data, { status });
}

async function authenticate(em: Em, req: Request, mode: RouteAuth): Promise<Caller | null> {
  const bearer = bearerFrom(req);
  if (bearer) {
    if (mode === 'session') throw new AppError('forbidden', 'This needs a signed-in session; API tokens cannot do it.');
    return authenticateApiToken(em, bearer);
  }
  const user = await getRequestUser(em, req);
  if (user) return callerFromUser(user);
  if (mode === 'none') return null;
  throw new AppError('unauthenticated', 'Sign in, or send an API token as "Authorization: Bearer <token>".');
}

async function readJson(req: Request): Promise<unknown> {
  const text = await req.text();
  if (!text.trim()) return {};
  try {
    return JSON.parse(text);
  } catch {
    throw new AppError('invalid_input', 'The request body is not valid JSON.');
  }
}

function parse<S extends Schema>(schema: S, value: unknown, where: string): Out<S> {
  if (!schema) return undefined as Out<S>;
  const result = schema.safeParse(value);
  if (!result.success) throw invalidInput(result.error, where);
  return result.data as Out<S>;
}

export function route<A extends RouteAuth = 'required', P extends Schema = undefined, Q extends Schema = undefined, B extends Schema = undefined>(
  options: RouteOptions<A, P, Q, B>,
  handler: (ctx: RouteContext<A, P, Q, B>) => Promise<Response | unknown> | Response | unknown,
): RouteHandler {
  const mode: RouteAuth = options.auth ?? 'required';
  return async (req, args) => {
    try {
      let em: Em;
      try {
        em = await getEm();
      } catch (e) {
        console.error('[branchwise] database unavailable:', e);
        throw new AppError('unavailable', 'The database is unavailable; try again shortly.');
      }
      const caller = await authenticate(em, req, mode);
      const params = parse<P>(options.params as P, (await args?.params) ?? {}, 'path');
      const query = parse<Q>(options.query as Q, Object.fromEntries(new URL(req.url).searchParams), 'query');
      const body = parse<B>(options.body as B, options.body ? await readJson(req) : undefined, 'body');
      const result = await handler({ em, caller: caller as RouteContext<A, P, Q, B>['caller'], params, query, body, req });
      await em.flush();
      if (result instanceof Response) return result;
      return result === undefined ? new Response(null, { status: 204 }) : Response.json(result);
    } catch (e) {
      return errorResponse(toAppError(e, `${req.method} ${new URL(req.url).pathname}`));
    }
  };
}
