import { json, route } from '@/lib/http/route';
import { getWaiver, waiveFinding, type WaiverDto } from '@/lib/services/waivers';
import { waiverBody, waiverParams } from './schema';

export const dynamic = 'force-dynamic';

export type WaiverResponse = WaiverDto;
export type WaiveResponse = Awaited<ReturnType<typeof waiveFinding>>;

/** The finding's waiver; 404 when it is not waived. */
export const GET = route({ params: waiverParams }, async ({ em, caller, params }): Promise<WaiverResponse> => getWaiver(em, caller, params.id));

/** Waive the finding with a reason (reviewers and admins; current revision; once). */
export const POST = route({ params: waiverParams, body: waiverBody }, async ({ em, caller, params, body }) =>
  json(await waiveFinding(em, caller, params.id, body), 201),
);
