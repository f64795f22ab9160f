import { EV_A2_AMU_TO_THZ } from '../physics/units';

/**
 * ω² in eV/(Å² amu) → ν in THz; a negative eigenvalue (unstable mode) becomes −√|λ|,
 * the usual "negative frequency" for an imaginary mode.
 */
export function eigenvalueToTHz(lambda: number): number {
  return lambda >= 0 ? Math.sqrt(lambda) * EV_A2_AMU_TO_THZ : -Math.sqrt(-lambda) * EV_A2_AMU_TO_THZ;
}

/** In place; ascending order is kept because the map is monotone. */
export function eigenvaluesToTHz(lambdas: Float64Array): Float64Array {
  for (let i = 0; i < lambdas.length; i++) lambdas[i] = eigenvalueToTHz(lambdas[i]);
  return lambdas;
}
