/**
 * The `model` command's arguments and what they produce, kept apart from the script so that
 * both can be tested without a process.
 */
import type { Dispersion, FrequencyUnit } from '../dispersion/types';
import { parseUnit } from '../physics/units';
import { pathGeometry } from '../physics/path';
import { isModelName, MODEL_NAMES, modelSpectrum, type ModelName } from './catalogue';
import { breakSumRule, injectSoftMode, noisePocketNearGamma, pushBeyondZone, shiftSegment } from './defects';

export const DEFECTS = ['soft-mode', 'sum-rule', 'shift', 'beyond-zone', 'noise-pocket'] as const;
export type DefectName = (typeof DEFECTS)[number];

export const MODEL_USAGE = `usage: npm run model -- ${MODEL_NAMES.join('|')} --out FILE [--format columns|yaml]
       [--units THz|cm-1|meV] [--points N] [--defect ${DEFECTS.join('|')}] [--polar]

  --points N   q-points per path segment (default 41); for fcc-mesh, the mesh size N×N×N (default 12)
  --format     default: yaml for a .yaml/.yml file name, else columns
  --polar      cubic2 only: add the rigid-ion LO–TO term`;

export class ModelUsageError extends Error {}

export interface ModelArgs {
  model: ModelName;
  out: string;
  format: 'columns' | 'yaml';
  units: FrequencyUnit;
  points?: number;
  defect?: DefectName;
  polar: boolean;
  help: boolean;
}

export function parseModelArgs(argv: string[]): ModelArgs {
  if (argv.includes('--help') || argv.includes('-h')) {
    return { model: 'fcc', out: '', format: 'columns', units: 'THz', polar: false, help: true };
  }
  let model: ModelName | undefined;
  let out: string | undefined;
  let format: 'columns' | 'yaml' | undefined;
  let units: FrequencyUnit = 'THz';
  let points: number | undefined;
  let defect: DefectName | undefined;
  let polar = false;
  const value = (i: number, flag: string) => {
    const v = argv[i + 1];
    if (v === undefined || v.startsWith('--')) throw new ModelUsageError(`${flag} needs a value`);
    return v;
  };
  for (let i = 0; i < argv.length; i++) {
    const a = argv[i];
    switch (a) {
      case '--out':
        out = value(i++, a);
        break;
      case '--format': {
        const v = value(i++, a);
        if (v !== 'columns' && v !== 'yaml') throw new ModelUsageError(`--format must be columns or yaml, got "${v}"`);
        format = v;
        break;
      }
      case '--units': {
        const v = value(i++, a);
        const u = parseUnit(v);
        if (!u) throw new ModelUsageError(`--units must be THz, cm-1 or meV, got "${v}"`);
        units = u;
        break;
      }
      case '--points': {
        const v = value(i++, a);
        const n = Number(v);
        if (!/^\d+$/.test(v) || n < 2 || n > 100000) throw new ModelUsageError(`--points must be an integer from 2 to 100000, got "${v}"`);
        points = n;
        break;
      }
      case '--defect': {
        const v = value(i++, a);
        if (!(DEFECTS as readonly string[]).includes(v)) throw new ModelUsageError(`--defect must be one of ${DEFECTS.join(', ')}, got "${v}"`);
        defect = v as DefectName;
        break;
      }
      case '--polar':
        polar = true;
        break;
      default:
        if (a.startsWith('--')) throw new ModelUsageError(`unknown option ${a}`);
        if (model) throw new ModelUsageError(`one model only, got "${model}" and "${a}"`);
        if (!isModelName(a)) throw new ModelUsageError(`unknown model "${a}"; expected one of ${MODEL_NAMES.join(', ')}`);
        model = a;
    }
  }
  if (!model) throw new ModelUsageError(`which model? expected one of ${MODEL_NAMES.join(', ')}`);
  if (!out) throw new ModelUsageError('--out FILE is required');
  if (polar && model !== 'cubic2') throw new ModelUsageError('--polar applies to the cubic2 model only');
  if (defect && model === 'fcc-mesh') throw new ModelUsageError('defects are injected into band paths, not into fcc-mesh');
  if (model === 'fcc-mesh' && points !== undefined && points > 40) throw new ModelUsageError('--points for fcc-mesh is the mesh size N (N³ points): at most 40');
  return { model, out, format: format ?? (/\.ya?ml$/i.test(out) ? 'yaml' : 'columns'), units, points, defect, polar, help: false };
}

/** The spectrum the arguments ask for, with the defect (if any) at a place chosen to show it. */
export function buildModelSpectrum(args: Pick<ModelArgs, 'model' | 'points' | 'polar' | 'defect'>): Dispersion {
  const d = modelSpectrum(args.model, { points: args.points, polar: args.polar });
  if (!args.defect) return d;
  const gamma = pathGeometry(d).gamma;
  // A segment without a Γ end if there is one (fcc: X–W), else the first.
  const segIndex = Math.max(0, d.segments.findIndex((s) => !gamma[s.start] && !gamma[s.end]));
  const seg = d.segments[segIndex];
  const len = seg.end - seg.start;
  switch (args.defect) {
    case 'soft-mode': {
      const index = gamma[seg.start] || gamma[seg.end] ? seg.start + Math.round(0.75 * len) : seg.start + Math.round(0.5 * len);
      // Wide enough that the slopes of the pocket stay below the in-segment jump limit (0.5 THz per step).
      return injectSoftMode(d, { index, depthTHz: 1, widthPoints: Math.max(1, Math.round(len / 2) - 1) });
    }
    case 'sum-rule':
      return breakSumRule(d, { offsetTHz: 0.3 });
    case 'shift':
      return shiftSegment(d, { segment: segIndex, deltaTHz: 0.6 });
    case 'beyond-zone': {
      const indices: number[] = [];
      for (let i = seg.start + 1; i < seg.end; i += 2) indices.push(i);
      return pushBeyondZone(d, { indices, g: [1, 0, 0] });
    }
    case 'noise-pocket':
      return noisePocketNearGamma(d, { depthTHz: 0.1 });
  }
}
