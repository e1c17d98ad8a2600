import { describe, expect, it } from 'vitest';
import { InputError } from '../../src/errors.js';
import {
  POTSDAM_TO_IGSN71_MGAL,
  datumOffsetMgal,
  describeGravityConversions,
  parseDatumOffsetCell,
  parseGobsOffset,
  parseGravityDatum,
  parseGravityUnit,
  storedGravityToIgsn71Mgal,
  storedGravityToMgal,
  toIgsn71Mgal,
} from '../../src/legacy/gravity-datum.js';
import { assertClose } from '../helpers/assert-close.js';

// Float64 addition of mGal values near 1e6: a few ulps are ~1e-9 mGal.
const FLOAT_ROUNDING_MGAL = 1e-9;

describe('gravity datum', () => {
  it('Potsdam to IGSN71 subtracts 14.0 mGal', () => {
    // [WoollardGodley1980]: IGSN71 = Potsdam - 14.0 mGal (correct to ~0.03 mGal).
    expect(POTSDAM_TO_IGSN71_MGAL).toBe(-14.0);
    assertClose(toIgsn71Mgal(980620.0, 'potsdam'), 980606.0, { abs: FLOAT_ROUNDING_MGAL });
  });

  it('IGSN71 values pass unchanged', () => {
    expect(toIgsn71Mgal(979876.54, 'igsn71')).toBe(979876.54);
  });

  it('a per-row offset replaces the datum offset and is added; an empty cell falls back', () => {
    // A survey tied to a local base whose Potsdam value is known to be 13.6 mGal high.
    assertClose(toIgsn71Mgal(980620.0, 'potsdam', -13.6), 980606.4, { abs: FLOAT_ROUNDING_MGAL });
    assertClose(toIgsn71Mgal(980620.0, 'igsn71', 0.25), 980620.25, { abs: FLOAT_ROUNDING_MGAL });
    expect(datumOffsetMgal('potsdam', NaN)).toBe(-14.0);
    expect(datumOffsetMgal('potsdam', 0)).toBe(0);
  });

  it('NaN gravity stays NaN', () => {
    expect(toIgsn71Mgal(NaN, 'potsdam')).toBeNaN();
  });
});

describe('stored gravity conventions', () => {
  it('adds back a removed constant in mGal', () => {
    const c = { datum: 'igsn71' as const, units: 'mgal' as const, storedOffset: 900000 };
    assertClose(storedGravityToMgal(80012.34, c), 980012.34, { abs: FLOAT_ROUNDING_MGAL });
  });

  it('converts gravity units to mGal, 1 mGal = 10 g.u. (physics.md units line)', () => {
    const c = { datum: 'igsn71' as const, units: 'gu' as const, storedOffset: 9800000 };
    // 9800123.4 g.u. = 980012.34 mGal
    assertClose(storedGravityToMgal(123.4, c), 980012.34, { abs: FLOAT_ROUNDING_MGAL });
  });

  it('applies offset, units, then datum', () => {
    const c = { datum: 'potsdam' as const, units: 'gu' as const, storedOffset: 9800000 };
    assertClose(storedGravityToIgsn71Mgal(1234.5, c), 980123.45 - 14.0, { abs: FLOAT_ROUNDING_MGAL });
  });

  it('lists every conversion applied, in order, for the provenance', () => {
    const steps = describeGravityConversions({ datum: 'potsdam', units: 'gu', storedOffset: 9800000 }, 'datum_offset_mgal');
    expect(steps.map((s) => s.step)).toEqual(['stored-offset', 'units', 'datum', 'per-row-datum-offset']);
    expect(steps[0]?.description).toContain('9800000 g.u.');
    expect(steps[2]?.description).toContain('-14.0 mGal');
    expect(describeGravityConversions({ datum: 'igsn71', units: 'mgal', storedOffset: 0 })).toEqual([]);
  });
});

describe('option parsing', () => {
  it('accepts the documented values', () => {
    expect(parseGravityDatum('Potsdam')).toBe('potsdam');
    expect(parseGravityUnit('GU')).toBe('gu');
    expect(parseGobsOffset('900000')).toBe(900000);
  });

  it('rejects bad values with the option and the value named', () => {
    expect(() => parseGravityDatum('ignsn71')).toThrow(InputError);
    expect(() => parseGravityDatum('ignsn71')).toThrow(/--gravity-datum.*"ignsn71"/);
    expect(() => parseGravityUnit('ugal')).toThrow(/--gravity-units.*"ugal"/);
    expect(() => parseGobsOffset('')).toThrow(/--gobs-offset/);
    expect(() => parseGobsOffset('9e5x')).toThrow(/"9e5x"/);
  });

  it('reads per-row offset cells: empty falls back, garbage names file, line, station and column', () => {
    const ctx = { file: 'old.csv', line: 12, station: 'B7', field: 'datum_offset_mgal' };
    expect(parseDatumOffsetCell('', ctx)).toBeNaN();
    expect(parseDatumOffsetCell('-13.6', ctx)).toBe(-13.6);
    expect(() => parseDatumOffsetCell('-13,6', ctx)).toThrow('old.csv:12: station B7: column datum_offset_mgal: datum offset "-13,6"');
  });
});
