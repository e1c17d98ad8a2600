/**
 * Height types and the conversion between them: h (ellipsoidal) = H (orthometric) + N (geoid
 * undulation) [HeiskanenMoritz1967]. A DEM and stations on different height types must not be
 * compared or reduced together without a declared conversion (a geoid grid): the undulation is
 * tens of metres and would pass silently into the free-air and Bouguer terms.
 */
import { InputError } from '../errors.js';

export type HeightType = 'orthometric' | 'ellipsoidal';

export function isHeightType(s: string): s is HeightType {
  return s === 'orthometric' || s === 'ellipsoidal';
}

/** Parses a height type option value (case-insensitive). */
export function parseHeightType(text: string, field: string): HeightType {
  const s = text.trim().toLowerCase();
  if (!isHeightType(s)) throw new InputError(`unknown height type "${text}": expected orthometric or ellipsoidal`, { field });
  return s;
}

/**
 * A height of type `from` as type `to`, m, with geoid undulation `undulationM` (m, geoid above
 * the ellipsoid): h = H + N, H = h - N. Same type: unchanged (N unused). NaN N gives NaN.
 */
export function convertHeight(heightM: number, from: HeightType, to: HeightType, undulationM: number): number {
  if (from === to) return heightM;
  return from === 'orthometric' ? heightM + undulationM : heightM - undulationM;
}

/** convertHeight for every station; `undulationsM[i]` belongs to station i. */
export function convertHeights(
  heightsM: Float64Array,
  from: HeightType,
  to: HeightType,
  undulationsM: Float64Array,
): Float64Array {
  const out = new Float64Array(heightsM.length);
  for (let i = 0; i < heightsM.length; i++) {
    out[i] = convertHeight(heightsM[i] ?? NaN, from, to, undulationsM[i] ?? NaN);
  }
  return out;
}

/**
 * The rule for mixing height types: a DEM and stations of different types need a geoid grid.
 * Returns the InputError to throw, or null when the combination is allowed.
 */
export function heightTypeMixError(
  demHeightType: HeightType,
  stationHeightType: HeightType,
  geoidGridGiven: boolean,
): InputError | null {
  if (demHeightType === stationHeightType || geoidGridGiven) return null;
  return new InputError(
    `station heights are ${stationHeightType} but the DEM is ${demHeightType}: give a geoid undulation grid ` +
      `(--geoid) to convert between them, or declare matching height types`,
    { field: '--station-height-type' },
  );
}

/** Minimum number of finite misfits before a clustering claim is made. */
const MIN_MISFITS = 5;
/** |median| above which a constant offset looks like a geoid undulation, m (common practice: N is tens of m). */
const SUSPECT_OFFSET_M = 8;
/** MAD must be below this fraction of |median| for the misfits to "cluster". */
const MAX_MAD_FRACTION = 0.25;

function median(sorted: Float64Array): number {
  const n = sorted.length;
  const mid = n >> 1;
  return n % 2 === 1 ? (sorted[mid] ?? NaN) : ((sorted[mid - 1] ?? NaN) + (sorted[mid] ?? NaN)) / 2;
}

/**
 * Warns when station-minus-DEM height misfits (m; NaN entries ignored) cluster around a
 * constant of tens of metres, the signature of ellipsoidal heights compared with an
 * orthometric DEM (or the reverse): |median| > 8 m and median absolute deviation < 0.25 |median|,
 * over at least 5 stations. Returns the warning text, or null.
 */
export function suspectHeightTypeMismatch(misfitsM: Float64Array): string | null {
  const finite = misfitsM.filter((v) => Number.isFinite(v)).sort();
  if (finite.length < MIN_MISFITS) return null;
  const med = median(finite);
  const dev = finite.map((v) => Math.abs(v - med)).sort();
  const mad = median(dev);
  if (!(Math.abs(med) > SUSPECT_OFFSET_M && mad < MAX_MAD_FRACTION * Math.abs(med))) return null;
  const sign = med > 0 ? 'above' : 'below';
  return (
    `station heights lie a nearly constant ${Math.abs(med).toFixed(1)} m ${sign} the DEM ` +
    `(median misfit ${med.toFixed(2)} m, median absolute deviation ${mad.toFixed(2)} m, ${finite.length} stations): ` +
    `this looks like ellipsoidal heights against an orthometric DEM or the reverse (geoid undulation); ` +
    `check the declared height types`
  );
}
