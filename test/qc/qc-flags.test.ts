import { describe, expect, it } from 'vitest';
import { tcOutlierFlags } from '../../src/qc/tc-outlier.js';
import { duplicatePositionFlags } from '../../src/qc/duplicate-position.js';
import { legacyTcChangeFlags } from '../../src/qc/legacy-tc-change.js';
import { buildGridIndex } from '../../src/qc/grid-index.js';
import { rng, gauss } from '../density/synthetic-survey.js';

/**
 * An invented survey for QC: stations scattered over 20 km x 20 km, heights from a smooth
 * landscape, TC a smooth function of position and height (as real corrections are over
 * short distances at similar heights) plus 0.05 mGal of scatter.
 */
function qcSurvey(n: number, seed: number) {
  const u = rng(seed);
  const x = new Float64Array(n), y = new Float64Array(n), h = new Float64Array(n), tc = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    x[i] = 20_000 * u();
    y[i] = 20_000 * u();
    h[i] = 500 + 300 * Math.sin((x[i] as number) / 3000) * Math.cos((y[i] as number) / 4000);
    tc[i] = 2 + 1.5 * Math.cos((x[i] as number) / 5000) + 0.004 * ((h[i] as number) - 500) + 0.05 * gauss(u);
  }
  return { x, y, h, tc };
}

describe('tcOutlierFlags', () => {
  it('finds planted outliers (+-3 mGal) and flags no clean station', () => {
    const s = qcSurvey(3000, 3);
    const planted = [17, 404, 1200, 2222, 2999];
    planted.forEach((k, j) => (s.tc[k] = (s.tc[k] as number) + (j % 2 === 0 ? 3 : -3)));
    const flags = tcOutlierFlags(s.x, s.y, s.h, s.tc);
    const found = flags.flatMap((f, i) => (f ? [i] : []));
    expect(found).toEqual(planted);
  });

  it('compares only neighbours at similar heights: a summit station with a different TC is not judged against the valley', () => {
    // 3 x 3 valley stations 100 m apart at 500 m with TC ~2 mGal, and a 900 m summit station
    // in the middle whose TC of 8 mGal is expected for its position (invented numbers)
    const x = Float64Array.from([0, 100, 200, 0, 100, 200, 0, 100, 200, 100.5]);
    const y = Float64Array.from([0, 0, 0, 100, 100, 100, 200, 200, 200, 100.5]);
    const h = Float64Array.from([500, 501, 502, 499, 500, 501, 498, 500, 503, 900]);
    const tc = Float64Array.from([2.0, 2.1, 1.9, 2.0, 2.05, 1.95, 2.1, 2.0, 1.9, 8.0]);
    expect(tcOutlierFlags(x, y, h, tc)[9]).toBe(false);
    // with the height window opened to 1000 m the valley becomes its reference and it is flagged
    expect(tcOutlierFlags(x, y, h, tc, { heightWindowM: 1000 })[9]).toBe(true);
    expect(tcOutlierFlags(x, y, h, tc).some(Boolean)).toBe(false);
  });

  it('a larger limitMgal hides a 3 mGal outlier; NaN TC is never flagged nor used', () => {
    const s = qcSurvey(2000, 5);
    s.tc[10] = (s.tc[10] as number) + 3;
    s.tc[11] = NaN;
    expect(tcOutlierFlags(s.x, s.y, s.h, s.tc)[10]).toBe(true);
    const loose = tcOutlierFlags(s.x, s.y, s.h, s.tc, { limitMgal: 5 });
    expect(loose[10]).toBe(false);
    expect(loose[11]).toBe(false);
  });

  it('handles 200 000 stations in linear time (an O(n^2) search would need ~4e10 distance checks)', () => {
    const s = qcSurvey(200_000, 6);
    s.tc[123_456] = (s.tc[123_456] as number) + 4;
    const t0 = performance.now();
    const flags = tcOutlierFlags(s.x, s.y, s.h, s.tc);
    const ms = performance.now() - t0;
    expect(flags[123_456]).toBe(true);
    // a handful of false alarms at most among 200 000 clean stations (5-sigma rule with a 1 mGal floor)
    expect(flags.filter(Boolean).length).toBeLessThanOrEqual(3);
    // measured ~1-2 s here; 30 s only guards against a quadratic search on a loaded 2-core machine
    expect(ms).toBeLessThan(30_000);
  });
});

describe('grid index', () => {
  it('buckets every finite point exactly once and leaves out NaN positions', () => {
    const x = Float64Array.from([0, 1, 2, NaN, 5, 5]);
    const y = Float64Array.from([0, 1, 2, 3, NaN, 5]);
    const g = buildGridIndex(x, y);
    expect(Array.from(g.order).sort()).toEqual([0, 1, 2, 5]);
    expect(g.start[g.nx * g.ny]).toBe(4);
  });
});

describe('duplicatePositionFlags', () => {
  it('flags both members of pairs within the tolerance, across cell borders, and nothing else', () => {
    const x = Float64Array.from([0, 0.9, 10, 10.99, 20, 21.5, 30, NaN]);
    const y = Float64Array.from([0, 0, 5, 5.5, 0, 0, 30, 30]);
    // (10, 5)-(10.99, 5.5) are 1.11 m apart: outside 1 m; (0,0)-(0.9,0) are 0.9 m apart
    expect(duplicatePositionFlags(x, y, 1)).toEqual([true, true, false, false, false, false, false, false]);
    expect(duplicatePositionFlags(x, y, 1.2)).toEqual([true, true, true, true, false, false, false, false]);
    // exact coincidence only
    expect(duplicatePositionFlags(Float64Array.from([1, 1, 1.000001]), Float64Array.from([2, 2, 2]), 0)).toEqual([true, true, false]);
  });

  it('is linear-time on 300 000 stations and finds the one planted duplicate', () => {
    const n = 300_000;
    const x = new Float64Array(n), y = new Float64Array(n);
    for (let i = 0; i < n; i++) {
      // a 600 x 500 grid with 10 m spacing: no two stations closer than 10 m
      x[i] = 10 * (i % 600);
      y[i] = 10 * Math.floor(i / 600);
    }
    x[777] = (x[778] as number) + 0.3;
    y[777] = (y[778] as number) - 0.2;
    const f = duplicatePositionFlags(x, y, 1);
    expect(f.flatMap((v, i) => (v ? [i] : []))).toEqual([777, 778]);
  });

  it('rejects a negative or NaN tolerance', () => {
    expect(() => duplicatePositionFlags([0], [0], -1)).toThrow(RangeError);
    expect(() => duplicatePositionFlags([0], [0], NaN)).toThrow(RangeError);
  });
});

describe('legacyTcChangeFlags', () => {
  it('flags |new - legacy| > limit; a missing legacy value never flags', () => {
    expect(legacyTcChangeFlags([1, 2, 3, 4], [1.5, 0.5, NaN, 5.0], 1)).toEqual([false, true, false, false]);
    expect(() => legacyTcChangeFlags([1], [1], NaN)).toThrow(RangeError);
  });
});

describe('tcOutlierFlags on tiny surveys', () => {
  it('returns at once for one or two stations (nothing to compare with) without flagging', () => {
    const one = tcOutlierFlags(new Float64Array([0]), new Float64Array([0]), new Float64Array([100]), new Float64Array([3]));
    expect(one).toEqual([false]);
    const two = tcOutlierFlags(new Float64Array([0, 0]), new Float64Array([0, 0]), new Float64Array([100, 100]), new Float64Array([3, 30]));
    expect(two).toEqual([false, false]);
  });
});
