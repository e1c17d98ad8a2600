import { describe, expect, it } from 'vitest';
import { linearScale, niceStep, niceTicks } from '../../src/report/ticks.js';
import { esc, fmt, tickLabel } from '../../src/report/escape.js';

describe('nice ticks', () => {
  it('[0, 97] → 0, 20, ..., 100', () => {
    const t = niceTicks(0, 97, 5);
    expect(t.ticks).toEqual([0, 20, 40, 60, 80, 100]);
    expect(t.step).toBe(20);
    expect([t.domainMin, t.domainMax]).toEqual([0, 100]);
  });

  it('[-0.33, 0.72] → steps of 0.2 without binary noise', () => {
    const t = niceTicks(-0.33, 0.72, 5);
    expect(t.ticks).toEqual([-0.4, -0.2, 0, 0.2, 0.4, 0.6, 0.8]);
  });

  it('ticks cover the data for large offsets (UTM northings)', () => {
    const t = niceTicks(5098560, 5100000, 5);
    // span 1440 m / 5 = 288 m: below the 2→5 cut-off of 100·√10 ≈ 316 m, so the step is 200 m
    expect(t.step).toBe(200);
    expect(t.ticks[0]).toBe(5098400);
    expect(t.domainMin).toBeLessThanOrEqual(5098560);
    expect(t.domainMax).toBeGreaterThanOrEqual(5100000);
  });

  it('a degenerate range is widened instead of dividing by zero', () => {
    const t = niceTicks(3, 3, 5);
    expect(t.domainMin).toBeLessThan(3);
    expect(t.domainMax).toBeGreaterThan(3);
    expect(t.ticks.length).toBeGreaterThanOrEqual(2);
  });

  it('niceStep picks 1, 2 or 5 times a power of ten', () => {
    expect(niceStep(97, 5)).toBe(20);
    expect(niceStep(1, 10)).toBe(0.1);
    expect(niceStep(7, 2)).toBe(5);
  });

  it('linearScale maps domain ends onto range ends (inverted y range too)', () => {
    const s = linearScale(10, 20, 300, 100);
    expect(s(10)).toBe(300);
    expect(s(20)).toBe(100);
    expect(s(15)).toBe(200);
  });
});

describe('text for HTML/SVG', () => {
  it('escapes the five markup characters', () => {
    expect(esc(`<a href="x">&'`)).toBe('&lt;a href=&quot;x&quot;&gt;&amp;&#39;');
  });
  it('tick labels use as many decimals as the step needs and a true minus sign', () => {
    expect(tickLabel(40, 20)).toBe('40');
    expect(tickLabel(0.4, 0.2)).toBe('0.4');
    expect(tickLabel(-0.25, 0.25)).toBe('−0.25');
    expect(tickLabel(-0, 0.5)).toBe('0.0');
  });
  it('fmt prints a dash for missing values and never "-0.00"', () => {
    expect(fmt(NaN)).toBe('–');
    expect(fmt(undefined)).toBe('–');
    expect(fmt(-0.001)).toBe('0.00');
    expect(fmt(2.345, 1)).toBe('2.3');
  });
});
