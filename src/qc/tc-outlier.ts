/**
 * tc_outlier: a terrain correction far from those of its neighbours at similar heights.
 * Stations close together and at about the same height sit in about the same terrain, so
 * their corrections should be close; a station whose TC departs from the median of such
 * neighbours by more than max(limitMgal, madFactor * robust sigma of the neighbours) is
 * flagged (median/MAD rule: robust to outliers among the neighbours themselves; common
 * practice). Neighbours come from a grid index with ring search: O(n k) for n stations.
 */
import { buildGridIndex } from './grid-index.js';
import { MAD_TO_SIGMA } from '../density/robust-fit.js';

export interface TcOutlierOptions {
  /** Neighbours compared with, k (default 8). */
  neighbours?: number;
  /** Smallest departure from the neighbours' median that is flagged, mGal (default 1). */
  limitMgal?: number;
  /** Neighbours must be within this height of the station, m (default 50). */
  heightWindowM?: number;
  /** Neighbours must be within this horizontal distance, m (default 5000). */
  searchRadiusM?: number;
  /** Departure limit in robust standard deviations of the neighbours' TC (default 5). */
  madFactor?: number;
  /** Fewer usable neighbours than this and the station is not judged (default 3). */
  minNeighbours?: number;
}

export const TC_OUTLIER_DEFAULTS = {
  neighbours: 8,
  limitMgal: 1,
  heightWindowM: 50,
  searchRadiusM: 5000,
  madFactor: 5,
  minNeighbours: 3,
} as const;

/** A search gives up after examining this many candidates per wanted neighbour (bounds the work where heights differ). */
const MAX_EXAMINED_PER_NEIGHBOUR = 64;

/**
 * One flag per station (true = tc_outlier). Coordinates in metres (project lon/lat first).
 * Stations with a non-finite position, height or TC are never flagged and never neighbours.
 */
export function tcOutlierFlags(
  xM: Float64Array,
  yM: Float64Array,
  heightM: Float64Array,
  tcMgal: Float64Array,
  opts: TcOutlierOptions = {},
): boolean[] {
  const k = opts.neighbours ?? TC_OUTLIER_DEFAULTS.neighbours;
  const limit = opts.limitMgal ?? TC_OUTLIER_DEFAULTS.limitMgal;
  const window = opts.heightWindowM ?? TC_OUTLIER_DEFAULTS.heightWindowM;
  const radius = opts.searchRadiusM ?? TC_OUTLIER_DEFAULTS.searchRadiusM;
  const factor = opts.madFactor ?? TC_OUTLIER_DEFAULTS.madFactor;
  const minNb = opts.minNeighbours ?? TC_OUTLIER_DEFAULTS.minNeighbours;
  if (!(k >= 1) || !(limit >= 0) || !(window >= 0) || !(radius > 0) || !(factor >= 0) || !(minNb >= 1)) {
    throw new RangeError('tcOutlierFlags: options must be positive numbers');
  }
  const n = xM.length;
  const usable = (i: number): boolean =>
    Number.isFinite(xM[i]) && Number.isFinite(yM[i]) && Number.isFinite(heightM[i]) && Number.isFinite(tcMgal[i]);
  const ux = Float64Array.from(xM, (v, i) => (usable(i) ? v : NaN));
  const grid = buildGridIndex(ux, yM);
  const { cellSize: cs, nx, ny, start, order } = grid;
  const flags = new Array<boolean>(n).fill(false);
  const bestD = new Float64Array(k);
  const bestJ = new Int32Array(k);
  const nbTc = new Float64Array(k);
  const dev = new Float64Array(k);
  // rings beyond the grid hold nothing (and a survey of one or two points has a tiny cell)
  const maxRing = Math.min(Math.ceil(radius / cs) + 1, Math.max(nx, ny));
  const radius2 = radius * radius;
  const maxExamined = MAX_EXAMINED_PER_NEIGHBOUR * k;
  for (let i = 0; i < n; i++) {
    if (!usable(i)) continue;
    const xi = xM[i] as number, yi = yM[i] as number, hi = heightM[i] as number;
    const ci = Math.min(nx - 1, Math.floor((xi - grid.minX) / cs));
    const cj = Math.min(ny - 1, Math.floor((yi - grid.minY) / cs));
    let found = 0;
    let examined = 0;
    for (let ring = 0; ring <= maxRing && examined < maxExamined; ring++) {
      const j0 = cj - ring, j1 = cj + ring;
      for (let gj = Math.max(0, j0); gj <= Math.min(ny - 1, j1); gj++) {
        const edgeRow = gj === j0 || gj === j1;
        const step = edgeRow ? 1 : 2 * ring;
        for (let gi = ci - ring; gi <= ci + ring; gi += Math.max(1, step)) {
          if (gi < 0 || gi >= nx) continue;
          const c = gj * nx + gi;
          for (let p = start[c] as number; p < (start[c + 1] as number); p++) {
            const j = order[p] as number;
            if (j === i) continue;
            examined++;
            if (!(Math.abs((heightM[j] as number) - hi) <= window)) continue;
            const ex = (xM[j] as number) - xi;
            const ey = (yM[j] as number) - yi;
            const d = ex * ex + ey * ey; // squared distance
            if (!(d <= radius2)) continue;
            if (found === k && d >= (bestD[k - 1] as number)) continue;
            // insertion into the sorted best-k list
            let s = found < k ? found++ : k - 1;
            while (s > 0 && (bestD[s - 1] as number) > d) {
              bestD[s] = bestD[s - 1] as number;
              bestJ[s] = bestJ[s - 1] as number;
              s--;
            }
            bestD[s] = d;
            bestJ[s] = j;
          }
        }
      }
      // every point beyond this ring is at least ring * cellSize away
      if (found === k && (bestD[k - 1] as number) <= (ring * cs) ** 2) break;
    }
    if (found < minNb) continue;
    for (let s = 0; s < found; s++) nbTc[s] = tcMgal[bestJ[s] as number] as number;
    const m = sortedMedian(nbTc.subarray(0, found));
    for (let s = 0; s < found; s++) dev[s] = Math.abs((nbTc[s] as number) - m);
    const sigma = MAD_TO_SIGMA * sortedMedian(dev.subarray(0, found));
    flags[i] = Math.abs((tcMgal[i] as number) - m) > Math.max(limit, factor * sigma);
  }
  return flags;
}

/** Median of a small scratch array, sorting it in place (no allocation). */
function sortedMedian(a: Float64Array): number {
  a.sort();
  const n = a.length;
  return n % 2 === 1 ? (a[(n - 1) / 2] as number) : ((a[n / 2 - 1] as number) + (a[n / 2] as number)) / 2;
}
