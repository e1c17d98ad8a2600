/**
 * Brute-force terrain correction, the reference the zoned engine is timed and checked against:
 * every native cell within the radius an exact prism [Nagy2000] between the station's sphere
 * and the cell top, lowered by the sphere's drop at the cell centre (physics.md §5 "Earth
 * curvature"); the station's near window (the engine's (2m + 1)^2 cells) as 64 x 64
 * sub-prisms per cell of the same tapered, station-adjusted bilinear surface the engine
 * integrates there. Flat-topped sub-prisms on a slope err roughly in proportion to their size:
 * at 16 x 16 (1.9 m) the window alone is 0.01-0.03 mGal too high on this terrain at 2670 kg/m^3,
 * at 64 x 64 (0.47 m) a few thousandths. Geometric factors in metres (TC = G rho factor);
 * projected metre grids.
 */
import type { DemGrid } from '../../src/dem/grid.js';
import { prismGzFactor } from '../../src/kernels/prism.js';
import { bilinearHeight } from '../../src/terrain/grid-frame.js';
import { sphereDropM } from '../../src/terrain/geodesy.js';
import { EARTH_RADIUS_M } from '../../src/constants.js';

export interface BruteStation {
  x: number;
  y: number;
  heightM: number;
  /** Half width of the near window, native cells (plan.nearHalfCells). */
  halfCells: number;
  /** Taper radius of the height adjustment, m (plan.taperM). */
  taperM: number;
}

function stationCell(g: DemGrid, s: BruteStation): { col: number; row: number } {
  const colF = (s.x - g.originX) / g.cellSizeX - 0.5;
  const rowF = (g.originY - s.y) / g.cellSizeY - 0.5;
  return { col: Math.floor(colF + 0.5), row: Math.floor(rowF + 0.5) };
}

/**
 * Native cells within radiusM outside the near window, each one exact prism.
 * Writes the number of prisms evaluated into count[0]; returns the TC factor, m.
 */
export function bruteForceNativeFactor(g: DemGrid, s: BruteStation, radiusM: number, count: Float64Array): number {
  const rs = EARTH_RADIUS_M + s.heightM;
  const { col, row } = stationCell(g, s);
  const dx = g.cellSizeX;
  const dy = g.cellSizeY;
  const reachC = Math.ceil(radiusM / dx) + 1;
  const reachR = Math.ceil(radiusM / dy) + 1;
  const c0 = Math.max(0, col - reachC);
  const c1 = Math.min(g.width - 1, col + reachC);
  const r0 = Math.max(0, row - reachR);
  const r1 = Math.min(g.height - 1, row + reachR);
  const r2 = radiusM * radiusM;
  let sum = 0;
  let n = 0;
  for (let r = r0; r <= r1; r++) {
    const north = g.originY - (r + 0.5) * dy - s.y;
    const inRowWindow = Math.abs(r - row) <= s.halfCells;
    for (let c = c0; c <= c1; c++) {
      if (inRowWindow && Math.abs(c - col) <= s.halfCells) continue;
      const east = g.originX + (c + 0.5) * dx - s.x;
      const d2 = east * east + north * north;
      if (d2 > r2) continue;
      const drop = sphereDropM(Math.sqrt(d2), rs);
      const dH = (g.data[r * g.width + c] as number) - s.heightM;
      sum -= prismGzFactor(east - 0.5 * dx, east + 0.5 * dx, north - 0.5 * dy, north + 0.5 * dy, drop - dH, drop);
      n++;
    }
  }
  count[0] = n;
  return sum;
}

/** The near window as 64 x 64 flat-topped sub-prisms per native cell; TC factor, m. */
export function bruteForceNearFactor(g: DemGrid, s: BruteStation): number {
  const { col, row } = stationCell(g, s);
  const adjust = s.heightM - bilinearHeight(g, (s.x - g.originX) / g.cellSizeX - 0.5, (g.originY - s.y) / g.cellSizeY - 0.5);
  const sub = 64;
  const sx = g.cellSizeX / sub;
  const sy = g.cellSizeY / sub;
  let sum = 0;
  for (let r = row - s.halfCells; r <= row + s.halfCells; r++) {
    for (let c = col - s.halfCells; c <= col + s.halfCells; c++) {
      for (let i = 0; i < sub; i++) {
        for (let j = 0; j < sub; j++) {
          const x = g.originX + c * g.cellSizeX + (i + 0.5) * sx;
          const y = g.originY - r * g.cellSizeY - (j + 0.5) * sy;
          const east = x - s.x;
          const north = y - s.y;
          const rho = Math.hypot(east, north);
          let surf = bilinearHeight(g, (x - g.originX) / g.cellSizeX - 0.5, (g.originY - y) / g.cellSizeY - 0.5);
          if (rho < s.taperM) {
            const u = rho / s.taperM;
            surf += adjust * (1 - u * u * (3 - 2 * u));
          }
          sum -= prismGzFactor(east - 0.5 * sx, east + 0.5 * sx, north - 0.5 * sy, north + 0.5 * sy, s.heightM - surf, 0);
        }
      }
    }
  }
  return sum;
}
