/**
 * The reduction columns of a run (docs/results-columns.md), filled from the terrain results:
 * corrections, anomalies at the main and extra densities, per-zone TC and coverage.
 */
import type { StationTable } from '../stations/table.js';
import { UNIT_DENSITY_KG_M3 } from '../constants.js';
import { TR } from '../terrain/station-terrain.js';
import type { OutputColumn } from '../io/results-csv.js';
import { RESULT_WIDTH } from './batch.js';
import { reduceStation, type ReductionSettings } from './reduction-terms.js';

export function reductionColumns(
  settings: ReductionSettings,
  table: StationTable,
  reductionHeightM: Float64Array,
  gobsIgsn71Mgal: Float64Array,
  results: Float64Array,
  active: Uint8Array,
) {
  const n = table.ids.length;
  const o = settings;
  const col = (name: string, decimals: number): OutputColumn => ({ name, decimals, values: new Float64Array(n).fill(NaN) });
  const c = {
    demH: col('dem_height_m', 3),
    misfit: col('height_misfit_m', 3),
    normal: col('normal_gravity_mgal', 4),
    atm: col('atmospheric_corr_mgal', 4),
    fac: col('free_air_corr_mgal', 4),
    slab: col('bouguer_slab_mgal', 4),
    cap: col('bouguer_cap_mgal', 4),
    bUnit: col('bouguer_unit_mgal', 4),
    tc: col('terrain_corr_mgal', 4),
    tcUnit: col('terrain_corr_unit_mgal', 4),
    topo: col('topo_effect_mgal', 4),
    faa: col('free_air_anomaly_mgal', 4),
    sba: col('simple_bouguer_mgal', 4),
    cba: col('complete_bouguer_mgal', 4),
  };
  const extra = o.densitiesKgM3.map((d) => col(`complete_bouguer_mgal_d${d}`, 4));
  const zones = { inner: col('tc_inner_mgal', 4), middle: col('tc_middle_mgal', 4), outer: col('tc_outer_mgal', 4) };
  const coverage = col('dem_coverage', 5);
  let kernelEvals = 0;
  let computed = 0;
  const scale = o.densityKgM3 / UNIT_DENSITY_KG_M3;
  const v = (oc: OutputColumn): Float64Array => oc.values as Float64Array;
  for (let i = 0; i < n; i++) {
    if (active[i] !== 1) continue;
    const base = i * RESULT_WIDTH;
    const tcUnit = results[base + TR.tcUnitMgal] as number;
    const r = reduceStation(settings, table.latDeg[i] as number, reductionHeightM[i] as number, gobsIgsn71Mgal[i] as number, tcUnit, table.innerTcMgal[i] as number);
    v(c.demH)[i] = results[base + TR.demHeightM] as number;
    v(c.misfit)[i] = results[base + TR.misfitM] as number;
    v(c.normal)[i] = r.normalMgal;
    v(c.atm)[i] = r.atmMgal;
    v(c.fac)[i] = r.freeAirCorrMgal;
    v(c.slab)[i] = r.slabMgal;
    v(c.cap)[i] = r.capMgal;
    v(c.bUnit)[i] = r.bouguerUnitMgal;
    v(c.tc)[i] = r.tcMgal;
    v(c.tcUnit)[i] = tcUnit;
    v(c.topo)[i] = r.topoEffectMgal;
    v(c.faa)[i] = r.faaMgal;
    v(c.sba)[i] = r.sbaMgal;
    v(c.cba)[i] = r.cbaMgal;
    extra.forEach((e, k) => (v(e)[i] = r.cbaAtMgal[k] as number));
    v(zones.inner)[i] = (results[base + TR.tcInnerUnitMgal] as number) * scale;
    v(zones.middle)[i] = (results[base + TR.tcMiddleUnitMgal] as number) * scale;
    v(zones.outer)[i] = (results[base + TR.tcOuterUnitMgal] as number) * scale;
    v(coverage)[i] = results[base + TR.coverage] as number;
    if (Number.isFinite(tcUnit)) {
      computed++;
      kernelEvals += (results[base + TR.prisms] as number) + (results[base + TR.columns] as number) + (results[base + TR.geocentric] as number) + (results[base + TR.nearPoints] as number);
    }
  }
  return { c, extra, zones, coverage, computed, kernelEvals };
}
