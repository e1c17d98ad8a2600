/**
 * The legacy part of a run's output, gathered after the reduction: the like-for-like range TC
 * column, the legacy comparison columns and flags, the check that the explanation's new CBA is
 * the CBA written, and the provenance record of it all.
 */
import type { OutputColumn } from '../io/results-csv.js';
import type { FormulaSet } from '../legacy/formula-set.js';
import { describeLegacyTcRange } from '../legacy/legacy-tc-range.js';
import type { ReduceOptions } from './run-options.js';
import { compareLegacy, LEGACY_MISMATCH_FLAG } from './legacy-comparison.js';
import type { LegacyComparisonInputs } from './legacy-comparison.js';
import type { ZonePlan } from '../terrain/zone-plan.js';

/** Largest |explanation new CBA - complete_bouguer_mgal| accepted, mGal: both are the same sums of the same float64 terms, so only rounding (~1e-10) may separate them. */
export const NEW_CBA_AGREEMENT_MGAL = 1e-6;

export interface LegacyOutputs {
  columns: OutputColumn[];
  /** Flag code per station to add (empty strings for none). */
  flags: string[][];
  summaryLines: string[];
  record: Record<string, unknown>;
}

/** The run's own reduction as a formula set (talus always adds the atmospheric correction; G is CODATA 2018). */
export function currentFormulaSet(o: ReduceOptions): FormulaSet {
  return {
    normal: o.normalFormula,
    freeAir: o.freeAirOrder === 1 ? 'first-order' : 'second-order',
    bouguer: o.bouguer,
    densityKgM3: o.densityKgM3,
    atmospheric: true,
    capRadiusM: o.capRadiusM,
  };
}

export function legacyOutputs(
  o: ReduceOptions,
  inputs: LegacyComparisonInputs,
  cbaMgal: Float64Array,
  rangePlan: ZonePlan | null,
): LegacyOutputs {
  const n = cbaMgal.length;
  const flags: string[][] = Array.from({ length: n }, () => []);
  const columns: OutputColumn[] = [];
  const record: Record<string, unknown> = {};
  const summaryLines: string[] = [];
  if (inputs.rangeTcMgal && o.legacyTcRange) {
    columns.push({ name: 'terrain_corr_range_mgal', decimals: 4, values: inputs.rangeTcMgal });
    record['tcRange'] = {
      range: describeLegacyTcRange(o.legacyTcRange),
      column: 'terrain_corr_range_mgal',
      note: 'new TC over the legacy range at the main density (no field inner zone); used in delta_terrain_mgal, the rest of the new TC in delta_terrain_outside_range_mgal',
      zonePlan: rangePlan ? { ...rangePlan } : null,
    };
  }
  if (!o.legacyFormulas) return { columns, flags, summaryLines, record };
  const cmp = compareLegacy(inputs, o.legacyFormulas, currentFormulaSet(o), o.legacyToleranceMgal);
  columns.push(...cmp.columns);
  let worst = 0;
  let mismatches = 0;
  for (let i = 0; i < n; i++) {
    if (cmp.mismatch[i] === 1) {
      (flags[i] as string[]).push(LEGACY_MISMATCH_FLAG);
      mismatches++;
    }
    const a = cmp.newCbaMgal[i] as number;
    const b = cbaMgal[i] as number;
    if (Number.isFinite(a) || Number.isFinite(b)) worst = Math.max(worst, Math.abs(a - b));
  }
  // NaN on one side only, or any larger difference, means the explanation is not of this run.
  if (!(worst <= NEW_CBA_AGREEMENT_MGAL))
    throw new Error(`the change explanation's new CBA differs from complete_bouguer_mgal by ${worst} mGal`);
  if (mismatches > 0)
    summaryLines.push(`${LEGACY_MISMATCH_FLAG}: ${mismatches} stations whose printed legacy anomalies are not reproduced within ${o.legacyToleranceMgal} mGal`);
  record['formulas'] = o.legacyFormulas;
  record['current'] = currentFormulaSet(o);
  record['toleranceMgal'] = o.legacyToleranceMgal;
  record['mismatches'] = mismatches;
  record['maxAbsNewCbaMinusCompleteBouguerMgal'] = worst;
  record['legacyInputs'] =
    'old gravity in its stored datum (mGal), the station height as read (m), legacy_tc_mgal at the legacy density';
  record['changeOrder'] = 'datum, normal, free-air, bouguer, terrain, density, height, then the legacy residual (src/legacy/explain-change.ts)';
  return { columns, flags, summaryLines, record };
}
