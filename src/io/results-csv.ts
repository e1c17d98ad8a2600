/**
 * The results CSV (docs/results-columns.md): every input column as read, then talus's
 * columns. Empty cell = not available (never 0).
 */
import { formatNumber, quoteCell } from './csv-format.js';

export interface OutputColumn {
  name: string;
  decimals: number;
  values: ArrayLike<number>;
}

export function resultsCsv(
  inputHeader: readonly string[],
  inputRows: readonly (readonly string[])[],
  columns: readonly OutputColumn[],
  flags: readonly (readonly string[])[],
): string {
  const d = ',';
  const out: string[] = [];
  out.push([...inputHeader.map((h) => quoteCell(h, d)), ...columns.map((c) => c.name), 'flags'].join(d));
  for (let i = 0; i < inputRows.length; i++) {
    const cells: string[] = [];
    const row = inputRows[i] as readonly string[];
    for (let j = 0; j < inputHeader.length; j++) cells.push(quoteCell(row[j] ?? '', d));
    for (const c of columns) cells.push(formatNumber(c.values[i] as number, c.decimals));
    cells.push(quoteCell((flags[i] ?? []).join(';'), d));
    out.push(cells.join(d));
  }
  return out.join('\n') + '\n';
}
