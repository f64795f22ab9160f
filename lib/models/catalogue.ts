/** The named models the command line and the demo offer. */
import type { Dispersion } from '../dispersion/types';
import { diatomicChain, monatomicChain } from './chain';
import { fccModel } from './fcc';
import { layerModel } from './layer';
import { meshDispersion, pathDispersion, type PhononModel } from './model';
import { rocksaltModel } from './rocksalt';

export const MODEL_NAMES = ['fcc', 'chain', 'diatomic', 'cubic2', 'layer', 'fcc-mesh'] as const;
export type ModelName = (typeof MODEL_NAMES)[number];

export function isModelName(s: string): s is ModelName {
  return (MODEL_NAMES as readonly string[]).includes(s);
}

export function modelByName(name: ModelName, options: { polar?: boolean } = {}): PhononModel {
  switch (name) {
    case 'fcc':
    case 'fcc-mesh':
      return fccModel();
    case 'chain':
      return monatomicChain();
    case 'diatomic':
      return diatomicChain();
    case 'cubic2':
      return rocksaltModel({ polar: options.polar ?? false });
    case 'layer':
      return layerModel();
  }
}

/**
 * The spectrum of a named model: its standard path with `points` per segment, or for
 * 'fcc-mesh' a Γ-centred mesh of `points` along each reciprocal vector.
 */
export function modelSpectrum(name: ModelName, options: { points?: number; polar?: boolean } = {}): Dispersion {
  const model = modelByName(name, options);
  if (name === 'fcc-mesh') {
    const n = options.points ?? 12;
    return meshDispersion(model, { mesh: [n, n, n] });
  }
  return pathDispersion(model, { points: options.points });
}
