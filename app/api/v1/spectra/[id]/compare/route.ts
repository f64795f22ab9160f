import { route } from '@/lib/http/route';
import { compareSpectrumRevisions, type ComparisonDto } from '@/lib/services/compare';
import { compareParams, compareQuery } from './schema';

export const dynamic = 'force-dynamic';

export type CompareResponse = ComparisonDto;

/** `?a=<revision>&b=<revision>`: per-branch maximum deviation (THz) over the q-points present in both. */
export const GET = route({ params: compareParams, query: compareQuery }, async ({ em, caller, params, query }): Promise<CompareResponse> =>
  compareSpectrumRevisions(em, caller, params.id, query),
);
