import { defineEntity, type InferEntity } from '@mikro-orm/core';

/** next-auth's e-mail sign-in links; next-auth stores sha256(token + secret) in `token`. */
export const VerificationToken = defineEntity({
  name: 'VerificationToken',
  tableName: 'verification_token',
  properties: (p) => ({
    token: p.string().length(128).primary(),
    identifier: p.string().length(320),
    expires: p.datetime(),
  }),
  indexes: [{ properties: ['identifier'] }, { properties: ['expires'] }],
});
export type VerificationToken = InferEntity<typeof VerificationToken>;
