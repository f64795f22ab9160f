import { route } from '@/lib/http/route';
import { readPolicy, updatePolicy, type PolicyDto } from '@/lib/services/policy';
import { policyBody, policyParams } from './schema';

export const dynamic = 'force-dynamic';

export type PolicyResponse = PolicyDto;

/** The group's review policy with the engine's defaults beside it (members). */
export const GET = route({ params: policyParams }, async ({ em, caller, params }): Promise<PolicyResponse> => readPolicy(em, caller, params.slug));

/** Change it (admins; audited; applies to screenings that start afterwards). */
export const PUT = route({ params: policyParams, body: policyBody }, async ({ em, caller, params, body }): Promise<PolicyResponse> =>
  updatePolicy(em, caller, params.slug, body),
);
