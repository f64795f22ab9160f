/**
 * A group's screening thresholds. The defaults are the values of screening.md; a group may
 * change them, so the app stores a policy as JSON and validates it with this schema.
 */
import { z } from 'zod';

const positive = z.number().finite().positive();
const fraction = z.number().finite().gt(0).lte(1);

const check = <T extends z.ZodRawShape>(shape: T) => z.object({ enabled: z.boolean(), ...shape }).strict();

export const policySchema = z
  .object({
    imaginaryModes: check({
      /** ω below −threshold (THz) counts as imaginary. */
      threshold: positive,
      /** "Near Γ": within this fraction of the segment's length from a Γ end. */
      nearGammaFraction: fraction,
      /** A near-Γ run no deeper than this (THz) is a warning, deeper is a failure. */
      nearGammaDepth: positive,
    }),
    acousticGamma: check({
      /** Above this (THz) the acoustic branches at Γ give a warning. */
      warn: positive,
      /** Above this (THz) they give a failure. */
      fail: positive,
    }),
    continuity: check({
      /** δ = max(minDelta, relativeDelta × the file's largest |ω|), THz. */
      minDelta: positive,
      relativeDelta: z.number().finite().min(0).lt(1),
      /** Folded q-points closer than this (fractional) are the same point. */
      coincidence: positive,
      /** An in-segment step is flagged above both minStep (THz) and medianFactor × the median step. */
      minStep: positive,
      medianFactor: positive,
    }),
    zoneFolding: check({}),
    branchCount: check({}),
    pathLabels: check({
      /** Relative tolerance on |q| of a labelled point. */
      tolerance: positive,
      /** Relative tolerance on lengths and cosines when recognising the lattice. */
      latticeTolerance: positive,
    }),
    unitsSuspect: check({
      /** Largest |ω| (THz) above which the unit is suspect. */
      maxTHz: positive,
      /** Largest |ω| (THz) below which the unit is suspect. */
      minTHz: positive,
      /** The range (THz) a corrected spectrum's largest |ω| should land in. */
      plausibleLow: positive,
      plausibleHigh: positive,
      /** Fit window for the ω² test, as fractions of the segment's length from Γ. */
      fitFrom: fraction,
      fitTo: fraction,
      minFitPoints: z.number().int().min(2),
      /** Every fitted acoustic exponent above this suggests ω² was written as ω. */
      squaredExponent: positive,
    }),
  })
  .strict()
  .superRefine((p, ctx) => {
    if (p.acousticGamma.warn >= p.acousticGamma.fail)
      ctx.addIssue({ code: 'custom', path: ['acousticGamma', 'warn'], message: 'warn must be below fail' });
    if (p.unitsSuspect.minTHz >= p.unitsSuspect.maxTHz)
      ctx.addIssue({ code: 'custom', path: ['unitsSuspect', 'minTHz'], message: 'minTHz must be below maxTHz' });
    if (p.unitsSuspect.plausibleLow >= p.unitsSuspect.plausibleHigh)
      ctx.addIssue({ code: 'custom', path: ['unitsSuspect', 'plausibleLow'], message: 'plausibleLow must be below plausibleHigh' });
    if (p.unitsSuspect.fitFrom >= p.unitsSuspect.fitTo)
      ctx.addIssue({ code: 'custom', path: ['unitsSuspect', 'fitFrom'], message: 'fitFrom must be below fitTo' });
  });

export type Policy = z.infer<typeof policySchema>;

export type DeepPartial<T> = { [K in keyof T]?: T[K] extends object ? DeepPartial<T[K]> : T[K] };

/** The defaults of screening.md; the thresholds themselves are common practice (physics-ref §7). */
export const defaultPolicy: Policy = Object.freeze({
  imaginaryModes: { enabled: true, threshold: 0.05, nearGammaFraction: 0.1, nearGammaDepth: 0.5 },
  acousticGamma: { enabled: true, warn: 0.03, fail: 0.1 },
  continuity: { enabled: true, minDelta: 0.05, relativeDelta: 0.01, coincidence: 1e-6, minStep: 0.5, medianFactor: 8 },
  zoneFolding: { enabled: true },
  branchCount: { enabled: true },
  pathLabels: { enabled: true, tolerance: 1e-3, latticeTolerance: 1e-3 },
  unitsSuspect: {
    enabled: true,
    maxTHz: 140,
    minTHz: 0.3,
    plausibleLow: 0.5,
    plausibleHigh: 60,
    fitFrom: 0.02,
    fitTo: 0.1,
    minFitPoints: 3,
    squaredExponent: 1.7,
  },
}) as Policy;

/** Defaults overlaid with a group's (partial) policy, validated; throws a ZodError on bad values. */
export function resolvePolicy(p?: DeepPartial<Policy>): Policy {
  if (!p) return defaultPolicy;
  const merged: Record<string, unknown> = {};
  for (const key of Object.keys(defaultPolicy) as (keyof Policy)[]) {
    merged[key] = { ...defaultPolicy[key], ...(p[key] ?? {}) };
  }
  for (const key of Object.keys(p)) if (!(key in merged)) merged[key] = (p as Record<string, unknown>)[key];
  return policySchema.parse(merged);
}
