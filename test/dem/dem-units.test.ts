/** Elevation units (--dem-units) and CRS linear units (ProjLinearUnitsGeoKey). */
import { describe, expect, it } from 'vitest';
import { openDem } from '../../src/dem/geotiff-open.js';
import { readDemWindow } from '../../src/dem/read-window.js';
import { FOOT_M, US_SURVEY_FOOT_M } from '../../src/units.js';
import { assertClose } from '../helpers/assert-close.js';
import { fixturePath, fixtureResolver, gdalCells } from './gdal-reference.js';

describe('DEM units', () => {
  it('--dem-units ft turns GDAL feet values into metres (x 0.3048)', async () => {
    const src = await openDem(fixturePath('feet-elevations'), { demUnits: 'ft', resolveCrs: fixtureResolver('feet-elevations') });
    expect(src.elevationScaleM).toBe(FOOT_M);
    const g = await readDemWindow(src);
    for (const { col, row, value } of gdalCells('feet-elevations')) {
      const got = g.data[row * g.width + col] as number;
      if (value === -9999) expect(got).toBeNaN();
      // the product is rounded once to float32: half an ulp at <= 1200 m is < 6.2e-5 m
      else assertClose(got, Math.fround(value) * FOOT_M, { abs: 6.2e-5 }, `cell ${col},${row}`);
    }
  });

  it('the feet file in metres agrees with the metre file to float32 rounding of the feet values', async () => {
    const ft = await readDemWindow(await openDem(fixturePath('feet-elevations'), { demUnits: 'ft', resolveCrs: fixtureResolver('feet-elevations') }));
    const m = await readDemWindow(await openDem(fixturePath('plain-f32'), { resolveCrs: fixtureResolver('plain-f32') }));
    for (let i = 0; i < m.data.length; i++) {
      if (Number.isNaN(m.data[i])) expect(ft.data[i]).toBeNaN();
      // the fixture script printed feet with 4 decimals (<= 5e-5 ft) and float32 holds ~4000 ft to 2.4e-4 ft
      else assertClose(ft.data[i] as number, m.data[i] as number, { abs: 3e-4 * FOOT_M + 1e-4 }, `index ${i}`);
    }
  });

  it('a US-survey-foot CRS (EPSG:2227) has linearUnitM = 1200/3937', async () => {
    const src = await openDem(fixturePath('ftus-crs'), { resolveCrs: fixtureResolver('ftus-crs') });
    expect(src.crs.kind).toBe('projected');
    expect(src.crs.linearUnitM).toBe(US_SURVEY_FOOT_M);
  });

  it('the registry resolver (default) agrees with the file for EPSG:2227 and EPSG:32633', async () => {
    expect((await openDem(fixturePath('ftus-crs'))).crs.linearUnitM).toBe(US_SURVEY_FOOT_M);
    const utm = await openDem(fixturePath('plain-f32'));
    expect(utm.crs.label).toMatch(/32633/);
    expect(utm.crs.linearUnitM).toBe(1);
  });

  it('a geographic DEM gets a geographic CrsInfo', async () => {
    const src = await openDem(fixturePath('geographic-4326'));
    expect(src.crs.kind).toBe('geographic');
    expect(src.crs.epsg).toBe(4326);
  });
});
