/**
 * The gravity reduction of every station from its terrain result: normal gravity,
 * atmospheric, free-air, slab and cap Bouguer corrections and the anomalies, at the main
 * density and at every extra density (from the unit-density terms, so densities cost
 * nothing). mGal from here on: these are output columns.
 */
import { normalGravity, type NormalFormula } from '../reduction/normal-gravity.js';
import { atmosphericCorrection } from '../reduction/atmosphere.js';
import { freeAirCorrection, type FreeAirOrder } from '../reduction/free-air.js';
import { bouguerSlab } from '../reduction/bouguer-slab.js';
import { bouguerCap } from '../reduction/bouguer-cap.js';
import { UNIT_DENSITY_KG_M3 } from '../constants.js';
import { MGAL } from '../units.js';

export interface ReductionSettings {
  densityKgM3: number;
  densitiesKgM3: number[];
  normalFormula: NormalFormula;
  freeAirOrder: FreeAirOrder;
  bouguer: 'cap' | 'slab';
  capRadiusM: number;
  /** Add the field inner-zone TC column to the CBA. */
  useInnerTc: boolean;
}

export interface StationReduction {
  normalMgal: number;
  atmMgal: number;
  freeAirCorrMgal: number;
  slabMgal: number;
  capMgal: number;
  bouguerUnitMgal: number;
  tcMgal: number;
  topoEffectMgal: number;
  faaMgal: number;
  sbaMgal: number;
  cbaMgal: number;
  /** CBA at each of settings.densitiesKgM3. */
  cbaAtMgal: number[];
}

/**
 * @param latDeg station latitude
 * @param heightM station height (the datum of the normal formula)
 * @param gobsMgal observed gravity (NaN: anomalies NaN)
 * @param tcUnitMgal terrain correction at 1000 kg/m^3 (NaN when not computed)
 * @param innerTcMgal field inner-zone TC (used only when settings.useInnerTc)
 */
export function reduceStation(
  s: ReductionSettings,
  latDeg: number,
  heightM: number,
  gobsMgal: number,
  tcUnitMgal: number,
  innerTcMgal: number,
): StationReduction {
  const rho = s.densityKgM3;
  const normalMgal = normalGravity(latDeg, s.normalFormula) / MGAL;
  const atmMgal = atmosphericCorrection(heightM) / MGAL;
  const freeAirCorrMgal = freeAirCorrection(heightM, latDeg, s.freeAirOrder) / MGAL;
  const slabMgal = bouguerSlab(heightM, rho) / MGAL;
  const capMgal = bouguerCap(heightM, rho, s.capRadiusM) / MGAL;
  const bouguerUnitMgal =
    (s.bouguer === 'cap' ? bouguerCap(heightM, UNIT_DENSITY_KG_M3, s.capRadiusM) : bouguerSlab(heightM, UNIT_DENSITY_KG_M3)) / MGAL;
  const scale = rho / UNIT_DENSITY_KG_M3;
  const tcMgal = tcUnitMgal * scale;
  const inner = s.useInnerTc ? innerTcMgal : 0;
  // [Hinze2005]: FAA = g_obs - gamma0 + FAC + g_atm; SBA = FAA - BC; CBA = SBA + TC
  const faaMgal = gobsMgal - normalMgal + freeAirCorrMgal + atmMgal;
  const sbaMgal = faaMgal - bouguerUnitMgal * scale;
  const cbaMgal = sbaMgal + tcMgal + inner;
  const cbaAtMgal = s.densitiesKgM3.map((d) => {
    const k = d / UNIT_DENSITY_KG_M3;
    return faaMgal - bouguerUnitMgal * k + tcUnitMgal * k + inner;
  });
  return {
    normalMgal,
    atmMgal,
    freeAirCorrMgal,
    slabMgal,
    capMgal,
    bouguerUnitMgal,
    tcMgal,
    topoEffectMgal: capMgal - tcMgal,
    faaMgal,
    sbaMgal,
    cbaMgal,
    cbaAtMgal,
  };
}
