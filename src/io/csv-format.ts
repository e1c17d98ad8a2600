/** CSV cell formatting for output files: NaN is an empty cell (never 0), fixed decimals. */

export function formatNumber(v: number, decimals: number): string {
  if (!Number.isFinite(v)) return '';
  const s = v.toFixed(decimals);
  // "-0.0000" reads as a sign error in a table
  return /^-0\.?0*$/.test(s) ? s.slice(1) : s;
}

/** Quotes a cell when it holds the delimiter, a quote or a line break. */
export function quoteCell(s: string, delimiter: string): string {
  if (s.includes(delimiter) || s.includes('"') || s.includes('\n') || s.includes('\r')) return `"${s.replace(/"/g, '""')}"`;
  return s;
}
