import { json, route } from '@/lib/http/route';
import { createApiToken } from '@/lib/services/api-tokens';
import { createTokenBody } from './schema';

export const dynamic = 'force-dynamic';

export type CreateTokenResponse = { id: string; token: string };

/** A personal API token for one group; the token is in this answer only. Signed-in sessions only. */
export const POST = route({ auth: 'session', body: createTokenBody }, async ({ em, caller, body }) => {
  const created = await createApiToken(em, caller, body);
  const answer: CreateTokenResponse = { id: created.id, token: created.token };
  return json(answer, 201);
});
