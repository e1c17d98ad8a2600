/**
 * Attraction kernels: pure geometric factors F (z positive down, result positive down),
 * g = G rho F applied once in src/attraction.ts.
 */
export { prismGzFactor } from './prism.js';
export { sumPrismsGzFactor } from './prism-batch.js';
export { lineElementGzFactor, lineElementGauss2x2GzFactor } from './line-element.js';
export { pointMassGzFactor } from './point-mass.js';
export { radialColumnGzFactor } from './radial-column.js';
export { hammerSectorGzFactor, HAMMER_ZONES } from './ring-sector.js';
export type { HammerZone } from './ring-sector.js';
export { createNeumaierState, neumaierReset, neumaierAdd, neumaierResult } from './compensated-sum.js';
export {
  lineElementRelError,
  gauss2x2RelError,
  prismCancellationRelError,
  LINE_ELEMENT_ERROR_COEFF,
  GAUSS2X2_ERROR_COEFF,
  PRISM_CANCELLATION_COEFF,
} from './far-field-error.js';
