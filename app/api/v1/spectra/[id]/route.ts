import { route } from '@/lib/http/route';
import { getSpectrum, type SpectrumDetail } from '@/lib/services/spectra';
import { spectrumParams } from './schema';

export const dynamic = 'force-dynamic';

export type SpectrumResponse = SpectrumDetail;

/** One spectrum: status, current revision, verdict, counts, reviewers, revisions, what the caller may do. */
export const GET = route({ params: spectrumParams }, async ({ em, caller, params }): Promise<SpectrumResponse> =>
  getSpectrum(em, caller, params.id),
);
