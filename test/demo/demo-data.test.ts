/**
 * The committed demo survey (data-samples/demo) against what its generator states: the DEMs'
 * georeferencing as GDAL described the files when they were made, the far DEM's margin, the
 * station positions and heights, and the planted problems.
 */
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import proj4 from 'proj4';
import { openDem } from '../../src/dem/geotiff-open.js';
import { readDemWindow } from '../../src/dem/read-window.js';
import { readCsvTable } from '../../src/io/read-results.js';
import { CAP_RADIUS_M } from '../../src/constants.js';
import { FAR_DEM, FINE_DEM } from '../../data-samples/demo-grids.js';
import { NOISE, PLANTED } from '../../data-samples/demo-survey.js';
import { assertClose } from '../helpers/assert-close.js';
import { bilinearHeightAt } from '../../src/terrain/grid-frame.js';

const DIR = new URL('../../data-samples/demo/', import.meta.url).pathname;
const UTM33 = '+proj=utm +zone=33 +datum=WGS84 +units=m +no_defs';

interface GdalInfo {
  size: [number, number];
  geoTransform: [number, number, number, number, number, number];
  coordinateSystem: { wkt: string };
  bands: { type: string }[];
  metadata: { IMAGE_STRUCTURE?: { COMPRESSION?: string } };
}
const gdalinfo = (name: string): GdalInfo => JSON.parse(readFileSync(`${DIR}${name}.gdalinfo.json`, 'utf8')) as GdalInfo;


const table = readCsvTable(`${DIR}stations.csv`);
const column = (name: string): string[] => {
  const k = table.header.indexOf(name);
  if (k < 0) throw new Error(`stations.csv has no column ${name}`);
  return table.rows.map((r) => r[k] as string);
};
const ids = column('id');
const lon = column('lon').map(Number);
const lat = column('lat').map(Number);
const x = column('x').map(Number);
const y = column('y').map(Number);
const heightM = column('height_m').map(Number);

describe('demo DEMs', () => {
  for (const [name, spec, epsg] of [['fine-dem', FINE_DEM, 32633], ['far-dem', FAR_DEM, 4326]] as const) {
    it(`${name}.tif: talus's reader gives the georeferencing gdalinfo reported when it was made`, async () => {
      const info = gdalinfo(name);
      const src = await openDem(`${DIR}${name}.tif`);
      expect([src.width, src.height]).toEqual(info.size);
      const [ox, sx, rx, oy, ry, sy] = info.geoTransform;
      expect([rx, ry]).toEqual([0, 0]);
      // the geotransform is printed from doubles: 1e-9 of a cell allows for its last digit only
      assertClose(src.originX, ox, { abs: 1e-9 * sx }, 'west edge');
      assertClose(src.originY, oy, { abs: 1e-9 * sx }, 'north edge');
      assertClose(src.cellSizeX, sx, { rel: 1e-12 }, 'cell width');
      assertClose(src.cellSizeY, -sy, { rel: 1e-12 }, 'cell height');
      expect(info.coordinateSystem.wkt).toContain(`ID["EPSG",${epsg}]`);
      expect(src.crs.epsg).toBe(epsg);
      expect(info.bands[0]?.type).toBe('Float32');
      expect(src.dataType).toBe('Float32');
      expect(info.metadata.IMAGE_STRUCTURE?.COMPRESSION).toBe('DEFLATE');
      expect(src.compression).toBe('deflate');
      // and the generator's stated grid
      expect([src.width, src.height, src.cellSizeX, src.cellSizeY]).toEqual([spec.width, spec.height, spec.cellSizeX, spec.cellSizeY]);
      assertClose(src.originX, spec.originX, { abs: 1e-9 * spec.cellSizeX });
      assertClose(src.originY, spec.originY, { abs: 1e-9 * spec.cellSizeX });
    });
  }

  it('both DEMs are complete (no nodata) and heights are plausible land heights', async () => {
    for (const name of ['fine-dem', 'far-dem']) {
      const g = await readDemWindow(await openDem(`${DIR}${name}.tif`));
      let min = Infinity;
      let max = -Infinity;
      let missing = 0;
      for (const v of g.data) {
        if (!Number.isFinite(v)) missing++;
        min = Math.min(min, v);
        max = Math.max(max, v);
      }
      expect(missing).toBe(0);
      // the invented scenario's relief (demo-terrain.ts): land at least 20 m above sea level, the mountain belt below 4000 m
      expect(min).toBeGreaterThanOrEqual(20);
      expect(max).toBeLessThan(4000);
    }
  });

  it(`the far DEM reaches more than ${CAP_RADIUS_M / 1000} km beyond every station`, () => {
    // degrees per metre on a sphere of the mean Earth radius; east-west measured at the
    // circle's highest latitude, where a degree of longitude is shortest (conservative)
    const mPerDegLat = (6371000 * Math.PI) / 180;
    const west = FAR_DEM.originX;
    const east = FAR_DEM.originX + FAR_DEM.width * FAR_DEM.cellSizeX;
    const north = FAR_DEM.originY;
    const south = FAR_DEM.originY - FAR_DEM.height * FAR_DEM.cellSizeY;
    for (let i = 0; i < ids.length; i++) {
      const la = lat[i] as number;
      const lo = lon[i] as number;
      expect((north - la) * mPerDegLat).toBeGreaterThan(CAP_RADIUS_M);
      expect((la - south) * mPerDegLat).toBeGreaterThan(CAP_RADIUS_M);
      const top = la + CAP_RADIUS_M / mPerDegLat;
      const mPerDegLon = mPerDegLat * Math.cos((top * Math.PI) / 180);
      expect((east - lo) * mPerDegLon).toBeGreaterThan(CAP_RADIUS_M);
      expect((lo - west) * mPerDegLon).toBeGreaterThan(CAP_RADIUS_M);
    }
  });
});

describe('demo stations', () => {
  it('x, y are the UTM 33N positions of lon, lat and lie at least 2 km inside the fine DEM', () => {
    const t = proj4('EPSG:4326', UTM33);
    const east = FINE_DEM.originX + FINE_DEM.width * FINE_DEM.cellSizeX;
    const south = FINE_DEM.originY - FINE_DEM.height * FINE_DEM.cellSizeY;
    for (let i = 0; i < ids.length; i++) {
      const [e, n] = t.forward([lon[i] as number, lat[i] as number]);
      // x, y are printed to 0.01 m; 1e-7 deg of lon/lat is about 1 cm
      assertClose(x[i] as number, e as number, { abs: 0.02 }, `${ids[i]} x`);
      assertClose(y[i] as number, n as number, { abs: 0.02 }, `${ids[i]} y`);
      expect(Math.min((x[i] as number) - FINE_DEM.originX, east - (x[i] as number))).toBeGreaterThanOrEqual(2000);
      expect(Math.min(FINE_DEM.originY - (y[i] as number), (y[i] as number) - south)).toBeGreaterThanOrEqual(2000);
    }
    expect(ids.length).toBeGreaterThanOrEqual(300);
    expect(new Set(ids).size).toBe(ids.length);
  });

  it(`heights are the DEM surface within the GPS error (sd ${NOISE.gpsHeightM} m) except the planted ones`, async () => {
    const g = await readDemWindow(await openDem(`${DIR}fine-dem.tif`));
    const planted = new Map<string, number>([
      [PLANTED.blunderHigh.id, PLANTED.blunderHigh.offsetM],
      [PLANTED.blunderLow.id, PLANTED.blunderLow.offsetM],
      [PLANTED.tower.id, PLANTED.tower.aboveGroundM],
    ]);
    const clean: number[] = [];
    for (let i = 0; i < ids.length; i++) {
      const misfit = (heightM[i] as number) - bilinearHeightAt(g, x[i] as number, y[i] as number);
      const offset = planted.get(ids[i] as string) ?? 0;
      // 5 sd: for ~330 normal errors the chance that any exceeds it is about 2e-4; 0.005 m
      // covers x, y printed to 0.01 m on slopes below 25 deg
      expect(Math.abs(misfit - offset), `${ids[i]} misfit ${misfit}`).toBeLessThan(5 * NOISE.gpsHeightM + 0.005);
      if (offset === 0) clean.push(misfit);
    }
    const mean = clean.reduce((a, b) => a + b, 0) / clean.length;
    const sd = Math.sqrt(clean.reduce((a, b) => a + (b - mean) ** 2, 0) / (clean.length - 1));
    // sample sd of n ~ 327 normal values: relative standard error 1/sqrt(2n) ~ 4 %; +-20 % is 5 of them
    assertClose(sd, NOISE.gpsHeightM, { rel: 0.2 }, 'sd of the GPS errors');
    // the mean of the errors: standard error 0.1/sqrt(327) ~ 0.006 m; 0.03 m is 5 of them
    assertClose(mean, 0, { abs: 0.03 }, 'mean GPS error');
  });

  it('the duplicate is a second row at exactly the same position under a new id', () => {
    const a = ids.indexOf(PLANTED.duplicate.of);
    const b = ids.indexOf(PLANTED.duplicate.id);
    expect(a).toBeGreaterThanOrEqual(0);
    expect(b).toBeGreaterThanOrEqual(0);
    expect([lon[b], lat[b]]).toEqual([lon[a], lat[a]]);
  });
});
