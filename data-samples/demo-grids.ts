/**
 * Georeferencing of the two demo DEMs (DemGrid convention: west and north edges, cell sizes).
 * - fine: 800 x 800 cells of 30 m in UTM 33N, 24 km x 24 km centred on the survey centre;
 * - far: 510 x 340 cells of 0.01 deg in WGS 84 lon/lat, the fine area plus more than 170 km
 *   on every side (make-demo.ts and the demo tests check the margin).
 */
export const FINE_DEM = {
  width: 800,
  height: 800,
  originX: 488000,
  originY: 5212000,
  cellSizeX: 30,
  cellSizeY: 30,
};

export const FAR_DEM = {
  width: 510,
  height: 340,
  originX: 12.45,
  originY: 48.65,
  cellSizeX: 0.01,
  cellSizeY: 0.01,
};
