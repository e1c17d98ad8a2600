import { describe, expect, it } from 'vitest';
import { BLUE_ORANGE, CIVIDIS, VIRIDIS, colourAt, hexToRgb } from '../../src/report/colour-maps.js';
import { NO_DATA_COLOUR, divergingScale, sequentialScale } from '../../src/report/colour-scale.js';
import { quantileSorted, summarize } from '../../src/report/summary-stats.js';
import { assertClose } from '../helpers/assert-close.js';

describe('colour maps', () => {
  it('viridis endpoints are the published #440154 and #fde725 (matplotlib viridis, t = 0 and 1)', () => {
    expect(colourAt(VIRIDIS, 0)).toBe('#440154');
    expect(colourAt(VIRIDIS, 1)).toBe('#fde725');
  });

  it('cividis endpoints are #00224e and #fee838 (matplotlib cividis, t = 0 and 1)', () => {
    expect(colourAt(CIVIDIS, 0)).toBe('#00224e');
    expect(colourAt(CIVIDIS, 1)).toBe('#fee838');
  });

  it('values outside [0, 1] clamp to the end colours', () => {
    expect(colourAt(VIRIDIS, -3)).toBe('#440154');
    expect(colourAt(VIRIDIS, 7)).toBe('#fde725');
  });

  it('the diverging map is light in the middle and dark at both ends', () => {
    const lum = (hex: string) => {
      const [r, g, b] = hexToRgb(hex);
      return 0.2126 * r + 0.7152 * g + 0.0722 * b;
    };
    const mid = lum(colourAt(BLUE_ORANGE, 0.5));
    expect(mid).toBeGreaterThan(200);
    expect(lum(colourAt(BLUE_ORANGE, 0))).toBeLessThan(mid / 2);
    expect(lum(colourAt(BLUE_ORANGE, 1))).toBeLessThan(mid / 2);
    // the ends are blue and orange: blue dominates at 0, red at 1
    const [r0, , b0] = hexToRgb(colourAt(BLUE_ORANGE, 0));
    const [r1, , b1] = hexToRgb(colourAt(BLUE_ORANGE, 1));
    expect(b0).toBeGreaterThan(r0);
    expect(r1).toBeGreaterThan(b1);
  });
});

describe('colour scales', () => {
  const values = Array.from({ length: 101 }, (_, i) => i); // 0..100

  it('sequential limits are the 2 % and 98 % quantiles', () => {
    const s = sequentialScale([...values, 1e6]);
    // 102 values: the 2 % / 98 % quantiles by linear interpolation of order statistics
    assertClose(s.min, 2.02, { abs: 1e-9 }, 'exact arithmetic on small integers');
    assertClose(s.max, 98.98, { abs: 1e-9 }, 'exact arithmetic on small integers');
    expect(s.colour(-5)).toBe('#440154');
    expect(s.colour(1e6)).toBe('#fde725');
    expect(s.colour(NaN)).toBe(NO_DATA_COLOUR);
  });

  it('a diverging scale centred on the median is symmetric about it and draws the median with the middle colour', () => {
    const skewed = [...values.map((v) => v + 10), 500, 600];
    const s = divergingScale(skewed, 'median');
    const median = quantileSorted([...skewed].sort((a, b) => a - b), 0.5);
    expect(s.centre).toBe(median);
    assertClose(s.max - median, median - s.min, { abs: 1e-9 }, 'symmetric by construction');
    expect(s.colour(median)).toBe(colourAt(BLUE_ORANGE, 0.5));
  });

  it('a diverging scale centred on zero keeps zero in the middle even for one-sided data', () => {
    const s = divergingScale([1, 2, 3, 4, 5], 0);
    expect(s.centre).toBe(0);
    assertClose(s.min, -s.max, { abs: 1e-12 }, 'symmetric by construction');
  });

  it('constant data still give a usable scale', () => {
    const s = sequentialScale([4, 4, 4]);
    expect(s.max).toBeGreaterThan(s.min);
  });
});

describe('summary statistics', () => {
  it('mean, sample sd, min, max, median of 1..5 skipping NaN', () => {
    const s = summarize([5, 1, NaN, 3, 2, 4]);
    expect(s.n).toBe(5);
    assertClose(s.mean, 3, { abs: 1e-12 }, 'exact in binary up to rounding');
    assertClose(s.sd, Math.sqrt(2.5), { abs: 1e-12 }, 'sum of squares 10 over n-1 = 4');
    expect([s.min, s.max, s.median]).toEqual([1, 5, 3]);
  });
});
