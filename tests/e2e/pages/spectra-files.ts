/**
 * Band files for the browser tests, made by the engine's force-constant models (invented
 * materials) and written by our own writers: the same files a submitter would upload.
 */
import { buildModelSpectrum, type DefectName } from '@/lib/models/cli';
import type { Dispersion } from '@/lib/dispersion/types';
import type { ModelName } from '@/lib/models/catalogue';
import { writeColumns } from '@/lib/writers';

export function modelBandFile(model: ModelName, options: { points?: number; defect?: DefectName } = {}): Buffer {
  const d = buildModelSpectrum({ model, points: options.points, polar: false, defect: options.defect });
  return Buffer.from(writeColumns(d));
}

/** Any dispersion (a model with changed parameters, say) as the columns file a submitter would upload. */
export function bandFileOf(d: Dispersion): Buffer {
  return Buffer.from(writeColumns(d));
}
