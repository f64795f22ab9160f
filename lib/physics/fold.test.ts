import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import type { Lattice, Vec3 } from '../dispersion/types';
import { brillouinZone, cartesianLength, cubeZoneFraction, foldMany, foldToFirstZone, isInsideFirstZone, zoneFraction } from './fold';
import { fracToCart, reciprocal } from './lattice';

// Lattices of Setyawan & Curtarolo, Comput. Mater. Sci. 49, 299 (2010) (physics-ref §6.2), a = 1 Å
// so Cartesian lengths divided by 2π are in the 2π/a units of physics-ref §6.3–6.4.
const sc: Lattice = [
  [1, 0, 0],
  [0, 1, 0],
  [0, 0, 1],
];
const fcc: Lattice = [
  [0, 0.5, 0.5],
  [0.5, 0, 0.5],
  [0.5, 0.5, 0],
];
const bcc: Lattice = [
  [-0.5, 0.5, 0.5],
  [0.5, -0.5, 0.5],
  [0.5, 0.5, -0.5],
];
const hexCell = (cOverA: number): Lattice => [
  [0.5, -Math.sqrt(3) / 2, 0],
  [0.5, Math.sqrt(3) / 2, 0],
  [0, 0, cOverA],
];
const hex = hexCell(1.6);
// Invented oblique cells without symmetry; the second is strongly sheared.
const triclinic: Lattice = [
  [3.1, 0.2, -0.1],
  [0.9, 2.7, 0.3],
  [-0.6, 1.1, 4.2],
];
const sheared: Lattice = [
  [2.0, 0, 0],
  [1.7, 0.6, 0],
  [0.9, 0.4, 1.1],
];

const TWO_PI = 2 * Math.PI;
const len = (q: ArrayLike<number>, lat: Lattice) => cartesianLength(q, reciprocal(lat)) / TWO_PI; // in 2π/a for a = 1

/** Reference: wrap each fraction, then try every G with |n_i| ≤ 4 and keep the shortest. */
function bruteForce(q: ArrayLike<number>, b: Lattice): number {
  const w0 = q[0] - Math.round(q[0]);
  const w1 = q[1] - Math.round(q[1]);
  const w2 = q[2] - Math.round(q[2]);
  let best = Infinity;
  for (let i = -4; i <= 4; i++)
    for (let j = -4; j <= 4; j++)
      for (let k = -4; k <= 4; k++) {
        let s = 0;
        for (let c = 0; c < 3; c++) {
          const v = (w0 - i) * b[0][c] + (w1 - j) * b[1][c] + (w2 - k) * b[2][c];
          s += v * v;
        }
        if (s < best) best = s;
      }
  return Math.sqrt(best);
}

describe('foldToFirstZone matches a brute-force search over G', () => {
  const coord = fc.double({ min: -3, max: 3, noNaN: true, noDefaultInfinity: true });
  const point = fc.tuple(coord, coord, coord);
  const cases: [string, Lattice][] = [
    ['fcc', fcc],
    ['bcc', bcc],
    ['hexagonal', hex],
    ['triclinic', triclinic],
    ['sheared triclinic', sheared],
  ];
  for (const [name, lat] of cases) {
    it(`${name}: shortest image, idempotent, never longer (10,000 points)`, () => {
      const b = reciprocal(lat);
      fc.assert(
        fc.property(point, (q) => {
          const f = foldToFirstZone(q, lat);
          const lf = cartesianLength(f, b);
          const lq = cartesianLength(q, b);
          const again = foldToFirstZone(f, lat);
          return (
            // Equal length to the brute-force shortest (ties may pick another image).
            Math.abs(lf - bruteForce(q, b)) < 1e-9 * Math.max(1, lq) &&
            // q − folded is a reciprocal-lattice vector.
            q.every((x, c) => Math.abs(x - f[c] - Math.round(x - f[c])) < 1e-9) &&
            lf <= lq + 1e-12 &&
            again[0] === f[0] &&
            again[1] === f[1] &&
            again[2] === f[2] &&
            isInsideFirstZone(f, lat)
          );
        }),
        { seed: 20240611, numRuns: 10_000 },
      );
    });
  }

  it('finds the faces of each zone: 14 (truncated octahedron), 12 (rhombic dodecahedron), 8 (hexagonal prism), 6 (cube)', () => {
    // Face counts of the Wigner–Seitz cells of the bcc, fcc, hexagonal and simple cubic
    // reciprocal lattices (Ashcroft & Mermin Ch. 4–5, from memory); a generic 3-D lattice has 14.
    expect(brillouinZone(fcc).relevantNorm2.length).toBe(14);
    expect(brillouinZone(bcc).relevantNorm2.length).toBe(12);
    expect(brillouinZone(hex).relevantNorm2.length).toBe(8);
    expect(brillouinZone(sc).relevantNorm2.length).toBe(6);
    expect(brillouinZone(triclinic).relevantNorm2.length).toBe(14);
    expect(brillouinZone(sheared).relevantNorm2.length).toBe(14);
  });
});

describe('foldToFirstZone on a sheared slab (long c, as in 2-D material models)', () => {
  // Invented cell: 3 Å in-plane, 40 Å along the stacking direction, tilted.
  const slab: Lattice = [
    [3, 0, 0],
    [1.4, 2.7, 0],
    [2.2, 1.1, 40],
  ];
  it('matches a brute-force search with a long range along the short reciprocal vector', () => {
    const b = reciprocal(slab);
    const brute = (q: Vec3) => {
      const w = q.map((x) => x - Math.round(x));
      let best = Infinity;
      for (let i = -4; i <= 4; i++)
        for (let j = -4; j <= 4; j++)
          for (let k = -30; k <= 30; k++) best = Math.min(best, cartesianLength([w[0] - i, w[1] - j, w[2] - k], b));
      return best;
    };
    const coord = fc.double({ min: -3, max: 3, noNaN: true, noDefaultInfinity: true });
    fc.assert(
      fc.property(fc.tuple(coord, coord, coord), (q) => {
        const f = foldToFirstZone(q, slab);
        return Math.abs(cartesianLength(f, b) - brute(q)) < 1e-9 * Math.max(1, cartesianLength(q, b));
      }),
      { seed: 99, numRuns: 500 },
    );
  });
});

describe('high-symmetry points lie on the zone boundary', () => {
  // Fractional coordinates of Setyawan & Curtarolo 2010 (physics-ref §6.3).
  const points: [string, Lattice, Record<string, Vec3>][] = [
    ['sc', sc, { X: [0, 0.5, 0], M: [0.5, 0.5, 0], R: [0.5, 0.5, 0.5] }],
    [
      'fcc',
      fcc,
      { X: [0.5, 0, 0.5], L: [0.5, 0.5, 0.5], W: [0.5, 0.25, 0.75], K: [0.375, 0.375, 0.75], U: [0.625, 0.25, 0.625] },
    ],
    ['bcc', bcc, { H: [0.5, -0.5, 0.5], N: [0, 0, 0.5], P: [0.25, 0.25, 0.25] }],
    [
      'hex',
      hex,
      { M: [0.5, 0, 0], K: [1 / 3, 1 / 3, 0], A: [0, 0, 0.5], L: [0.5, 0, 0.5], H: [1 / 3, 1 / 3, 0.5] },
    ],
  ];
  for (const [name, lat, pts] of points) {
    for (const [label, q] of Object.entries(pts)) {
      it(`${name} ${label}`, () => {
        expect(isInsideFirstZone(q, lat)).toBe(true);
        // A boundary point is not moved to its equal-length image.
        expect(foldToFirstZone(q, lat)).toEqual(q);
        const out = q.map((x) => x * (1 + 1e-4));
        expect(isInsideFirstZone(out, lat)).toBe(false);
        expect(isInsideFirstZone(q.map((x) => x * (1 - 1e-4)), lat)).toBe(true);
      });
    }
  }

  it('fcc lengths X = 1, L = √3/2, W = √5/2, K = U = 3√2/4 (2π/a)', () => {
    // physics-ref §6.3 (Setyawan & Curtarolo 2010).
    expect(len([0.5, 0, 0.5], fcc)).toBeCloseTo(1, 12);
    expect(len([0.5, 0.5, 0.5], fcc)).toBeCloseTo(Math.sqrt(3) / 2, 12);
    expect(len([0.5, 0.25, 0.75], fcc)).toBeCloseTo(Math.sqrt(5) / 2, 12);
    expect(len([0.375, 0.375, 0.75], fcc)).toBeCloseTo((3 * Math.SQRT2) / 4, 12);
    expect(len([0.625, 0.25, 0.625], fcc)).toBeCloseTo((3 * Math.SQRT2) / 4, 12);
  });
});

describe('zoneFraction: the way from Γ to the zone boundary along q', () => {
  it('is 1 at the high-symmetry points on the boundary and scales linearly towards Γ', () => {
    const cases: [Lattice, Vec3][] = [
      [sc, [0, 0.5, 0]],
      [sc, [0.5, 0.5, 0.5]],
      [fcc, [0.5, 0, 0.5]],
      [fcc, [0.5, 0.5, 0.5]],
      [fcc, [0.375, 0.375, 0.75]],
      [bcc, [0.5, -0.5, 0.5]],
      [hex, [1 / 3, 1 / 3, 0]],
      [hex, [0, 0, 0.5]],
    ];
    for (const [lat, q] of cases) {
      const z = brillouinZone(lat);
      expect(zoneFraction(z, q), q.join(',')).toBeCloseTo(1, 12);
      for (const t of [0, 0.1, 0.37]) expect(zoneFraction(z, q.map((x) => t * x))).toBeCloseTo(t, 12);
    }
  });

  it('is |q| over the distance to the boundary in q\'s direction, in the reciprocal metric (fcc Γ–L vs Γ–X)', () => {
    // Along Γ–L the boundary is at √3/2 (2π/a), along Γ–X at 1: the same |q| is further out towards L.
    const z = brillouinZone(fcc);
    const towardsL: Vec3 = [0.05, 0.05, 0.05];
    const towardsX: Vec3 = [0.1, 0, 0.1].map((x) => (x * len(towardsL, fcc)) / len([0.1, 0, 0.1], fcc)) as Vec3;
    expect(len(towardsX, fcc)).toBeCloseTo(len(towardsL, fcc), 12);
    expect(zoneFraction(z, towardsL)).toBeCloseTo(0.1, 12);
    expect(zoneFraction(z, towardsX)).toBeCloseTo(0.1 * (Math.sqrt(3) / 2), 12);
  });

  it('without a lattice measures against the cube [−½, ½]³', () => {
    expect(cubeZoneFraction([0, 0, 0])).toBe(0);
    expect(cubeZoneFraction([0.05, -0.02, 0])).toBeCloseTo(0.1, 15);
    expect(cubeZoneFraction([-0.5, 0.5, 0.1])).toBe(1);
  });
});

describe('folding examples (physics-ref §6.4)', () => {
  it('sc (0.6, 0, 0) → (−0.4, 0, 0); (0.7, −0.8, 1.2) → (−0.3, 0.2, 0.2), 0.4123', () => {
    const f1 = foldToFirstZone([0.6, 0, 0], sc);
    expect(f1[0]).toBeCloseTo(-0.4, 12);
    const f2 = foldToFirstZone([0.7, -0.8, 1.2], sc);
    [-0.3, 0.2, 0.2].forEach((v, i) => expect(f2[i]).toBeCloseTo(v, 12));
    expect(len(f2, sc)).toBeCloseTo(0.4123, 4);
  });

  it('fcc (0.4, 0.4, −0.4) → (0.4, 0.4, 0.6), |k| 1.3266 → 0.8718 (a per-component wrap is wrong here)', () => {
    const q: Vec3 = [0.4, 0.4, -0.4];
    expect(len(q, fcc)).toBeCloseTo(1.3266, 4);
    expect(isInsideFirstZone(q, fcc)).toBe(false);
    const f = foldToFirstZone(q, fcc);
    [0.4, 0.4, 0.6].forEach((v, i) => expect(f[i]).toBeCloseTo(v, 12));
    expect(len(f, fcc)).toBeCloseTo(0.8718, 4);
    const k = fracToCart(f, reciprocal(fcc)).map((x) => x / TWO_PI);
    [0.6, 0.6, 0.2].forEach((v, i) => expect(k[i]).toBeCloseTo(v, 12));
    // Without the lattice the same point stays put (component-wise it is "inside").
    expect(foldToFirstZone(q, null)).toEqual(q);
  });

  it('fcc (0.6, 0.6, 0) → (−0.4, −0.4, 0), |k| 0.8', () => {
    const f = foldToFirstZone([0.6, 0.6, 0], fcc);
    [-0.4, -0.4, 0].forEach((v, i) => expect(f[i]).toBeCloseTo(v, 12));
    expect(len(f, fcc)).toBeCloseTo(0.8, 12);
  });

  it('fcc X on a face (0.5, 0.5, 0) stays, |k| 1', () => {
    expect(foldToFirstZone([0.5, 0.5, 0], fcc)).toEqual([0.5, 0.5, 0]);
    expect(len([0.5, 0.5, 0], fcc)).toBeCloseTo(1, 12);
  });

  it('bcc (0.5, 0.5, 0.5) → an H point, |k| 1.7321 → 1', () => {
    const q: Vec3 = [0.5, 0.5, 0.5];
    expect(len(q, bcc)).toBeCloseTo(1.7321, 4);
    const f = foldToFirstZone(q, bcc);
    expect(len(f, bcc)).toBeCloseTo(1, 12);
    // H images are (±1,0,0), (0,±1,0), (0,0,±1) in 2π/a; which one is a tie.
    const k = fracToCart(f, reciprocal(bcc)).map((x) => Math.abs(x / TWO_PI));
    expect(k.sort()).toEqual([expect.closeTo(0, 12), expect.closeTo(0, 12), expect.closeTo(1, 12)]);
  });

  it('bcc (0.4, −0.4, 0.4) stays (inside)', () => {
    expect(foldToFirstZone([0.4, -0.4, 0.4], bcc)).toEqual([0.4, -0.4, 0.4]);
  });

  it('hex c/a 1.6: (0.6, 0.2, 0.1) → (−0.4, 0.2, 0.1), 0.4049; (⅔, ⅓, 0) → (−⅓, ⅓, 0), 0.3849', () => {
    expect(len([0.6, 0.2, 0.1], hex)).toBeCloseTo(0.835, 3);
    const f = foldToFirstZone([0.6, 0.2, 0.1], hex);
    [-0.4, 0.2, 0.1].forEach((v, i) => expect(f[i]).toBeCloseTo(v, 12));
    expect(len(f, hex)).toBeCloseTo(0.4049, 4);
    const g = foldToFirstZone([2 / 3, 1 / 3, 0], hex);
    [-1 / 3, 1 / 3, 0].forEach((v, i) => expect(g[i]).toBeCloseTo(v, 12));
    expect(len(g, hex)).toBeCloseTo(0.3849, 4);
  });

  it('hex K: |K| = 4π/(3a) whatever the image', () => {
    const f = foldToFirstZone([1 / 3 + 1, 1 / 3 - 2, 0], hex);
    expect(cartesianLength(f, reciprocal(hex))).toBeCloseTo((4 * Math.PI) / 3, 10);
  });
});

describe('component-wise folding without a lattice', () => {
  it('folds into [−½, ½] and keeps ±½', () => {
    expect(foldToFirstZone([0.7, -1.2, 0.5], null).map((x) => +x.toFixed(12))).toEqual([-0.3, -0.2, 0.5]);
    expect(foldToFirstZone([-0.5, 1.5, 2], null).map((x) => +x.toFixed(12))).toEqual([-0.5, -0.5, 0]);
  });
});

describe('foldMany', () => {
  it('agrees with the single-point fold and marks moved points', () => {
    const src = Float64Array.from([0.4, 0.4, -0.4, 0.1, 0, 0, 1, 1, 1]);
    const dst = new Float64Array(9);
    const moved = foldMany(src, fcc, dst);
    expect(Array.from(moved)).toEqual([1, 0, 1]);
    expect(Array.from(dst.subarray(0, 3))).toEqual(foldToFirstZone([0.4, 0.4, -0.4], fcc));
    expect(Array.from(dst.subarray(6, 9))).toEqual([0, 0, 0]);
  });

  it('folds a million points quickly', () => {
    const n = 1_000_000;
    const src = new Float64Array(n * 3);
    let s = 12345;
    for (let i = 0; i < src.length; i++) {
      s = (s * 1103515245 + 12345) % 2147483648;
      src[i] = (s / 2147483648) * 4 - 2;
    }
    const dst = new Float64Array(n * 3);
    const t0 = performance.now();
    foldMany(src, triclinic, dst);
    const ms = performance.now() - t0;
    expect(ms).toBeLessThan(3000);
  });
});
