/**
 * The zone around the station: a square window of (2m + 1)^2 native cells centred on the
 * station's cell, integrated in polar coordinates over a smooth surface through the station.
 *
 * Surface model (physics.md §5 "Inner zone"): the bilinear DEM surface B(e, n), shifted by the
 * station's height misfit and tapered back to the DEM over `taperM`:
 *   H(e, n) = B(e, n) + (h_s - B(0, 0)) w(rho),  w = 1 - u^2 (3 - 2u), u = rho / taperM (u < 1)
 * so that the surface passes through the station. Stations flagged above or below the terrain
 * pass adjustM = 0 and see the DEM surface as it is.
 *
 * Integral: with Delta = H - h_s, the vertical attraction of the mass between the station's
 * horizontal plane and the surface is, per unit area, G rho (1/rho - 1/sqrt(rho^2 + Delta^2))
 * (a vertical line element, even in Delta: hills and valleys both give a positive terrain
 * correction [Hammer1939]). In polar coordinates dA = rho d rho d theta, so
 *   TC = G rho ∫∫ Delta^2 / (q (q + rho)) d rho d theta,  q = sqrt(rho^2 + Delta^2),
 * whose integrand is bounded (< 1) even at the station: composite Gauss-Legendre in theta
 * (per side of the square, so the outer boundary rho_max(theta) is smooth) and in rho.
 * Flat geometry: the sphere drops < 2 mm within a few hundred metres.
 */
import type { DemGrid } from '../dem/grid.js';
import type { GridFrame } from './grid-frame.js';
import { bilinearHeight, blockGeometry, localToGrid } from './grid-frame.js';

/** 3-point Gauss-Legendre nodes and weights on [-1, 1] (common practice). */
const GL_X = [-Math.sqrt(0.6), 0, Math.sqrt(0.6)];
const GL_W = [5 / 9, 8 / 9, 5 / 9];

export interface NearZoneSpec {
  /** Station's native cell. */
  col: number;
  row: number;
  /** Half width of the window, cells. */
  halfCells: number;
  /** Station height, m. */
  stationHeightM: number;
  /** Height shift applied at the station and tapered away (h_s - B(0,0)), m; 0 for none. */
  adjustM: number;
  /** Taper radius, m. */
  taperM: number;
  /** Radius inside which terrain is skipped (field inner zone), m. */
  innerSkipM: number;
  /** Quadrature segment length, m (each segment carries 3 Gauss points). */
  segmentM: number;
}

export interface NearZoneResult {
  /** Geometric factor, m: TC = G rho factor. */
  factor: number;
  /** Quadrature points whose DEM value was missing (nodata or off the grid). */
  missing: number;
  /** Quadrature points evaluated. */
  points: number;
  /** Window bounds relative to the station, m: west, east, south, north. */
  bounds: [number, number, number, number];
}

/** Reusable state of integrateNearZone (one per thread): its result and small work arrays. */
export interface NearZoneScratch {
  result: NearZoneResult;
  /** Grid coordinates of one point. */
  gc: Float64Array;
  /** Block geometry of the window. */
  geom: Float64Array;
}

export function makeNearZoneScratch(): NearZoneScratch {
  return { result: { factor: 0, missing: 0, points: 0, bounds: [0, 0, 0, 0] }, gc: new Float64Array(2), geom: new Float64Array(4) };
}

/** Window bounds (west, east, south, north) in metres relative to the station. */
export function nearWindowBounds(
  frame: GridFrame,
  spec: NearZoneSpec,
  out: [number, number, number, number] = [0, 0, 0, 0],
  geom: Float64Array = new Float64Array(4),
): [number, number, number, number] {
  const m = spec.halfCells;
  blockGeometry(frame, spec.col - m, spec.col + m + 1, spec.row - m, spec.row + m + 1, geom);
  const e = geom[0] as number;
  const n = geom[1] as number;
  const w = geom[2] as number;
  const h = geom[3] as number;
  out[0] = e - w / 2;
  out[1] = e + w / 2;
  out[2] = n - h / 2;
  out[3] = n + h / 2;
  return out;
}

/**
 * Integrates the window. The result lives in `scratch` (pass one per thread so that nothing is
 * allocated per station) and is overwritten by the next call with the same scratch.
 */
export function integrateNearZone(grid: DemGrid, frame: GridFrame, spec: NearZoneSpec, scratch: NearZoneScratch = makeNearZoneScratch()): NearZoneResult {
  const result = scratch.result;
  const bounds = nearWindowBounds(frame, spec, result.bounds, scratch.geom);
  const west = bounds[0];
  const east = bounds[1];
  const south = bounds[2];
  const north = bounds[3];
  let factor = 0;
  result.missing = 0;
  result.points = 0;
  const gc = scratch.gc;
  localToGrid(frame, 0, 0, gc);
  const atStation = bilinearHeight(grid, gc[0] as number, gc[1] as number) + spec.adjustM - spec.stationHeightM;
  const offsetAtStation = Number.isFinite(atStation) ? Math.abs(atStation) : 0;
  for (let side = 0; side < 4; side++) {
    // Corners counter-clockwise from south-east (ES, EN, WN, WS); side k runs from corner k
    // to corner k + 1.
    const ax = side < 2 ? east : west;
    const ay = side === 0 || side === 3 ? south : north;
    const bx = side === 0 || side === 3 ? east : west;
    const by = side < 2 ? north : south;
    const ta = Math.atan2(ay, ax);
    let tb = Math.atan2(by, bx);
    while (tb <= ta) tb += 2 * Math.PI;
    // Perpendicular distance to the side and the angle of its outward normal.
    const sideLen = Math.hypot(bx - ax, by - ay);
    const nx = (by - ay) / sideLen;
    const ny = -(bx - ax) / sideLen;
    const dPerp = ax * nx + ay * ny;
    const tn = Math.atan2(ny, nx);
    const nTheta = Math.max(2, Math.ceil(sideLen / spec.segmentM));
    const hTheta = (tb - ta) / nTheta;
    for (let it = 0; it < nTheta; it++) {
      for (let gt = 0; gt < 3; gt++) {
        const theta = ta + hTheta * (it + 0.5 + 0.5 * (GL_X[gt] as number));
        const wTheta = 0.5 * hTheta * (GL_W[gt] as number);
        const rhoMax = dPerp / Math.cos(theta - tn);
        const rho0 = spec.innerSkipM;
        if (!(rhoMax > rho0)) continue;
        const ct = Math.cos(theta);
        const st = Math.sin(theta);
        // Segments of about segmentM; when the surface misses the station by d0 (no height
        // adjustment), the integrand changes on the scale d0 near the station, so the first
        // metres are split geometrically from d0 / 8 upward.
        let ray = 0;
        let a = rho0;
        if (offsetAtStation > 0 && rho0 < spec.segmentM) {
          let b = Math.max(rho0, offsetAtStation / 8);
          if (b > a) {
            ray += raySegment(grid, frame, spec, ct, st, a, b, gc, result);
            a = b;
          }
          while (a < spec.segmentM && a < rhoMax) {
            b = Math.min(rhoMax, spec.segmentM, a * 4);
            ray += raySegment(grid, frame, spec, ct, st, a, b, gc, result);
            a = b;
          }
        }
        if (rhoMax > a) {
          const nRho = Math.max(1, Math.ceil((rhoMax - a) / spec.segmentM));
          const hRho = (rhoMax - a) / nRho;
          for (let ir = 0; ir < nRho; ir++) ray += raySegment(grid, frame, spec, ct, st, a + ir * hRho, a + (ir + 1) * hRho, gc, result);
        }
        factor += wTheta * ray;
      }
    }
  }
  result.factor = factor;
  return result;
}

/** 3-point Gauss-Legendre over rho in [a, b] along one ray (direction ct, st). */
function raySegment(
  grid: DemGrid,
  frame: GridFrame,
  spec: NearZoneSpec,
  ct: number,
  st: number,
  a: number,
  b: number,
  gc: Float64Array,
  counts: NearZoneResult,
): number {
  const half = 0.5 * (b - a);
  const mid = 0.5 * (a + b);
  let sum = 0;
  for (let g = 0; g < 3; g++) {
    const rho = mid + half * (GL_X[g] as number);
    localToGrid(frame, rho * ct, rho * st, gc);
    const h = bilinearHeight(grid, gc[0] as number, gc[1] as number);
    counts.points++;
    if (Number.isNaN(h)) {
      counts.missing++;
      continue;
    }
    let delta = h - spec.stationHeightM;
    if (spec.adjustM !== 0 && rho < spec.taperM) {
      const u = rho / spec.taperM;
      delta += spec.adjustM * (1 - u * u * (3 - 2 * u));
    }
    const q = Math.sqrt(rho * rho + delta * delta);
    sum += (half * (GL_W[g] as number) * delta * delta) / (q * (q + rho));
  }
  return sum;
}
