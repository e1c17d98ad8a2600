import { describe, it, expect } from 'vitest';
import { prismGzFactor } from '../../src/kernels/prism.js';
import { assertClose } from '../helpers/assert-close.js';
import { gaussLegendre, prismByQuadrature } from '../helpers/gauss-legendre.js';

const G = 6.6743e-11; // [CODATA2018], the value physics.md's check values use
const RHO = 2670;
const toMgal = (factor: number): number => (G * RHO * factor) / 1e-5;
const GL8 = gaussLegendre(8);

describe('prismGzFactor: physics.md §5 check values', () => {
  // docs/physics.md §5 "Right rectangular prism" table [calc], printed to 10 decimals:
  // tolerance = half a unit in the 10th decimal.
  const table: Array<[number, number, number, number, number, number, number]> = [
    [-50, 50, -50, 50, 10, 60, 2.7707754343],
    [100, 200, -50, 50, 5, 35, 0.0353850001],
    [100, 200, -50, 50, -100, 0, -0.2205563863], // above the station: negative (z down)
  ];
  for (const [x1, x2, y1, y2, z1, z2, mgal] of table) {
    it(`prism ${x1},${x2} / ${y1},${y2} / ${z1},${z2} gives ${mgal} mGal`, () => {
      assertClose(toMgal(prismGzFactor(x1, x2, y1, y2, z1, z2)), mgal, { abs: 5e-11 });
    });
  }

  it('square prism t = 100 m at the top-face centre: a/t = 1, 10, 100', () => {
    // docs/physics.md §5 [calc], 10 decimals: half a unit in the 10th decimal.
    const expected: Array<[number, number]> = [
      [1, 6.9099457745],
      [10, 10.6938847022],
      [100, 11.1464730078],
    ];
    for (const [ratio, mgal] of expected) {
      const a = ratio * 100;
      assertClose(toMgal(prismGzFactor(-a, a, -a, a, 0, 100)), mgal, { abs: 5e-11 }, `a/t=${ratio}`);
    }
  });

  it('unit cube: top-face centre, top corner, top-edge midpoint', () => {
    // docs/physics.md §5 [calc], g_z/(G rho a), 15 significant digits: 2e-15 relative (a few ulp).
    assertClose(prismGzFactor(-0.5, 0.5, -0.5, 0.5, 0, 1), 2.596896578258365, { rel: 2e-15 }, 'face centre');
    assertClose(prismGzFactor(0, 1, 0, 1, 0, 1), 0.969388052712568, { rel: 2e-15 }, 'corner');
    assertClose(prismGzFactor(-0.5, 0.5, 0, 1, 0, 1), 1.551694097314306, { rel: 2e-15 }, 'edge midpoint');
  });
});

describe('prismGzFactor: limits and identities', () => {
  it('prism → 2πt for a 200 km wide slab, 1 m thick, bracketed by inscribed and circumscribed cylinders', () => {
    // The integrand z/r^3 is positive, so the square (half-width a) lies between the coaxial
    // cylinders of radius a and a√2: F_cyl(R) = 2π (t + R - sqrt(R^2 + t^2)) (on-axis cylinder,
    // common practice; the same closed form as [Hammer1939] with r1 = 0). Both are within
    // π t^2 / a = 3e-5 m of the slab value 2πt = 6.283 m [practice: Bouguer slab].
    const a = 100_000;
    const t = 1;
    // R - sqrt(R^2 + t^2) written as -t^2 / (R + sqrt(R^2 + t^2)) to avoid cancellation.
    const cylinder = (radius: number): number =>
      2 * Math.PI * (t - (t * t) / (radius + Math.sqrt(radius * radius + t * t)));
    const f = prismGzFactor(-a, a, -a, a, 0, t);
    expect(f).toBeGreaterThanOrEqual(cylinder(a));
    expect(f).toBeLessThanOrEqual(cylinder(a * Math.SQRT2));
    // 2πt within the cylinder bracket width plus rounding: relative 1e-5.
    assertClose(f, 2 * Math.PI * t, { rel: 1e-5 });
  });

  it('mirror symmetry x → -x and y → -y, antisymmetry z → -z', () => {
    // The formula is algebraically symmetric; only rounding paths differ: 1e-14 relative.
    const cases: Array<[number, number, number, number, number, number]> = [
      [30, 90, -20, 70, 5, 40],
      [-10, 25, 3, 8, -30, 12],
      [-5, 5, -7, 9, 0, 20],
    ];
    for (const [x1, x2, y1, y2, z1, z2] of cases) {
      const f = prismGzFactor(x1, x2, y1, y2, z1, z2);
      assertClose(prismGzFactor(-x2, -x1, y1, y2, z1, z2), f, { rel: 1e-14 }, 'x mirror');
      assertClose(prismGzFactor(x1, x2, -y2, -y1, z1, z2), f, { rel: 1e-14 }, 'y mirror');
      assertClose(prismGzFactor(x1, x2, y1, y2, -z2, -z1), -f, { rel: 1e-14 }, 'z antisymmetry');
    }
  });

  it('superposition: 8 sub-prisms sum to the whole within 1e-12 relative', () => {
    // Each sub-prism carries its own rounding (~1e-15 of terms of the prism size): 1e-12 leaves
    // room for the modest cancellation of neighbouring sub-prisms near the station.
    const cases: Array<[number, number, number, number, number, number, number, number, number]> = [
      [-50, 50, -50, 50, 10, 60, 7, -13, 31], // station above, split inside
      [100, 200, -50, 50, 5, 35, 150, 0, 20],
      [-40, 60, -30, 80, -25, 45, 0, 0, 0], // station inside, split at the station itself
      [-40, 60, -30, 80, -70, -5, 10, 20, -30], // mass above the station, inside footprint
    ];
    for (const [x1, x2, y1, y2, z1, z2, xm, ym, zm] of cases) {
      const whole = prismGzFactor(x1, x2, y1, y2, z1, z2);
      let sum = 0;
      for (const [xa, xb] of [[x1, xm], [xm, x2]] as const) {
        for (const [ya, yb] of [[y1, ym], [ym, y2]] as const) {
          for (const [za, zb] of [[z1, zm], [zm, z2]] as const) sum += prismGzFactor(xa, xb, ya, yb, za, zb);
        }
      }
      assertClose(sum, whole, { rel: 1e-12 }, `split at ${xm},${ym},${zm}`);
    }
  });

  it('zero thickness or zero width gives exactly 0', () => {
    expect(prismGzFactor(-5, 5, -5, 5, 10, 10)).toBe(0);
    expect(prismGzFactor(-5, 5, -5, 5, 0, 0)).toBe(0);
    expect(prismGzFactor(3, 3, -5, 5, 0, 10)).toBe(0);
    expect(prismGzFactor(-5, 5, 2, 2, -4, 10)).toBe(0);
  });

  it('swapped bounds negate the result', () => {
    const f = prismGzFactor(10, 30, -5, 15, 2, 9);
    assertClose(prismGzFactor(30, 10, -5, 15, 2, 9), -f, { rel: 1e-14 }); // rounding paths only
    assertClose(prismGzFactor(10, 30, -5, 15, 9, 2), -f, { rel: 1e-14 });
  });
});

describe('prismGzFactor: singular station positions', () => {
  // Station on faces, edges, corners, their extensions and inside the footprint. Each value
  // must be finite and continuous: moving the station by delta = 1e-6 m changes F by at most
  // delta * |grad F|, and |grad F| (the gravity-gradient tensor over G rho) is bounded by
  // 4π (its jump across a face) plus a log singularity at edges, ≤ 8 ln(L/delta) for a prism
  // of size L (common practice). The test allows 3 times that bound.
  const delta = 1e-6;
  const cases: Array<[string, number, number, number, number, number, number]> = [
    ['top-face centre', -5, 5, -5, 5, 0, 10],
    ['bottom-face centre (mass above)', -5, 5, -5, 5, -10, 0],
    ['side-face centre', 0, 10, -5, 5, -5, 5],
    ['top edge', 0, 10, -5, 5, 0, 10],
    ['vertical edge', 0, 10, 0, 10, -5, 5],
    ['top corner', 0, 10, 0, 10, 0, 10],
    ['bottom corner', 0, 10, 0, 10, -10, 0],
    ['on a top edge extension', 10, 20, 0, 10, 0, 10],
    ['on a vertical edge extension', 0, 10, 0, 10, 5, 15],
    ['in the top-face plane, outside', 10, 20, 10, 20, 0, 10],
    ['inside footprint, mass below with gap', -5, 7, -3, 9, 4, 10],
    ['inside footprint, mass above with gap', -5, 7, -3, 9, -10, -4],
    ['inside footprint, level (top at station)', -5, 7, -3, 9, 0, 10],
    ['inside the prism (straddling)', -5, 7, -3, 9, -4, 10],
  ];
  for (const [name, x1, x2, y1, y2, z1, z2] of cases) {
    it(`${name}: finite and continuous within 1e-6 m`, () => {
      const f = prismGzFactor(x1, x2, y1, y2, z1, z2);
      expect(Number.isFinite(f)).toBe(true);
      const size = Math.max(x2 - x1, y2 - y1, z2 - z1);
      const bound = 3 * delta * (4 * Math.PI + 8 * Math.log(size / delta));
      for (const [dx, dy, dz] of [
        [delta, 0, 0],
        [-delta, 0, 0],
        [0, delta, 0],
        [0, -delta, 0],
        [0, 0, delta],
        [0, 0, -delta],
        [delta, delta, delta],
      ] as const) {
        // Moving the station by +d equals moving the prism by -d.
        const g = prismGzFactor(x1 - dx, x2 - dx, y1 - dy, y2 - dy, z1 - dz, z2 - dz);
        expect(Number.isFinite(g)).toBe(true);
        assertClose(g, f, { abs: bound }, `${name} shifted ${dx},${dy},${dz}`);
      }
    });
  }

  it('symmetric prism straddling the station attracts nothing', () => {
    // Point symmetry about the station: exact 0 up to rounding of terms of size ~1 m.
    assertClose(prismGzFactor(-0.5, 0.5, -0.5, 0.5, -0.5, 0.5), 0, { abs: 1e-15 });
  });

  it('station at the bottom-face centre of the unit cube gives minus the top-face value', () => {
    // z antisymmetry with the physics.md unit-cube value [calc]: a few ulp.
    assertClose(prismGzFactor(-0.5, 0.5, -0.5, 0.5, -1, 0), -2.596896578258365, { rel: 2e-15 });
  });
});

describe('prismGzFactor: the atan2 trap (station inside the footprint)', () => {
  // Reference: exact vertical integral with panelled Gauss-Legendre over x and y, panels split
  // at the station so the integrand (peak width ≥ the 4 m gap) is smooth on each panel; 8
  // points on 16 panels per 6 m converge far below 1e-10 relative, the tolerance used.
  function reference(x1: number, x2: number, y1: number, y2: number, z1: number, z2: number): number {
    let sum = 0;
    for (const [xa, xb] of [[x1, 0], [0, x2]] as const) {
      for (const [ya, yb] of [[y1, 0], [0, y2]] as const) sum += prismByQuadrature(xa, xb, ya, yb, z1, z2, GL8, 16);
    }
    return sum;
  }
  /** The flawed variant with atan2(x y, z r): correct below the station, wrong where z < 0. */
  function atan2Variant(x1: number, x2: number, y1: number, y2: number, z1: number, z2: number): number {
    let b = 0;
    for (const [x, sx] of [[x1, -1], [x2, 1]] as const) {
      for (const [y, sy] of [[y1, -1], [y2, 1]] as const) {
        for (const [z, sz] of [[z1, -1], [z2, 1]] as const) {
          const r = Math.sqrt(x * x + y * y + z * z);
          b += sx * sy * sz * (x * Math.log(y + r) + y * Math.log(x + r) - z * Math.atan2(x * y, z * r));
        }
      }
    }
    return -b;
  }

  it('mass above the station: closed form matches quadrature; atan2 would be off by 4π dz', () => {
    const box = [-5, 7, -3, 9, -10, -4] as const;
    const ref = reference(...box);
    assertClose(prismGzFactor(...box), ref, { rel: 1e-10 });
    // The trap is real for this geometry: with z < 0 each of the 4 corner angles of a level
    // gains π sign(x y), which the corner signs add up to 4π per level, so the variant is off
    // by 4π (z2 - z1) = 4π * 6 m (derived here; rounding only, 1e-9 relative).
    assertClose(atan2Variant(...box) - ref, 4 * Math.PI * 6, { rel: 1e-9 });
  });

  it('mass below the station: closed form matches quadrature', () => {
    const box = [-5, 7, -3, 9, 4, 10] as const;
    assertClose(prismGzFactor(...box), reference(...box), { rel: 1e-10 });
  });

  it('straddling and level: superposition of the gap cases', () => {
    // F(-10, 10) = F(-10, -4) + F(-4, 4) + F(4, 10) and F(-4, 4) = 0 by z antisymmetry.
    const up = reference(-5, 7, -3, 9, -10, -4);
    const down = reference(-5, 7, -3, 9, 4, 10);
    assertClose(prismGzFactor(-5, 7, -3, 9, -10, 10), up + down, { rel: 1e-10, abs: 1e-12 });
    // Level case (top at the station, z = 0 terms dropped): F(0, 10) = F(0, 4) + F(4, 10). The
    // level case itself is pinned by the square-prism and unit-cube check values above.
    assertClose(prismGzFactor(-5, 7, -3, 9, 0, 10), prismGzFactor(-5, 7, -3, 9, 0, 4) + down, { rel: 1e-10 });
  });
});
