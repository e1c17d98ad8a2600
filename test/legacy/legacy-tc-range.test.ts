import { describe, expect, it } from 'vitest';
import { InputError } from '../../src/errors.js';
import { describeLegacyTcRange, inLegacyTcRange, parseLegacyTcRange } from '../../src/legacy/legacy-tc-range.js';

describe('--legacy-tc-range', () => {
  it('parses R1:R2 in metres, R1 may be 0', () => {
    expect(parseLegacyTcRange('0:21944')).toEqual({ innerRadiusM: 0, outerRadiusM: 21944 });
    expect(parseLegacyTcRange(' 53.3 : 166735 ')).toEqual({ innerRadiusM: 53.3, outerRadiusM: 166735 });
  });

  it('contains inner inclusive, outer exclusive', () => {
    const r = parseLegacyTcRange('16.6:894.9');
    expect(inLegacyTcRange(r, 16.6)).toBe(true);
    expect(inLegacyTcRange(r, 894.9)).toBe(false);
    expect(inLegacyTcRange(r, 10)).toBe(false);
    expect(inLegacyTcRange(r, NaN)).toBe(false);
    expect(describeLegacyTcRange(r)).toBe('16.6-894.9 m');
  });

  it.each([
    ['21944', /not a range/],
    ['1:2:3', /not a range/],
    [':21944', /inner radius ""/],
    ['0:', /outer radius ""/],
    ['a:100', /inner radius "a"/],
    ['0:1e400', /outer radius "1e400"/],
    ['-5:100', /inner radius -5 m .* negative/],
    ['100:100', /outer radius 100 m must be greater than inner radius 100 m/],
    ['200:100', /must be greater/],
  ])('rejects "%s" naming the option and the value', (text, pattern) => {
    expect(() => parseLegacyTcRange(text)).toThrow(InputError);
    expect(() => parseLegacyTcRange(text)).toThrow(pattern);
    expect(() => parseLegacyTcRange(text)).toThrow(/--legacy-tc-range/);
  });
});
