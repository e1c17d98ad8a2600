/**
 * Reading a results CSV (or any header-first CSV) into a plain table of strings, with the
 * 1-based file line of every row kept for messages. Generic on purpose: column meaning is the
 * caller's business (src/density/input.ts maps the results columns).
 */
import { readFileSync } from 'node:fs';
import { parse } from 'csv-parse/sync';
import { InputError } from '../errors.js';

export interface CsvTable {
  /** File the table came from (as given on the command line). */
  file: string;
  /** Header cells, trimmed. */
  header: string[];
  /** Data rows, cells exactly as read (trimmed). */
  rows: string[][];
  /** 1-based line number of each data row in the file. */
  lines: number[];
}

/** Parses CSV text whose first record is the header. Throws InputError on malformed CSV. */
export function parseCsvTable(text: string, file: string): CsvTable {
  let records: { record: string[]; info: { lines: number } }[];
  try {
    records = parse(text, { bom: true, trim: true, skip_empty_lines: true, info: true, relax_column_count: false }) as unknown as {
      record: string[];
      info: { lines: number };
    }[];
  } catch (e) {
    const err = e as { message?: string; lines?: number };
    throw new InputError(`not a readable CSV table (${err.message ?? String(e)})`, {
      file,
      ...(typeof err.lines === 'number' ? { line: err.lines } : {}),
    });
  }
  const first = records[0];
  if (first === undefined) throw new InputError('the file is empty: expected a header line and data rows', { file });
  const header = first.record;
  const seen = new Set<string>();
  for (const h of header) {
    if (seen.has(h)) throw new InputError(`column "${h}" appears twice in the header: expected unique column names`, { file, line: first.info.lines });
    seen.add(h);
  }
  return {
    file,
    header,
    rows: records.slice(1).map((r) => r.record),
    lines: records.slice(1).map((r) => r.info.lines),
  };
}

/** Reads and parses a CSV file. A missing or unreadable file is an InputError. */
export function readCsvTable(file: string): CsvTable {
  let text: string;
  try {
    text = readFileSync(file, 'utf8');
  } catch (e) {
    throw new InputError(`cannot read the file (${(e as NodeJS.ErrnoException).code ?? String(e)}): expected a readable CSV file`, { file });
  }
  return parseCsvTable(text, file);
}
