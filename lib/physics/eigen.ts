/**
 * Small dense eigen-solvers for dynamical matrices (at most a few dozen rows).
 * Cyclic Jacobi rotations: slow for big matrices, but simple, unconditionally stable and
 * accurate to round-off for the 3×3 … 12×12 matrices the models build.
 */

const MAX_SWEEPS = 100;

/**
 * Eigenvalues of a real symmetric n×n matrix (row-major, only read, never modified), ascending
 * with their sign (a negative eigenvalue stays negative: it becomes an imaginary mode).
 */
export function symmetricEigenvalues(matrix: ArrayLike<number>, n: number): Float64Array {
  if (matrix.length !== n * n) {
    throw new Error(`symmetricEigenvalues: expected ${n * n} entries for a ${n}×${n} matrix, got ${matrix.length}`);
  }
  const a = Float64Array.from(matrix);
  for (let i = 0; i < n; i++) {
    for (let j = i + 1; j < n; j++) {
      const mean = 0.5 * (a[i * n + j] + a[j * n + i]);
      a[i * n + j] = mean;
      a[j * n + i] = mean;
    }
  }
  let scale = 0;
  for (let i = 0; i < n * n; i++) scale = Math.max(scale, Math.abs(a[i]));
  if (scale === 0) return new Float64Array(n);
  // Off-diagonal entries this small move no eigenvalue by more than round-off of the largest entry.
  const negligible = scale * 1e-16;

  for (let sweep = 0; sweep < MAX_SWEEPS; sweep++) {
    let rotations = 0;
    for (let p = 0; p < n - 1; p++) {
      for (let q = p + 1; q < n; q++) {
        const apq = a[p * n + q];
        if (Math.abs(apq) <= negligible) {
          a[p * n + q] = 0;
          a[q * n + p] = 0;
          continue;
        }
        rotations++;
        const app = a[p * n + p];
        const aqq = a[q * n + q];
        const theta = (aqq - app) / (2 * apq);
        const t = Math.sign(theta || 1) / (Math.abs(theta) + Math.sqrt(theta * theta + 1));
        const c = 1 / Math.sqrt(t * t + 1);
        const s = t * c;
        for (let k = 0; k < n; k++) {
          const akp = a[k * n + p];
          const akq = a[k * n + q];
          a[k * n + p] = c * akp - s * akq;
          a[k * n + q] = s * akp + c * akq;
        }
        for (let k = 0; k < n; k++) {
          const apk = a[p * n + k];
          const aqk = a[q * n + k];
          a[p * n + k] = c * apk - s * aqk;
          a[q * n + k] = s * apk + c * aqk;
        }
        a[p * n + q] = 0;
        a[q * n + p] = 0;
      }
    }
    if (rotations === 0) break;
  }
  const values = new Float64Array(n);
  for (let i = 0; i < n; i++) values[i] = a[i * n + i];
  return values.sort();
}

/**
 * Eigenvalues of a Hermitian n×n matrix H = re + i·im (row-major), ascending.
 * H is diagonalised through the real symmetric 2n×2n matrix [[re, −im], [im, re]], whose
 * spectrum is that of H with every eigenvalue doubled; every second value is kept.
 */
export function hermitianEigenvalues(re: ArrayLike<number>, im: ArrayLike<number>, n: number): Float64Array {
  if (re.length !== n * n || im.length !== n * n) {
    throw new Error(`hermitianEigenvalues: expected ${n * n} real and imaginary entries for a ${n}×${n} matrix`);
  }
  const m = 2 * n;
  const big = new Float64Array(m * m);
  for (let i = 0; i < n; i++) {
    for (let j = 0; j < n; j++) {
      const r = re[i * n + j];
      const c = im[i * n + j];
      big[i * m + j] = r;
      big[(i + n) * m + (j + n)] = r;
      big[i * m + (j + n)] = -c;
      big[(i + n) * m + j] = c;
    }
  }
  const doubled = symmetricEigenvalues(big, m);
  const values = new Float64Array(n);
  for (let i = 0; i < n; i++) values[i] = 0.5 * (doubled[2 * i] + doubled[2 * i + 1]);
  return values;
}
