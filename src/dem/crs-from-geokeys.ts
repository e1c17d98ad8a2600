/**
 * GeoKeys → CrsInfo. EPSG-coded geographic (GeographicTypeGeoKey) and projected
 * (ProjectedCSTypeGeoKey) CRSs are resolved through a CrsResolver; a user-defined CRS (code
 * 32767, or no code) needs --dem-crs. ProjLinearUnitsGeoKey gives the CRS's linear unit.
 */
import { InputError, isInputError } from '../errors.js';
import { FOOT_M, US_SURVEY_FOOT_M } from '../units.js';
import type { CrsInfo } from './grid.js';
import type { CrsResolver } from './crs-resolver.js';

/** The GeoKeys talus reads (geotiff.js names). */
export interface DemGeoKeys {
  GTModelTypeGeoKey?: number;
  GeographicTypeGeoKey?: number;
  ProjectedCSTypeGeoKey?: number;
  ProjLinearUnitsGeoKey?: number;
  GeogAngularUnitsGeoKey?: number;
}

/** The GeoTIFF "user-defined" key value (OGC GeoTIFF 1.1). */
const USER_DEFINED = 32767;

/** EPSG unit-of-measure codes → metres per unit. */
const LINEAR_UNITS_M: ReadonlyMap<number, { name: string; metres: number }> = new Map([
  [9001, { name: 'metre', metres: 1 }],
  [9002, { name: 'foot', metres: FOOT_M }],
  [9003, { name: 'US survey foot', metres: US_SURVEY_FOOT_M }],
]);

const DEM_CRS_HINT =
  'pass its definition with --dem-crs (an EPSG code such as EPSG:32633, or a proj4 string)';

function resolveIn(resolve: CrsResolver, spec: string, file: string, what: string): CrsInfo {
  try {
    return resolve(spec);
  } catch (e) {
    if (isInputError(e)) throw new InputError(`${what} ${spec}: ${(e as Error).message}`, { file });
    throw e;
  }
}

function linearUnitFromKey(keys: DemGeoKeys, file: string): number | undefined {
  const code = keys.ProjLinearUnitsGeoKey;
  if (code === undefined || code === USER_DEFINED) return undefined;
  const unit = LINEAR_UNITS_M.get(code);
  if (unit === undefined) {
    throw new InputError(
      `ProjLinearUnitsGeoKey ${code} is not a supported linear unit; expected 9001 (metre), 9002 (foot) or 9003 (US survey foot)`,
      { file },
    );
  }
  return unit.metres;
}

/**
 * The DEM's CRS. `demCrs` (from --dem-crs) takes precedence over the file's keys; without it a
 * user-defined or missing CRS code is an InputError that says to pass --dem-crs.
 */
export function crsFromGeoKeys(
  keys: DemGeoKeys | null,
  file: string,
  opts: { demCrs?: string | undefined; resolveCrs: CrsResolver },
): CrsInfo {
  if (opts.demCrs !== undefined) return resolveIn(opts.resolveCrs, opts.demCrs, file, '--dem-crs');
  if (keys === null) {
    throw new InputError('is a plain TIFF with no GeoTIFF keys (no CRS, no georeferencing): expected a GeoTIFF DEM', { file });
  }
  const model = keys.GTModelTypeGeoKey;
  if (model === 1) {
    const code = keys.ProjectedCSTypeGeoKey;
    if (code === undefined || code === USER_DEFINED) {
      throw new InputError(`uses a user-defined projected CRS (ProjectedCSTypeGeoKey ${code ?? 'missing'}); ${DEM_CRS_HINT}`, { file });
    }
    const crs = resolveIn(opts.resolveCrs, `EPSG:${code}`, file, 'projected CRS');
    if (crs.kind !== 'projected') throw new InputError(`EPSG:${code} in ProjectedCSTypeGeoKey is not a projected CRS`, { file });
    const keyUnitM = linearUnitFromKey(keys, file);
    if (keyUnitM !== undefined && !(Math.abs(keyUnitM - crs.linearUnitM) <= 1e-12 * keyUnitM)) {
      throw new InputError(
        `ProjLinearUnitsGeoKey says ${keyUnitM} m per unit but EPSG:${code} has ${crs.linearUnitM} m per unit; ${DEM_CRS_HINT}`,
        { file },
      );
    }
    return crs;
  }
  if (model === 2) {
    const code = keys.GeographicTypeGeoKey;
    if (code === undefined || code === USER_DEFINED) {
      throw new InputError(`uses a user-defined geographic CRS (GeographicTypeGeoKey ${code ?? 'missing'}); ${DEM_CRS_HINT}`, { file });
    }
    const angular = keys.GeogAngularUnitsGeoKey;
    if (angular !== undefined && angular !== 9102) {
      throw new InputError(`GeogAngularUnitsGeoKey ${angular} is not supported; expected 9102 (degree)`, { file });
    }
    const crs = resolveIn(opts.resolveCrs, `EPSG:${code}`, file, 'geographic CRS');
    if (crs.kind !== 'geographic') throw new InputError(`EPSG:${code} in GeographicTypeGeoKey is not a geographic CRS`, { file });
    return crs;
  }
  throw new InputError(
    `GTModelTypeGeoKey is ${model ?? 'missing'}; expected 1 (projected) or 2 (geographic); ${DEM_CRS_HINT}`,
    { file },
  );
}
