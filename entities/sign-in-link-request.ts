import { defineEntity, type InferEntity } from '@mikro-orm/core';
import { uuidPk } from './common';

/**
 * One e-mail sign-in link that was sent, once under each key that limits it (the address it
 * went to, the client that asked): lib/auth/link-requests.ts counts them in a sliding window.
 * Rows older than the window are deleted as new requests come in.
 */
export const SignInLinkRequest = defineEntity({
  name: 'SignInLinkRequest',
  tableName: 'sign_in_link_request',
  properties: (p) => ({
    id: uuidPk(),
    /** `email:` or `client:` and the sha256 of the normalized address or the client key. */
    key: p.string().length(400),
    at: p.datetime(),
  }),
  indexes: [{ properties: ['key', 'at'] }, { properties: ['at'] }],
});
export type SignInLinkRequest = InferEntity<typeof SignInLinkRequest>;
