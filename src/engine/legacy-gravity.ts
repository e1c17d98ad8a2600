/**
 * Observed gravity of a run as stored in the station file (datum, units, removed constant,
 * per-row datum offsets) brought to IGSN71 mGal, the value the reduction uses; the value in
 * the stored datum (mGal) is kept for reproducing a legacy reduction.
 */
import {
  describeGravityConversions,
  storedGravityToIgsn71Mgal,
  storedGravityToMgal,
} from '../legacy/gravity-datum.js';
import type { GravityConversionStep, GravityConvention } from '../legacy/gravity-datum.js';
import type { OutputColumn } from '../io/results-csv.js';

export interface RunGravity {
  /** IGSN71 mGal: what the reduction uses. */
  igsn71Mgal: Float64Array;
  /** mGal in the stored datum (no datum shift): what a legacy reduction used. */
  storedDatumMgal: Float64Array;
  /** Every conversion applied, in order (empty when the file was IGSN71 mGal already). */
  conversions: GravityConversionStep[];
  /** gobs_igsn71_mgal when any conversion was applied. */
  columns: OutputColumn[];
}

/**
 * @param storedGobs gravity cells as read from the file (NaN = empty)
 * @param perRowOffsetMgal per-row datum offsets, mGal (NaN = use the datum's), or null
 * @param offsetColumn name of the per-row offset column, when there is one
 */
export function runGravity(
  storedGobs: Float64Array,
  convention: GravityConvention,
  perRowOffsetMgal: Float64Array | null,
  offsetColumn?: string,
): RunGravity {
  const n = storedGobs.length;
  const igsn71Mgal = new Float64Array(n);
  const storedDatumMgal = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    const stored = storedGobs[i] as number;
    storedDatumMgal[i] = storedGravityToMgal(stored, convention);
    igsn71Mgal[i] = storedGravityToIgsn71Mgal(stored, convention, perRowOffsetMgal ? (perRowOffsetMgal[i] as number) : undefined);
  }
  const conversions = describeGravityConversions(convention, perRowOffsetMgal ? offsetColumn : undefined);
  const columns: OutputColumn[] = conversions.length > 0 ? [{ name: 'gobs_igsn71_mgal', decimals: 4, values: igsn71Mgal }] : [];
  return { igsn71Mgal, storedDatumMgal, conversions, columns };
}
