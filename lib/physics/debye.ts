/**
 * The Debye model (Abramowitz & Stegun, Handbook of Mathematical Functions, §27.1; Kittel ch. 5)
 * and Debye-temperature estimates from a phonon spectrum.
 *
 * Definitions (x = θ/T):
 *   D₃(x)        = (3/x³) ∫₀ˣ t³/(eᵗ − 1) dt
 *   C_v/(3Nk_B)  = 4 D₃(x) − 3x/(eˣ − 1)
 *   S/(3Nk_B)    = (4/3) D₃(x) − ln(1 − e⁻ˣ)
 * Moment temperatures over the normalised DOS g(ν) of the real modes (Grimvall, Thermophysical
 * Properties of Materials, characteristic temperatures):
 *   θ(n) = (h/k_B) [((n + 3)/3) ⟨νⁿ⟩]^{1/n}  (n ≠ 0),   θ(0) = (h/k_B) exp(1/3 + ⟨ln ν⟩)
 * For a pure Debye DOS every θ(n) equals the Debye temperature.
 */
import { THZ_TO_K } from './units';

const SIMPSON_INTERVALS = 4000;
/** Beyond this t the integrands are below 1e-35 of their peak. */
const T_MAX = 120;

function simpson(f: (t: number) => number, upper: number): number {
  const n = SIMPSON_INTERVALS;
  const h = upper / n;
  let sum = f(0) + f(upper);
  for (let i = 1; i < n; i++) sum += (i % 2 ? 4 : 2) * f(i * h);
  return (sum * h) / 3;
}

/** ∫₀^y t³/(eᵗ − 1) dt. */
function planckIntegral(y: number): number {
  return simpson((t) => (t === 0 ? 0 : (t * t * t) / Math.expm1(t)), Math.min(y, T_MAX));
}

/** Debye function D₃(y); D₃(0) = 1. */
export function debyeFunction3(y: number): number {
  if (!(y >= 0)) throw new Error(`debyeFunction3: y must be ≥ 0, got ${y}`);
  if (y < 1e-4) return 1 - (3 * y) / 8 + (y * y) / 20;
  return (3 / (y * y * y)) * planckIntegral(y);
}

/** C_v/(3Nk_B) of the Debye model at x = θ/T (0 → 1, ∞ → 0). */
export function debyeHeatCapacity(x: number): number {
  if (!(x >= 0)) throw new Error(`debyeHeatCapacity: θ/T must be ≥ 0, got ${x}`);
  if (x < 1e-4) return 1 - (x * x) / 20;
  if (x > 1e4) return ((4 * Math.PI ** 4) / 5) / x ** 3; // T³ law, exact far below θ
  return 4 * debyeFunction3(x) - (3 * x) / Math.expm1(x);
}

/** S/(3Nk_B) of the Debye model at x = θ/T. */
export function debyeEntropy(x: number): number {
  if (!(x > 0)) throw new Error(`debyeEntropy: θ/T must be > 0, got ${x}`);
  return (4 / 3) * debyeFunction3(x) - Math.log1p(-Math.exp(-x));
}

/**
 * The Debye temperature (K) whose heat capacity at T equals `cvOver3NkB` (heat capacity per atom
 * over 3k_B, between 0 and 1): the usual "θ(T) from C_v" fit. Null outside (0, 1).
 */
export function debyeThetaFromHeatCapacity(cvOver3NkB: number, temperature: number): number | null {
  if (!(cvOver3NkB > 0 && cvOver3NkB < 1) || !(temperature > 0)) return null;
  let lo = 0;
  let hi = 1;
  while (debyeHeatCapacity(hi) > cvOver3NkB) hi *= 2;
  for (let i = 0; i < 200 && hi - lo > 1e-14 * hi; i++) {
    const mid = 0.5 * (lo + hi);
    if (debyeHeatCapacity(mid) > cvOver3NkB) lo = mid;
    else hi = mid;
  }
  return 0.5 * (lo + hi) * temperature;
}

/** Weighted real modes: frequencies (THz, > 0) and weights (any normalisation). */
export interface ModeSample {
  frequencies: ArrayLike<number>;
  weights: ArrayLike<number>;
}

/** θ(n) in K from weighted positive frequencies (see the header for the definition). */
export function momentTheta(modes: ModeSample, n: number): number {
  if (!(n > -3)) throw new Error(`momentTheta: the moment order must be > −3, got ${n}`);
  let wsum = 0;
  let acc = 0;
  for (let i = 0; i < modes.frequencies.length; i++) {
    const nu = modes.frequencies[i];
    const w = modes.weights[i];
    if (!(nu > 0) || !(w > 0)) continue;
    wsum += w;
    acc += w * (n === 0 ? Math.log(nu) : nu ** n);
  }
  if (wsum === 0) throw new Error('momentTheta: no real (positive) modes');
  const mean = acc / wsum;
  const nu = n === 0 ? Math.exp(1 / 3 + mean) : (((n + 3) / 3) * mean) ** (1 / n);
  return nu * THZ_TO_K;
}

/** hν_max/k_B in K: the Debye temperature if the spectrum ended like a Debye spectrum. */
export function cutoffTheta(modes: ModeSample): number {
  let max = 0;
  for (let i = 0; i < modes.frequencies.length; i++) {
    if (modes.weights[i] > 0 && modes.frequencies[i] > max) max = modes.frequencies[i];
  }
  return max * THZ_TO_K;
}
