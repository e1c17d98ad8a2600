/**
 * The QC digest printed at the end of a `talus reduce` run: how many stations carry each
 * flag, and the worst height misfits.
 */
import { QC_FLAGS } from './flag-codes.js';

export interface QcSummary {
  stations: number;
  /** Stations with at least one flag. */
  flaggedStations: number;
  /** Count per flag code: known codes in table order, then any others alphabetically. Zero counts are left out. */
  counts: { code: string; count: number }[];
  /** Largest |station - DEM| height misfits, worst first (finite values only), m. */
  worstMisfits: { id: string; misfitM: number }[];
}

/** `worst`: how many misfits to keep (default 5). */
export function qcSummary(flags: readonly (readonly string[])[], ids: readonly string[], misfitM: ArrayLike<number>, worst = 5): QcSummary {
  const counts = new Map<string, number>();
  let flagged = 0;
  for (const f of flags) {
    const unique = new Set(f.filter((c) => c !== ''));
    if (unique.size > 0) flagged++;
    for (const c of unique) counts.set(c, (counts.get(c) ?? 0) + 1);
  }
  const known = QC_FLAGS.map((f) => f.code);
  const codes = [...known.filter((c) => counts.has(c)), ...[...counts.keys()].filter((c) => !known.includes(c)).sort()];
  const misfits: { id: string; misfitM: number }[] = [];
  for (let i = 0; i < ids.length; i++) {
    const m = misfitM[i] as number;
    if (Number.isFinite(m)) misfits.push({ id: ids[i] as string, misfitM: m });
  }
  misfits.sort((a, b) => Math.abs(b.misfitM) - Math.abs(a.misfitM) || (a.id < b.id ? -1 : a.id > b.id ? 1 : 0));
  return {
    stations: flags.length,
    flaggedStations: flagged,
    counts: codes.map((code) => ({ code, count: counts.get(code) as number })),
    worstMisfits: misfits.slice(0, Math.max(0, worst)),
  };
}

/** A few lines of plain text for the end of a run. */
export function formatQcSummary(s: QcSummary): string {
  const lines = [`QC: ${s.stations} stations, ${s.flaggedStations === 0 ? 'none flagged' : `${s.flaggedStations} flagged`}`];
  const width = Math.max(0, ...s.counts.map((c) => c.code.length));
  for (const { code, count } of s.counts) {
    const meaning = QC_FLAGS.find((f) => f.code === code)?.meaning ?? '';
    lines.push(`  ${code.padEnd(width)}  ${String(count).padStart(6)}  ${meaning}`.trimEnd());
  }
  if (s.worstMisfits.length > 0) {
    const sign = (v: number): string => (v >= 0 ? '+' : '') + v.toFixed(1);
    lines.push(`  worst height misfits (station - DEM): ${s.worstMisfits.map((m) => `${m.id} ${sign(m.misfitM)} m`).join(', ')}`);
  }
  return lines.join('\n');
}
