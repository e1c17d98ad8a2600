/**
 * The regression statistics behind the density estimates, checked against general-purpose
 * libraries (Python 3.11 `statistics` and numpy 2.4.6, values stored once in
 * test/fixtures/density/regression-reference.json by the script beside it) and against a
 * published worked example.
 */
import { describe, expect, it } from 'vitest';
import { readFileSync } from 'node:fs';
import { leastSquares, pearson } from '../../src/density/least-squares.js';
import { nettleton } from '../../src/density/nettleton.js';
import { parasnis } from '../../src/density/parasnis.js';
import type { DensityInput } from '../../src/density/input.js';
import { median, robustSigma } from '../../src/density/robust-fit.js';
import { assertClose } from '../helpers/assert-close.js';

interface Reference {
  simple: { x: number[]; y: number[]; slope: number; intercept: number; correlation: number; r2: number; slopeStderr: number; interceptStderr: number };
  weighted: { w: number[]; slope: number; intercept: number; slopeStderr: number };
  multiple: { x1: number[]; east: number[]; north: number[]; y: number[]; coef: number[]; intercept: number; stderr: number[]; r2: number };
  nettleton: { x: number[]; y: number[]; t: number[]; zeroDensityKgM3: number; corrAt: Record<string, number> };
}
const ref = JSON.parse(readFileSync(new URL('../fixtures/density/regression-reference.json', import.meta.url), 'utf8')) as Reference;

/** Different algorithms (centred normal equations here; QR/SVD in numpy) agree to ~1e-13 on these well-conditioned data: 1e-10 relative leaves room. */
const REL = { rel: 1e-10 };

/** A DensityInput whose Parasnis variables are (x, y): BC_unit = x, TC_unit = 0, FAA = y. */
function inputFrom(x: number[], y: number[], h: number[] = x, e?: number[], nn?: number[]): DensityInput {
  const n = x.length;
  return {
    source: 'reference',
    ids: x.map((_, i) => `P${i}`),
    lines: x.map((_, i) => i + 2),
    rowIndex: Int32Array.from(x, (_, i) => i),
    x: Float64Array.from(e ?? x),
    y: Float64Array.from(nn ?? x),
    coords: 'projected',
    heightM: Float64Array.from(h),
    faaMgal: Float64Array.from(y),
    bouguerUnitMgal: Float64Array.from(x),
    tcUnitMgal: new Float64Array(n),
    skippedRows: 0,
  };
}

describe('least squares and correlation vs statistics / numpy', () => {
  it('simple regression: slope, intercept (statistics.linear_regression), standard errors (numpy.polyfit cov=True), R^2', () => {
    const s = ref.simple;
    const f = leastSquares([s.x], s.y);
    assertClose(f.coef[0] as number, s.slope, REL, 'slope');
    assertClose(f.intercept, s.intercept, REL, 'intercept');
    assertClose(f.stderr[0] as number, s.slopeStderr, REL, 'slope stderr');
    assertClose(f.interceptStderr, s.interceptStderr, REL, 'intercept stderr');
    assertClose(f.r2, s.r2, REL, 'R^2');
    assertClose(pearson(s.x, s.y), s.correlation, REL, 'Pearson r (statistics.correlation)');
  });

  it('weighted regression matches numpy.polyfit with w = sqrt(weights)', () => {
    const f = leastSquares([ref.simple.x], ref.simple.y, ref.weighted.w);
    assertClose(f.coef[0] as number, ref.weighted.slope, REL, 'slope');
    assertClose(f.intercept, ref.weighted.intercept, REL, 'intercept');
    assertClose(f.stderr[0] as number, ref.weighted.slopeStderr, REL, 'slope stderr');
  });

  it('three predictors with projected-coordinate offsets match numpy.linalg.lstsq and s^2 (A^T A)^-1', () => {
    const m = ref.multiple;
    const f = leastSquares([m.x1, m.east, m.north], m.y);
    m.coef.forEach((c, j) => assertClose(f.coef[j] as number, c, { rel: 1e-8 }, `coef ${j}`)); // coordinate columns of 5e5..4e6 m cost a few digits in either algorithm
    m.stderr.forEach((s, j) => assertClose(f.stderr[j] as number, s, { rel: 1e-8 }, `stderr ${j}`));
    // the intercept is extrapolated 4000 km to the coordinate origin: 1e-6 relative
    assertClose(f.intercept, m.intercept, { rel: 1e-6 }, 'intercept');
    assertClose(f.r2, m.r2, REL, 'R^2');
  });

  it('Parasnis on the same numbers: density = 1000 x slope, stderr = 1000 x slope stderr', () => {
    const p = parasnis(inputFrom(ref.simple.x, ref.simple.y));
    assertClose(p.densityKgM3, 1000 * ref.simple.slope, REL, 'density');
    assertClose(p.stderrKgM3, 1000 * ref.simple.slopeStderr, REL, 'stderr');
    assertClose(p.interceptMgal, ref.simple.intercept, REL, 'intercept');
  });

  it('Nettleton: curve values equal numpy.corrcoef of the recomputed CBA, zero crossing near 1000 cov(y,t)/cov(x,t)', () => {
    const r = ref.nettleton;
    const nt = nettleton(inputFrom(r.x, r.y, r.t), { rangeKgM3: { from: 1800, to: 3000, step: 10 } });
    for (const [rho, c] of Object.entries(r.corrAt)) {
      const point = nt.curve.find(([d]) => Math.abs(d - Number(rho)) < 1e-9);
      expect(point).toBeDefined();
      assertClose((point as [number, number])[1], c, { abs: 1e-12 }, `corr at ${rho}`);
    }
    // linear interpolation between 10 kg/m^3 sweep points of a smooth curve: error well below 1 kg/m^3
    assertClose(nt.densityKgM3, r.zeroDensityKgM3, { abs: 1 }, 'zero crossing');
    expect(nt.zeroCrossing).toBe(true);
  });
});

describe('published worked example', () => {
  // Anscombe, F. J. (1973), Graphs in statistical analysis, The American Statistician 27(1),
  // 17-21: data set I. Published summary (from memory): slope 0.500, intercept 3.00,
  // r = 0.816 (R^2 = 0.67), slope standard error 0.118. Tolerances: half a unit of the last
  // printed digit.
  const x = [10, 8, 13, 9, 11, 14, 6, 4, 12, 7, 5];
  const y = [8.04, 6.95, 7.58, 8.81, 8.33, 9.96, 7.24, 4.26, 10.84, 4.82, 5.68];
  it('Anscombe data set I: slope 0.500, intercept 3.00, r 0.816, slope stderr 0.118', () => {
    const f = leastSquares([x], y);
    assertClose(f.coef[0] as number, 0.5, { abs: 0.0005 }, 'slope');
    assertClose(f.intercept, 3.0, { abs: 0.005 }, 'intercept');
    assertClose(pearson(x, y), 0.816, { abs: 0.0005 }, 'r');
    assertClose(f.r2, 0.67, { abs: 0.005 }, 'R^2');
    assertClose(f.stderr[0] as number, 0.118, { abs: 0.0005 }, 'slope stderr');
  });
});

describe('robust helpers', () => {
  it('median and MAD-based sigma match statistics.median on small sets (values by hand)', () => {
    expect(median([3, 1, 2])).toBe(2);
    expect(median([4, 1, 3, 2])).toBe(2.5);
    // |v - 3| = 2,1,0,1,2 -> MAD 1 -> sigma 1.4826 (1/Phi^-1(0.75); common practice)
    assertClose(robustSigma([1, 2, 3, 4, 5]), 1.482602218505602, { rel: 1e-15 }, 'robust sigma');
  });
});
