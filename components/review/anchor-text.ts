import type { FrequencyUnit } from '@/lib/dispersion/types';
import { fromTHz } from '@/lib/physics/units';

const digits: Record<FrequencyUnit, number> = { THz: 3, 'cm-1': 1, meV: 2 };

/** "3.412 THz", in the unit the page shows. */
export function frequencyText(thz: number, unit: FrequencyUnit): string {
  return `${fromTHz(thz, unit).toFixed(digits[unit])} ${unit === 'cm-1' ? 'cm⁻¹' : unit}`;
}
