/**
 * Gravity reduction formulas: normal gravity, atmosphere, free-air, Bouguer slab and cap,
 * anomalies. SI units in and out (m, degrees for latitude, kg/m^3, m/s^2).
 */
export { normalGravity, isNormalFormula, NORMAL_FORMULAS } from './normal-gravity.js';
export type { NormalFormula, NormalFormulaInfo } from './normal-gravity.js';
export {
  normalGravityAtHeight,
  GRS80_SEMI_MAJOR_AXIS_M,
  GRS80_FLATTENING,
  GRS80_M,
} from './normal-gravity-height.js';
export { normalGravityEllipsoidal, GRS80_GM_M3_S2, GRS80_OMEGA_RAD_S } from './normal-gravity-ellipsoidal.js';
export { atmosphericCorrection } from './atmosphere.js';
export { freeAirCorrection, isFreeAirOrder, FREE_AIR_GRADIENT_MS2_PER_M } from './free-air.js';
export type { FreeAirOrder } from './free-air.js';
export { bouguerSlab } from './bouguer-slab.js';
export { bouguerCap, bullardB } from './bouguer-cap.js';
export { anomalies } from './anomalies.js';
export type { AnomalyTerms, Anomalies } from './anomalies.js';
