/**
 * The invented survey of the engine benchmark: a rugged 30 m fine DEM over 60 x 60 km, a 1 km
 * far-zone DEM over 400 x 400 km (the fine area + 170 km all round) from the same terrain
 * function, and stations at random positions on the fine DEM's surface. Projected metres,
 * both grids centred on the origin, so the far-to-fine CRS map is the identity.
 */
import type { DemGrid } from '../../src/dem/grid.js';
import { gridFromFunction } from '../../src/dem/grid.js';
import { bilinearHeight } from '../../src/terrain/grid-frame.js';
import type { StationArrays } from '../../src/engine/batch.js';
import { sharedFloat64 } from '../../src/engine/batch.js';
import { makeUniform } from '../helpers/seeded-random.js';

export const FINE_CELL_M = 30;
export const FINE_CELLS = 2000;
export const FAR_CELL_M = 1000;
export const FAR_CELLS = 400;
export const STATION_LAT_DEG = 45;

const CRS = {
  kind: 'projected' as const,
  proj4: '+proj=tmerc +lat_0=45 +lon_0=10 +k=1 +x_0=0 +y_0=0 +ellps=GRS80 +units=m +no_defs',
  label: 'synthetic TM',
  linearUnitM: 1,
};

/**
 * Invented terrain, m: ridges, a valley system, short steep features (slopes to ~40 deg) and
 * an escarpment, on a broad regional relief (wavelengths of 100-400 km, +-700 m).
 */
export function terrainHeightM(x: number, y: number): number {
  const rugged =
    800 +
    300 * Math.sin(x / 2300) * Math.cos(y / 1700) +
    120 * Math.sin(x / 410 + y / 530) +
    40 * Math.cos(x / 97 - y / 133) +
    250 * Math.tanh((x - 0.3 * y - 3000) / 800);
  const regional = 450 * Math.sin(x / 41_000 + 0.7) * Math.cos(y / 57_000 - 0.3) + 250 * Math.sin((x + 0.5 * y) / 90_000);
  return rugged + regional;
}

function squareGrid(cells: number, cellM: number, source: string): DemGrid {
  const half = (cells * cellM) / 2;
  return gridFromFunction(
    { width: cells, height: cells, originX: -half, originY: half, cellSizeX: cellM, cellSizeY: cellM, crs: CRS, source },
    (x, y) => terrainHeightM(x, y),
  );
}

export function makeFineGrid(): DemGrid {
  return squareGrid(FINE_CELLS, FINE_CELL_M, 'synthetic fine DEM, 30 m');
}

export function makeFarGrid(): DemGrid {
  return squareGrid(FAR_CELLS, FAR_CELL_M, 'synthetic far-zone DEM, 1 km');
}

/**
 * `count` stations uniformly at random at least `edgeM` inside the fine grid, each at the
 * bilinear DEM height of its position (on the surface), latitude STATION_LAT_DEG.
 */
export function makeStations(fine: DemGrid, count: number, edgeM: number, seed: number): StationArrays {
  const uniform = makeUniform(seed);
  const st: StationArrays = {
    count,
    fineX: sharedFloat64(count),
    fineY: sharedFloat64(count),
    farX: sharedFloat64(count),
    farY: sharedFloat64(count),
    latDeg: sharedFloat64(count),
    heightM: sharedFloat64(count),
    active: new Uint8Array(new SharedArrayBuffer(count)),
  };
  const spanX = fine.width * fine.cellSizeX - 2 * edgeM;
  const spanY = fine.height * fine.cellSizeY - 2 * edgeM;
  for (let i = 0; i < count; i++) {
    const x = fine.originX + edgeM + spanX * uniform();
    const y = fine.originY - edgeM - spanY * uniform();
    st.fineX[i] = x;
    st.fineY[i] = y;
    st.farX[i] = x;
    st.farY[i] = y;
    st.latDeg[i] = STATION_LAT_DEG;
    st.heightM[i] = bilinearHeight(fine, (x - fine.originX) / fine.cellSizeX - 0.5, (fine.originY - y) / fine.cellSizeY - 0.5);
    st.active[i] = 1;
  }
  return st;
}

/** Distance from (x, y) to the nearest edge of the grid, m (projected grids). */
export function distanceToEdgeM(g: DemGrid, x: number, y: number): number {
  const west = x - g.originX;
  const east = g.originX + g.width * g.cellSizeX - x;
  const north = g.originY - y;
  const south = y - (g.originY - g.height * g.cellSizeY);
  return Math.min(west, east, north, south);
}
