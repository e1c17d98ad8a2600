/**
 * The distance range a legacy terrain correction covered (e.g. hand-chart zones from the
 * station's own inner zone out to some kilometres), so the engine can compute the new TC over
 * the same range for a like-for-like comparison. Radii are horizontal distances from the
 * station, metres; the range is the annulus innerRadiusM <= d < outerRadiusM.
 */
import { InputError } from '../errors.js';

export interface LegacyTcRange {
  /** Inner radius, m (>= 0; 0 = from the station). */
  innerRadiusM: number;
  /** Outer radius, m (> innerRadiusM). */
  outerRadiusM: number;
}

function parseRadius(part: string, which: string, text: string, field: string): number {
  const s = part.trim();
  const v = s === '' ? NaN : Number(s);
  if (!Number.isFinite(v)) throw new InputError(`${which} radius "${s}" in "${text}" is not a number of metres`, { field });
  if (!(v >= 0)) throw new InputError(`${which} radius ${v} m in "${text}" is negative`, { field });
  return v;
}

/** Parses `R1:R2` (metres, e.g. `0:21944` or `53.3:21944`). */
export function parseLegacyTcRange(text: string, field = '--legacy-tc-range'): LegacyTcRange {
  const parts = text.split(':');
  if (parts.length !== 2)
    throw new InputError(`"${text}" is not a range: expected R1:R2 in metres, e.g. 0:21944`, { field });
  const innerRadiusM = parseRadius(parts[0] ?? '', 'inner', text, field);
  const outerRadiusM = parseRadius(parts[1] ?? '', 'outer', text, field);
  if (!(outerRadiusM > innerRadiusM))
    throw new InputError(`outer radius ${outerRadiusM} m must be greater than inner radius ${innerRadiusM} m in "${text}"`, {
      field,
    });
  return { innerRadiusM, outerRadiusM };
}

/** Whether horizontal distance `distanceM` (m) lies in the range (inner inclusive, outer exclusive). */
export function inLegacyTcRange(range: LegacyTcRange, distanceM: number): boolean {
  return distanceM >= range.innerRadiusM && distanceM < range.outerRadiusM;
}

/** Text for provenance and reports, e.g. "0-21944 m". */
export function describeLegacyTcRange(range: LegacyTcRange): string {
  return `${range.innerRadiusM}-${range.outerRadiusM} m`;
}
