import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { resolveCrs } from '../../src/stations/crs-registry.js';
import { makeTransform, transformArrays } from '../../src/stations/transform.js';
import { assertClose } from '../helpers/assert-close.js';

interface Cs2csPoint {
  epsg: number;
  lonDeg: number;
  latDeg: number;
  x: number;
  y: number;
}

// Reference: PROJ 9.1.1 cs2cs with EPSG codes (PROJ chooses its operation from proj.db),
// made by test/fixtures/stations/make-cs2cs-points.sh.
const fixture = JSON.parse(
  readFileSync(new URL('../fixtures/stations/cs2cs-points.json', import.meta.url), 'utf8'),
) as { points: Cs2csPoint[] };

const wgs84 = resolveCrs('EPSG:4326');

/** Metres per degree of latitude, rounded up (for turning a 1 mm tolerance into degrees). */
const M_PER_DEG = 111_700;

describe('CRS conversions against PROJ cs2cs', () => {
  it('the fixture covers UTM N and S, NAD83, ETRS89, 27700, 2154, State Plane ftUS, 3857', () => {
    const codes = new Set(fixture.points.map((p) => p.epsg));
    for (const c of [32633, 32733, 26911, 25832, 27700, 2154, 2263, 3857]) expect(codes.has(c)).toBe(true);
  });

  for (const p of fixture.points) {
    it(`EPSG:4326 -> EPSG:${p.epsg} at (${p.lonDeg}, ${p.latDeg}) matches cs2cs to 1 mm`, () => {
      const crs = resolveCrs(`EPSG:${p.epsg}`);
      const [x, y] = makeTransform(wgs84, crs)(p.lonDeg, p.latDeg);
      // 1 mm: far below station position accuracy; proj4 and PROJ agree to ~1e-6 m given the
      // same operation, so a datum shift that differs from PROJ's choice shows up as metres.
      // Feet and degree CRSs: 1 mm expressed in their unit.
      const tol = crs.kind === 'geographic' ? 1e-3 / M_PER_DEG : 1e-3 / crs.linearUnitM;
      assertClose(x, p.x, { abs: tol }, `EPSG:${p.epsg} x`);
      assertClose(y, p.y, { abs: tol }, `EPSG:${p.epsg} y`);
    });

    it(`EPSG:${p.epsg} -> EPSG:4326 returns cs2cs's point to 1 mm on the ground`, () => {
      const crs = resolveCrs(`EPSG:${p.epsg}`);
      const [lon, lat] = makeTransform(crs, wgs84)(p.x, p.y);
      // Errors turned into metres on the ground (longitude degrees shrink with cos(lat)); 1 mm
      // as above. proj4 undoes a 7-parameter Helmert to first order only: measured 0.8-0.9 mm
      // for OSGB36 (EPSG:27700/4277), the largest residual in this fixture.
      const eastM = (lon - p.lonDeg) * Math.cos(p.latDeg * (Math.PI / 180)) * M_PER_DEG;
      const northM = (lat - p.latDeg) * M_PER_DEG;
      assertClose(eastM, 0, { abs: 1e-3 }, 'east error, m');
      assertClose(northM, 0, { abs: 1e-3 }, 'north error, m');
    });
  }

  it('transformArrays converts a column like makeTransform does point by point', () => {
    const utm = fixture.points.filter((p) => p.epsg === 32633);
    const crs = resolveCrs('EPSG:32633');
    const out = transformArrays(crs, wgs84, utm.map((p) => p.x), utm.map((p) => p.y));
    utm.forEach((p, i) => {
      // 1 mm against cs2cs, as above (WGS84 UTM: no datum shift involved)
      assertClose(out.x[i] as number, p.lonDeg, { abs: 1e-3 / M_PER_DEG }, 'lon');
      assertClose(out.y[i] as number, p.latDeg, { abs: 1e-3 / M_PER_DEG }, 'lat');
    });
  });

  it('a proj4 string equal to the EPSG definition gives cs2cs results too', () => {
    const p = fixture.points.find((q) => q.epsg === 2154);
    if (p === undefined) throw new Error('fixture lacks EPSG:2154');
    const crs = resolveCrs(
      '+proj=lcc +lat_0=46.5 +lon_0=3 +lat_1=49 +lat_2=44 +x_0=700000 +y_0=6600000 +ellps=GRS80 +towgs84=0,0,0 +units=m',
    );
    const [x, y] = makeTransform(wgs84, crs)(p.lonDeg, p.latDeg);
    assertClose(x, p.x, { abs: 1e-3 }, 'x (1 mm, as above)');
    assertClose(y, p.y, { abs: 1e-3 }, 'y (1 mm, as above)');
  });
});
