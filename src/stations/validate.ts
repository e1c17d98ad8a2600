/**
 * Checks on single cells and on the whole station table. Cell checks throw an InputError
 * naming file, line, station, column, the value and what was expected; the reader decides
 * whether that is fatal (default) or turns the row into a 'bad_row' flag (keepGoing).
 */
import { InputError, type InputErrorContext } from '../errors.js';
import { FOOT_M, type LengthUnit } from '../units.js';

/** Plain decimal numbers: optional sign, digits with optional '.', optional exponent. */
const DECIMAL = /^[+-]?(?:\d+\.?\d*|\.\d+)(?:[eE][+-]?\d+)?$/;

/** Lowest and highest plausible station height, m (below the Dead Sea shore; above Everest). */
export const MIN_HEIGHT_M = -500;
export const MAX_HEIGHT_M = 9000;

/** Horizontal distance under which two stations are flagged 'duplicate_position', m. */
export const DUPLICATE_POSITION_M = 0.01;

/**
 * A required number: a plain decimal (no hex, no 'Infinity', no decimal comma), finite.
 * `what` says what was expected, e.g. "a longitude in degrees".
 */
export function parseRequiredNumber(cell: string | undefined, what: string, ctx: InputErrorContext, field?: string): number {
  const s = cell === undefined ? '' : cell.trim();
  if (s === '') throw new InputError(`empty value; expected ${what}`, withField(ctx, field));
  if (!DECIMAL.test(s)) throw new InputError(`'${s}' is not a number; expected ${what} (decimal point '.')`, withField(ctx, field));
  const v = Number(s);
  if (!Number.isFinite(v)) throw new InputError(`'${s}' is not finite; expected ${what}`, withField(ctx, field));
  return v;
}

/** The context with the column name added (built only when a message is made). */
function withField(ctx: InputErrorContext, field: string | undefined): InputErrorContext {
  return field === undefined ? ctx : { ...ctx, field };
}

/** An optional number: empty cell → NaN (documented: the station gets no anomaly); text → error. */
export function parseOptionalNumber(cell: string | undefined, what: string, ctx: InputErrorContext, field?: string): number {
  const s = cell === undefined ? '' : cell.trim();
  if (s === '') return NaN;
  return parseRequiredNumber(s, what, ctx, field);
}

export function checkLatitude(latDeg: number, ctx: InputErrorContext, field?: string): void {
  if (!(latDeg >= -90 && latDeg <= 90)) {
    throw new InputError(`latitude ${latDeg} is outside [-90, 90] degrees`, withField(ctx, field));
  }
}

export function checkLongitude(lonDeg: number, ctx: InputErrorContext, field?: string): void {
  if (!(lonDeg >= -180 && lonDeg < 360)) {
    throw new InputError(`longitude ${lonDeg} is outside [-180, 360) degrees`, withField(ctx, field));
  }
}

/**
 * Station height in metres within [MIN_HEIGHT_M, MAX_HEIGHT_M]. `raw` is the value in the file's
 * unit; when the file is in metres and the value would be plausible in feet, the message says so.
 */
export function checkHeight(heightM: number, raw: number, unit: LengthUnit, ctx: InputErrorContext, field?: string): void {
  if (heightM >= MIN_HEIGHT_M && heightM <= MAX_HEIGHT_M) return;
  const shown = unit === 'm' ? `${raw} m` : `${raw} ${unit} (${heightM} m)`;
  const feetHint =
    unit === 'm' && raw > MAX_HEIGHT_M && raw * FOOT_M <= MAX_HEIGHT_M ? '; did you mean --height-units ft?' : '';
  throw new InputError(`height ${shown} is outside [${MIN_HEIGHT_M}, ${MAX_HEIGHT_M}] m${feetHint}`, withField(ctx, field));
}

/**
 * Index pairs of stations closer than DUPLICATE_POSITION_M horizontally. `eastM`/`northM` are
 * metric coordinates (projected CRS × unit, or a local equirectangular approximation for
 * lon/lat, good to well under 1 % over 1 cm). NaN positions are skipped. O(n log n): sort by
 * northing and compare each station with the following ones within the threshold.
 */
export function duplicatePositions(eastM: Float64Array, northM: Float64Array): [number, number][] {
  const order: number[] = [];
  for (let i = 0; i < eastM.length; i++) {
    if (!Number.isNaN(eastM[i] as number) && !Number.isNaN(northM[i] as number)) order.push(i);
  }
  order.sort((a, b) => (northM[a] as number) - (northM[b] as number));
  const pairs: [number, number][] = [];
  const limit2 = DUPLICATE_POSITION_M * DUPLICATE_POSITION_M;
  for (let k = 0; k < order.length; k++) {
    const i = order[k] as number;
    for (let m = k + 1; m < order.length; m++) {
      const j = order[m] as number;
      const dn = (northM[j] as number) - (northM[i] as number);
      if (dn > DUPLICATE_POSITION_M) break;
      const de = (eastM[j] as number) - (eastM[i] as number);
      if (de * de + dn * dn <= limit2) pairs.push(i < j ? [i, j] : [j, i]);
    }
  }
  return pairs;
}

/** Metres per degree of latitude and of longitude at the equator (WGS84, rounded; for the duplicate check only). */
const M_PER_DEG_LAT = 111_132;
const M_PER_DEG_LON_EQUATOR = 111_320;

/** Local metric coordinates of lon/lat degrees for duplicatePositions (longitudes folded to [-180, 180)). */
export function lonLatToLocalMetres(lonDeg: Float64Array, latDeg: Float64Array): { eastM: Float64Array; northM: Float64Array } {
  const n = lonDeg.length;
  const eastM = new Float64Array(n);
  const northM = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    const lat = latDeg[i] as number;
    let lon = lonDeg[i] as number;
    if (lon >= 180) lon -= 360;
    eastM[i] = lon * M_PER_DEG_LON_EQUATOR * Math.cos((lat * Math.PI) / 180);
    northM[i] = lat * M_PER_DEG_LAT;
  }
  return { eastM, northM };
}
