/** The DEM module's public pieces. */
export type { CrsInfo, DemGrid } from './grid.js';
export { cellCentreX, cellCentreY, gridFromFunction, sharedFloat32 } from './grid.js';
export type { CrsResolver } from './crs-resolver.js';
export type { DemOpenOptions, DemSource } from './dem-source.js';
export type { DemDataType, DemTiling } from './tiff-layout.js';
export type { DemWindow, CellRange } from './window.js';
export { cellsInWindow } from './window.js';
export { openDem } from './geotiff-open.js';
export { readDemWindow, isEmptyGrid } from './read-window.js';
export type { DemMosaic } from './mosaic.js';
export { loadDemMosaic, MOSAIC_ALIGN_TOL_CELLS } from './mosaic.js';
export type { DemDescription, DemStats } from './describe-dem.js';
export { describeDem, demStats, metresPerDegree } from './describe-dem.js';
