/**
 * The legacy columns of a run with --legacy-formulas: the old free-air and complete Bouguer
 * anomalies recomputed from the old inputs (gravity in its stored datum, the station height,
 * legacy_tc_mgal) and compared with the printed ones (legacy_mismatch), and the change from
 * the legacy CBA to the CBA talus wrote, split into the delta_*_mgal parts of
 * src/legacy/explain-change.ts.
 *
 * The "new" state is built from the run's own settings (normal formula, free-air order, cap or
 * slab with the run's cap radius, density, CODATA G, the atmospheric correction talus always
 * adds) and the terrain correction in complete_bouguer_mgal (field inner zone included), so
 * the new CBA of the explanation is complete_bouguer_mgal. With a like-for-like range TC the
 * terrain part is split in two: delta_terrain_mgal compares the range TC with the legacy TC,
 * delta_terrain_outside_range_mgal is the rest of the new TC; the parts still sum to the total.
 */
import { checkLegacyAnomalies, LEGACY_MISMATCH_FLAG } from '../legacy/legacy-reduction.js';
import { CHANGE_COLUMNS, changeRow, explainChange } from '../legacy/explain-change.js';
import type { FormulaSet } from '../legacy/formula-set.js';
import type { OutputColumn } from '../io/results-csv.js';

export { LEGACY_MISMATCH_FLAG };

/** Per-station inputs, all indexed by station. */
export interface LegacyComparisonInputs {
  latDeg: Float64Array;
  /** Old gravity in its stored datum, mGal. */
  oldGobsMgal: Float64Array;
  /** Height the legacy reduction used, m. */
  oldHeightM: Float64Array;
  legacyTcMgal: Float64Array;
  printedFaMgal: Float64Array;
  printedCbaMgal: Float64Array;
  /** IGSN71 gravity used by the run, mGal. */
  newGobsMgal: Float64Array;
  /** Height used by the run's reduction, m. */
  newHeightM: Float64Array;
  /** TC added in complete_bouguer_mgal (inner zone included), mGal. */
  newTcMgal: Float64Array;
  /** TC over the legacy range at the run's density, mGal, or null. */
  rangeTcMgal: Float64Array | null;
  active: Uint8Array;
}

export interface LegacyComparison {
  columns: OutputColumn[];
  /** Stations whose printed anomalies are not reproduced. */
  mismatch: Uint8Array;
  /** CBA of the explanation's new state, mGal (to be checked against complete_bouguer_mgal). */
  newCbaMgal: Float64Array;
}

export const OUTSIDE_RANGE_COLUMN = 'delta_terrain_outside_range_mgal';

export function compareLegacy(
  inp: LegacyComparisonInputs,
  legacy: FormulaSet,
  current: FormulaSet,
  toleranceMgal: number,
): LegacyComparison {
  const n = inp.latDeg.length;
  const nan = (): Float64Array => new Float64Array(n).fill(NaN);
  const fa = nan();
  const cba = nan();
  const names: string[] = [...CHANGE_COLUMNS];
  if (inp.rangeTcMgal) names.splice(names.indexOf('delta_terrain_mgal') + 1, 0, OUTSIDE_RANGE_COLUMN);
  const parts = names.map(nan);
  const mismatch = new Uint8Array(n);
  const newCbaMgal = nan();
  for (let i = 0; i < n; i++) {
    if (inp.active[i] !== 1) continue;
    const lat = inp.latDeg[i] as number;
    const oldState = {
      ...legacy,
      gobsMgal: inp.oldGobsMgal[i] as number,
      heightM: inp.oldHeightM[i] as number,
      tcMgal: inp.legacyTcMgal[i] as number,
    };
    const printed = { faMgal: inp.printedFaMgal[i] as number, cbaMgal: inp.printedCbaMgal[i] as number };
    const check = checkLegacyAnomalies({ latDeg: lat, ...oldState }, legacy, printed, toleranceMgal);
    fa[i] = check.recomputedFaMgal;
    cba[i] = check.recomputedCbaMgal;
    mismatch[i] = check.mismatch ? 1 : 0;
    const newState = {
      ...current,
      gobsMgal: inp.newGobsMgal[i] as number,
      heightM: inp.newHeightM[i] as number,
      tcMgal: inp.newTcMgal[i] as number,
    };
    const change = explainChange(lat, oldState, newState, printed.cbaMgal);
    newCbaMgal[i] = change.newCbaMgal;
    const full = changeRow(change);
    if (inp.rangeTcMgal) {
      const like = explainChange(lat, oldState, { ...newState, tcMgal: inp.rangeTcMgal[i] as number }, printed.cbaMgal);
      const at = CHANGE_COLUMNS.indexOf('delta_terrain_mgal');
      const outside = (full[at] as number) - like.terrainMgal;
      full[at] = like.terrainMgal;
      full.splice(at + 1, 0, outside);
    }
    full.forEach((v, k) => ((parts[k] as Float64Array)[i] = v));
  }
  // 10 decimals: rounding leaves <= 5e-11 mGal per cell, so the printed parts still sum to the
  // printed total within 1e-9 mGal (checked on the CSV in test/engine/legacy-change.test.ts).
  const columns: OutputColumn[] = [
    { name: 'legacy_fa_recomputed_mgal', decimals: 4, values: fa },
    { name: 'legacy_cba_recomputed_mgal', decimals: 4, values: cba },
    ...names.map((name, k) => ({ name, decimals: 10, values: parts[k] as Float64Array })),
  ];
  return { columns, mismatch, newCbaMgal };
}
