/**
 * The GDAL/PROJ view of each DEM fixture, as recorded by test/fixtures/dem/make-fixtures.sh
 * (gdalinfo -json -stats, gdallocationinfo -valonly, projinfo, cs2cs, geod). Tests read these
 * files; GDAL is not needed at test time.
 */
import { existsSync, readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import type { CrsInfo } from '../../src/dem/grid.js';
import type { CrsResolver } from '../../src/dem/crs-resolver.js';
import { FOOT_M, US_SURVEY_FOOT_M } from '../../src/units.js';

export const FIXTURE_DIR = fileURLToPath(new URL('../fixtures/dem/', import.meta.url));

export const fixturePath = (name: string): string => `${FIXTURE_DIR}${name}.tif`;

export interface GdalInfo {
  size: [number, number];
  geoTransform?: [number, number, number, number, number, number];
  stac?: { 'proj:epsg'?: number | null };
  metadata?: Record<string, Record<string, string>>;
  cornerCoordinates?: Record<string, [number, number]>;
  bands: {
    type: string;
    block: [number, number];
    noDataValue?: number | string;
    overviews?: unknown[];
    metadata?: Record<string, Record<string, string>>;
  }[];
}

export function gdalInfo(name: string): GdalInfo {
  return JSON.parse(readFileSync(`${FIXTURE_DIR}expected/${name}.gdalinfo.json`, 'utf8')) as GdalInfo;
}

/** Sampled cells in file pixel coordinates; value NaN where GDAL printed nan. */
export function gdalCells(name: string): { col: number; row: number; value: number }[] {
  return readFileSync(`${FIXTURE_DIR}expected/${name}.cells.txt`, 'utf8')
    .trim()
    .split('\n')
    .map((line) => {
      const [c, r, v] = line.trim().split(/\s+/);
      return { col: Number(c), row: Number(r), value: v === 'nan' ? NaN : Number(v) };
    });
}

/** `projinfo -o PROJ EPSG:n` for the fixture's code. */
export function projinfoDef(name: string): string {
  return readFileSync(`${FIXTURE_DIR}expected/${name}.proj4.txt`, 'utf8').trim();
}

/** Corner lon/lat (upperLeft, upperRight, lowerRight, lowerLeft) from cs2cs, or undefined. */
export function cs2csCorners(name: string): [number, number][] | undefined {
  const p = `${FIXTURE_DIR}expected/${name}.corners-lonlat.txt`;
  if (!existsSync(p)) return undefined;
  return readFileSync(p, 'utf8').trim().split('\n').map((l) => l.trim().split(/\s+/).map(Number) as [number, number]);
}

export function geodSpacingM(name: string): { ewM: number; nsM: number } {
  const [ew, ns] = readFileSync(`${FIXTURE_DIR}expected/${name}.spacing-m.txt`, 'utf8').trim().split('\n').map(Number);
  return { ewM: ew as number, nsM: ns as number };
}

/** CrsInfo from a PROJ string (the test side's own reading of projinfo output). */
export function crsFromProjString(def: string, label: string, epsg?: number): CrsInfo {
  const geographic = /\+proj=longlat\b/.test(def);
  const units = /\+units=(\S+)/.exec(def)?.[1];
  const linearUnitM = geographic ? NaN : units === 'us-ft' ? US_SURVEY_FOOT_M : units === 'ft' ? FOOT_M : 1;
  return { kind: geographic ? 'geographic' : 'projected', proj4: def, label, ...(epsg !== undefined ? { epsg } : {}), linearUnitM };
}

/** A resolver that knows exactly the fixture's EPSG code, with PROJ's definition of it. */
export function fixtureResolver(name: string): CrsResolver {
  return (spec) => {
    const code = gdalInfo(name).stac?.['proj:epsg'];
    if (spec !== `EPSG:${code}`) throw new Error(`fixture resolver for ${name} asked for ${spec}`);
    return crsFromProjString(projinfoDef(name), spec, code as number);
  };
}
