import { route } from '@/lib/http/route';
import { getScreening, type ScreeningDto } from '@/lib/services/screening-results';
import { revisionParams } from '../schema';

export const dynamic = 'force-dynamic';

export type ScreeningResponse = ScreeningDto;

/** `{status: pending|done|error, …}`: the screening JSON of screening.md once done; line/column/expected on error. */
export const GET = route({ params: revisionParams }, async ({ em, caller, params }): Promise<ScreeningResponse> =>
  getScreening(em, caller, params.id),
);
