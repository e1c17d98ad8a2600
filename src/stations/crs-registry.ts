/**
 * Coordinate reference systems by name: 'EPSG:n' (or a bare code n) from the offline table
 * crs-defs.json (made by make-crs-defs.sh from PROJ's projinfo), or a user's own proj4 string
 * ('+proj=...') or WKT. Every CRS that comes back can be converted to WGS84 by proj4 without a
 * grid file: definitions whose datum shift is unknown or needs a grid are refused here with an
 * InputError, never passed on to give silently shifted or NaN coordinates.
 */
import proj4 from 'proj4';
import type { CrsInfo } from '../dem/grid.js';
import { InputError, type InputErrorContext } from '../errors.js';
import { FOOT_M, US_SURVEY_FOOT_M } from '../units.js';
import defsFile from './crs-defs.json' with { type: 'json' };

interface CrsDef {
  name: string;
  kind: string;
  proj4: string;
  /** 'ok' | 'no_shift' (datum shift unknown offline) | 'grid' (needs a grid file). */
  status: string;
  /** Where the datum shift came from, or why there is none. */
  shift: string;
}

/** The fields of proj4's parsed projection that are read here (proj4's .d.ts omits some). */
interface ParsedProjection {
  projName?: string;
  units?: string;
  to_meter?: number;
  a?: number;
  es?: number;
  datum?: { datum_type?: number; grids?: { name: string; isNull: boolean }[] };
}

const DEFS: Readonly<Record<string, CrsDef>> = defsFile.defs;

/** proj4's datum_type codes (lib/constants/values.js of proj4 2.22). */
const PJD_3PARAM = 1;
const PJD_7PARAM = 2;
const PJD_GRIDSHIFT = 3;
const PJD_WGS84 = 4;
const PJD_NODATUM = 5;

/** WGS84 / GRS80 semi-major axis, m. */
const GEOCENTRIC_A_M = 6378137;

const EPSG_SPEC = /^\s*(?:epsg\s*:\s*)?(\d{1,6})\s*$/i;
const WKT_SPEC = /^\s*(PROJCS|GEOGCS|PROJCRS|GEOGCRS|GEODCRS|BOUNDCRS|COMPD_CS)\s*\[/i;

/** EPSG codes in the offline table that resolveCrs accepts, ascending. */
export function knownEpsgCodes(): number[] {
  return Object.keys(DEFS)
    .filter((k) => DEFS[k]?.status === 'ok')
    .map(Number)
    .sort((a, b) => a - b);
}

/** The table entry's name and where its datum shift came from (for provenance and docs). */
export function describeEpsg(code: number): { name: string; shift: string; status: string } | undefined {
  const d = DEFS[String(code)];
  return d === undefined ? undefined : { name: d.name, shift: d.shift, status: d.status };
}

/**
 * Resolves 'EPSG:n', 'epsg:n', a bare 'n', a proj4 string or a WKT string to a CrsInfo.
 * `context` (file, option name) is added to any InputError.
 */
export function resolveCrs(spec: string, context: InputErrorContext = {}): CrsInfo {
  const m = EPSG_SPEC.exec(spec);
  if (m !== null) return resolveEpsg(Number(m[1]), context);
  const trimmed = spec.trim();
  if (trimmed.startsWith('+') || WKT_SPEC.test(trimmed)) {
    const label = `user-defined (${trimmed.length > 80 ? trimmed.slice(0, 77) + '...' : trimmed})`;
    return checkedCrs(trimmed, label, undefined, context);
  }
  throw new InputError(
    `cannot read CRS '${spec}': expected EPSG:n (e.g. EPSG:32633), a proj4 string starting with '+proj=', or WKT`,
    context,
  );
}

function resolveEpsg(code: number, context: InputErrorContext): CrsInfo {
  const label = `EPSG:${code}`;
  const def = DEFS[String(code)];
  if (def === undefined) {
    throw new InputError(
      `unknown CRS code ${label}: not in talus's offline table of ${knownEpsgCodes().length} codes ` +
        `(WGS 84/NAD83/ETRS89/GDA UTM zones, national grids, some US State Plane zones); ` +
        `pass its proj4 string instead ('+proj=... +towgs84=...', e.g. from 'projinfo -o PROJ ${label}')`,
      context,
    );
  }
  if (def.status !== 'ok') {
    throw new InputError(
      `no datum shift to WGS84 known for ${label} (${def.name}: ${def.shift}); pass a proj4 string with +towgs84`,
      context,
    );
  }
  return checkedCrs(def.proj4, label, code, context);
}

/** Parses `definition` with proj4 and refuses what proj4 cannot convert to WGS84 faithfully. */
function checkedCrs(definition: string, label: string, epsg: number | undefined, context: InputErrorContext): CrsInfo {
  let p: ParsedProjection;
  try {
    p = proj4.Proj(definition) as unknown as ParsedProjection;
  } catch (e) {
    // proj4 throws plain strings ("Could not get projection name from: ...").
    throw new InputError(`cannot parse CRS ${label}: ${e instanceof Error ? e.message : String(e)}`, context);
  }
  const projName = String(p.projName ?? '');
  if (projName === 'geocent') {
    throw new InputError(`CRS ${label} is geocentric (x, y, z); expected a geographic or projected CRS`, context);
  }
  const datum = p.datum;
  const datumType = datum?.datum_type;
  const realGrids = (datum?.grids ?? []).filter((g) => !g.isNull).map((g) => g.name);
  if (realGrids.length > 0) {
    throw new InputError(
      `CRS ${label} needs the datum grid ${realGrids.join(', ')}, which talus cannot use offline; ` +
        `pass a proj4 string with +towgs84 instead of +nadgrids`,
      context,
    );
  }
  const shiftKnown =
    datumType === PJD_3PARAM ||
    datumType === PJD_7PARAM ||
    datumType === PJD_WGS84 ||
    datumType === PJD_GRIDSHIFT /* only @null grids are left here: an explicit 'no shift' */ ||
    (datumType === PJD_NODATUM && isGeocentricEllipsoid(p.a, p.es));
  if (!shiftKnown) {
    throw new InputError(`no datum shift to WGS84 known for ${label}; pass a proj4 string with +towgs84`, context);
  }
  const geographic = projName === 'longlat' || projName === 'latlong' || projName === 'lonlat' || projName === 'identity';
  const info: CrsInfo = {
    kind: geographic ? 'geographic' : 'projected',
    proj4: definition,
    label,
    linearUnitM: geographic ? NaN : linearUnitM(p.units, p.to_meter, label, context),
  };
  if (epsg !== undefined) info.epsg = epsg;
  return info;
}

/**
 * An ellipsoid for which "no datum shift" is right to well under a metre: WGS84 or GRS80
 * (a = 6378137 m, e^2 within 1e-8 of 0.00669438; they differ by 0.1 mm in latitude), or the
 * a = b = 6378137 m sphere of Web Mercator, whose coordinates are WGS84 by definition.
 */
function isGeocentricEllipsoid(aM: number | undefined, es: number | undefined): boolean {
  if (aM !== GEOCENTRIC_A_M || es === undefined) return false;
  return es === 0 || Math.abs(es - 0.00669438) < 1e-8;
}

function linearUnitM(units: string | undefined, toMeter: number | undefined, label: string, ctx: InputErrorContext): number {
  if (units === 'us-ft' || (units !== undefined && units.toLowerCase() === 'us survey foot')) return US_SURVEY_FOOT_M;
  if (units === 'ft' || (units !== undefined && units.toLowerCase() === 'foot')) return FOOT_M;
  if (toMeter !== undefined) {
    const f = Number(toMeter);
    if (Number.isFinite(f) && f > 0) return f;
    throw new InputError(`CRS ${label} has unit factor ${String(toMeter)}; expected a positive number of metres`, ctx);
  }
  if (units === undefined || units === 'm' || units.toLowerCase() === 'metre' || units.toLowerCase() === 'meter') return 1;
  if (units === 'km') return 1000;
  throw new InputError(`CRS ${label} has linear unit '${units}'; expected m, km, ft or us-ft (or +to_meter=)`, ctx);
}
