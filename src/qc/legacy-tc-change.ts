/**
 * legacy_tc_change: the new terrain correction differs from the legacy one carried in the
 * station file by more than a limit (old hand-zone or coarse-DEM corrections are often off
 * by more than a milligal in rugged ground; common practice to review such stations).
 */

/** True where both values are finite and |new - legacy| > limitMgal. A missing legacy value never flags. */
export function legacyTcChangeFlags(newTcMgal: ArrayLike<number>, legacyTcMgal: ArrayLike<number>, limitMgal: number): boolean[] {
  if (!(limitMgal >= 0)) throw new RangeError(`legacyTcChangeFlags: limitMgal must be >= 0, got ${limitMgal}`);
  return Array.from({ length: newTcMgal.length }, (_, i) => Math.abs((newTcMgal[i] as number) - (legacyTcMgal[i] as number)) > limitMgal);
}
