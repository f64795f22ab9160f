import { json, route } from '@/lib/http/route';
import { waiveFindings, type WaiveManyResult } from '@/lib/services/waivers';
import { revisionParams } from '../schema';
import { waiversBody } from './schema';

export const dynamic = 'force-dynamic';

export type WaiveManyResponse = WaiveManyResult;

/** Waive several findings of the current revision with one reason, all or none (reviewers and admins). */
export const POST = route({ params: revisionParams, body: waiversBody }, async ({ em, caller, params, body }) =>
  json(await waiveFindings(em, caller, params.id, body), 201),
);
