import { z } from 'zod';

/**
 * The new-spectrum form. The same limits as the upload route's input (spectrumMetaFields in
 * app/api/v1/spectra/schema.ts), repeated here because that module loads server code; the
 * route validates again and its messages reach the form if the two ever differ.
 */
const required = (what: string, max: number) =>
  z.string().trim().min(1, `${what} is required.`).max(max, `At most ${max} characters.`);
const optional = (max: number) => z.string().trim().max(max, `At most ${max} characters.`);

export const newSpectrumForm = z.object({
  title: required('A title', 200),
  material: required('The material', 200),
  formula: optional(100),
  method: optional(200),
  code: optional(200),
  supercell: optional(100),
  qmesh: optional(100),
  notes: optional(10_000),
});

export type NewSpectrumValues = z.input<typeof newSpectrumForm>;

export const emptyNewSpectrum: NewSpectrumValues = {
  title: '',
  material: '',
  formula: '',
  method: '',
  code: '',
  supercell: '',
  qmesh: '',
  notes: '',
};
