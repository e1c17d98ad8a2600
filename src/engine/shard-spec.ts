/**
 * `--shard K/N`: which stations one machine of a cluster computes. The stations are ordered by
 * their distance along a Hilbert curve over their lon/lat (16 bits per axis over the bounding box
 * of all finite positions; unlike a Morton order, every block of a Hilbert order is one connected
 * piece of the plane), ties broken by input order; stations without a finite position sort last. The
 * ordered list is cut into N contiguous blocks whose sizes differ by at most one (block K holds
 * ordered positions floor((K-1)n/N) up to floor(Kn/N)), so each share is spatially compact and
 * needs a smaller DEM window. Deterministic: every machine derives the same shares from the
 * same station file.
 */
import { InputError } from '../errors.js';

export interface ShardSpec {
  /** This machine's share, 1-based. */
  k: number;
  /** Number of shares. */
  n: number;
}

/** Parses `K/N` (whole numbers, 1 <= K <= N). */
export function parseShard(value: string): ShardSpec {
  const m = /^\s*(\d+)\s*\/\s*(\d+)\s*$/.exec(value);
  const k = m ? Number(m[1]) : NaN;
  const n = m ? Number(m[2]) : NaN;
  if (!(Number.isSafeInteger(k) && Number.isSafeInteger(n) && k >= 1 && k <= n)) {
    throw new InputError(`option --shard: "${value}" is not a share of the run; expected K/N with whole numbers 1 <= K <= N, e.g. 2/8`);
  }
  return { k, n };
}

const AXIS_BITS = 16;
const AXIS_MAX = (1 << AXIS_BITS) - 1;

/** Distance of cell (x, y) along the Hilbert curve over a 2^16 x 2^16 grid (the classic xy-to-d walk). */
function hilbertIndex(x: number, y: number): number {
  let d = 0;
  for (let s = 1 << (AXIS_BITS - 1); s > 0; s >>= 1) {
    const rx = (x & s) > 0 ? 1 : 0;
    const ry = (y & s) > 0 ? 1 : 0;
    d += s * s * ((3 * rx) ^ ry);
    if (ry === 0) {
      if (rx === 1) {
        x = s - 1 - x;
        y = s - 1 - y;
      }
      const t = x;
      x = y;
      y = t;
    }
  }
  return d;
}

/** Hilbert keys of lon/lat over their bounding box; Infinity where the position is not finite. */
export function hilbertKeys(lonDeg: Float64Array, latDeg: Float64Array): Float64Array {
  let minLon = Infinity, maxLon = -Infinity, minLat = Infinity, maxLat = -Infinity;
  for (let i = 0; i < lonDeg.length; i++) {
    const lon = lonDeg[i] as number, lat = latDeg[i] as number;
    if (!(Number.isFinite(lon) && Number.isFinite(lat))) continue;
    minLon = Math.min(minLon, lon); maxLon = Math.max(maxLon, lon);
    minLat = Math.min(minLat, lat); maxLat = Math.max(maxLat, lat);
  }
  const q = (v: number, lo: number, hi: number): number => (hi > lo ? Math.min(AXIS_MAX, Math.floor(((v - lo) / (hi - lo)) * (AXIS_MAX + 1))) : 0);
  const keys = new Float64Array(lonDeg.length);
  for (let i = 0; i < lonDeg.length; i++) {
    const lon = lonDeg[i] as number, lat = latDeg[i] as number;
    keys[i] = Number.isFinite(lon) && Number.isFinite(lat) ? hilbertIndex(q(lon, minLon, maxLon), q(lat, minLat, maxLat)) : Infinity;
  }
  return keys;
}

/** 1 for the stations of share `spec`, 0 for the others. */
export function shardMask(lonDeg: Float64Array, latDeg: Float64Array, spec: ShardSpec): Uint8Array {
  const n = lonDeg.length;
  const keys = hilbertKeys(lonDeg, latDeg);
  const order = Array.from({ length: n }, (_, i) => i);
  order.sort((a, b) => (keys[a] as number) - (keys[b] as number) || a - b);
  const mask = new Uint8Array(n);
  const from = Math.floor(((spec.k - 1) * n) / spec.n);
  const to = Math.floor((spec.k * n) / spec.n);
  for (let p = from; p < to; p++) mask[order[p] as number] = 1;
  return mask;
}
