import { describe, expect, it } from 'vitest';
import { describeEpsg, knownEpsgCodes, resolveCrs } from '../../src/stations/crs-registry.js';
import { makeTransform, transformArrays } from '../../src/stations/transform.js';
import { InputError } from '../../src/errors.js';
import { US_SURVEY_FOOT_M } from '../../src/units.js';

function errorOf(f: () => unknown): InputError {
  try {
    f();
  } catch (e) {
    if (e instanceof InputError) return e;
    throw e;
  }
  throw new Error('expected an InputError');
}

describe('resolveCrs', () => {
  it('accepts EPSG:n, epsg:n and a bare code alike', () => {
    const a = resolveCrs('EPSG:32633');
    expect(resolveCrs('epsg:32633')).toEqual(a);
    expect(resolveCrs(' 32633 ')).toEqual(a);
    expect(a).toMatchObject({ kind: 'projected', label: 'EPSG:32633', epsg: 32633, linearUnitM: 1 });
  });

  it('geographic CRSs have kind geographic and linearUnitM NaN', () => {
    const g = resolveCrs('EPSG:4326');
    expect(g.kind).toBe('geographic');
    expect(Number.isNaN(g.linearUnitM)).toBe(true);
  });

  it('US survey feet State Plane zones carry 1200/3937 m per unit; international feet 0.3048', () => {
    // reference: projinfo reports +units=us-ft for EPSG:2263 and +units=ft for EPSG:2223
    expect(resolveCrs('EPSG:2263').linearUnitM).toBe(US_SURVEY_FOOT_M);
    expect(resolveCrs('EPSG:2223').linearUnitM).toBe(0.3048);
  });

  it('an unknown code is an InputError naming the code', () => {
    const e = errorOf(() => resolveCrs('EPSG:999999'));
    expect(e.message).toContain('unknown CRS code EPSG:999999');
    expect(e.message).toContain('+proj=');
  });

  it('NAD27 (needs grids) is refused with the missing-shift message naming the code', () => {
    const e = errorOf(() => resolveCrs('EPSG:26711'));
    expect(e.message).toContain('no datum shift to WGS84 known for EPSG:26711');
    expect(e.message).toContain('pass a proj4 string with +towgs84');
  });

  it('datums whose PROJ shift varies by region (ED50, DHDN, S-JTSK) are refused', () => {
    for (const c of [23032, 31468, 5514]) {
      expect(errorOf(() => resolveCrs(`EPSG:${c}`)).message).toContain(`no datum shift to WGS84 known for EPSG:${c}`);
    }
  });

  it('OSGB36 (27700) carries the Helmert shift PROJ uses, recorded in the table', () => {
    expect(resolveCrs('EPSG:27700').proj4).toContain('+towgs84=446.448,-125.157,542.06');
    expect(describeEpsg(27700)?.shift).toContain('OSGB36 to WGS 84 (6)');
  });

  it('every accepted table entry parses and converts a point without NaN', () => {
    const codes = knownEpsgCodes();
    expect(codes.length).toBeGreaterThan(250);
    for (const c of codes) expect(() => resolveCrs(`EPSG:${c}`)).not.toThrow();
  });

  it('a proj4 string with +towgs84 is accepted as user-defined', () => {
    const c = resolveCrs('+proj=utm +zone=32 +ellps=intl +towgs84=-87,-98,-121 +units=m');
    expect(c.kind).toBe('projected');
    expect(c.label).toContain('user-defined');
    expect(c.epsg).toBeUndefined();
  });

  it('a proj4 string on a non-WGS84 ellipsoid without +towgs84 is refused', () => {
    const e = errorOf(() => resolveCrs('+proj=tmerc +lat_0=49 +lon_0=-2 +k=0.9996 +x_0=400000 +y_0=-100000 +ellps=airy'));
    expect(e.message).toContain('no datum shift to WGS84 known for user-defined');
  });

  it('a proj4 string needing a grid file is refused naming the grid', () => {
    const e = errorOf(() => resolveCrs('+proj=longlat +ellps=clrk66 +nadgrids=conus'));
    expect(e.message).toContain('needs the datum grid conus');
  });

  it('unparseable proj4 strings, geocentric CRSs and other text are InputErrors', () => {
    expect(errorOf(() => resolveCrs('+proj=nosuchprojection')).message).toContain('cannot parse CRS');
    expect(errorOf(() => resolveCrs('+proj=geocent +datum=WGS84')).message).toContain('geocentric');
    expect(errorOf(() => resolveCrs('UTM 33')).message).toContain("cannot read CRS 'UTM 33'");
  });

  it('context (file, option) is added to the message', () => {
    const e = errorOf(() => resolveCrs('EPSG:1', { field: '--station-crs' }));
    expect(e.message).toMatch(/^column --station-crs: unknown CRS code EPSG:1\b/);
  });
});

describe('transforms that fail', () => {
  it('a point proj4 cannot convert is an InputError naming both CRSs and the point', () => {
    const merc = resolveCrs('EPSG:3857');
    const wgs = resolveCrs('EPSG:4326');
    // Mercator northing is infinite at the pole: proj4 returns a non-finite value there.
    const e = errorOf(() => makeTransform(wgs, merc)(10, 90));
    expect(e.message).toContain('point (10, 90) in EPSG:4326 does not convert to EPSG:3857');
  });

  it('transformArrays names file, line and station of the failing point and keeps NaN rows NaN', () => {
    const merc = resolveCrs('EPSG:3857');
    const wgs = resolveCrs('EPSG:4326');
    const ok = transformArrays(wgs, merc, [NaN, 1], [NaN, 1]);
    expect(Number.isNaN(ok.x[0] as number)).toBe(true);
    expect(Number.isFinite(ok.x[1] as number)).toBe(true);
    const e = errorOf(() =>
      transformArrays(wgs, merc, [1, 10], [1, 90], { file: 'st.csv', lines: [2, 3], ids: ['A', 'B'] }),
    );
    expect(e.message).toMatch(/^st\.csv:3: station B: point \(10, 90\)/);
  });
});
