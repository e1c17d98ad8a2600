/**
 * Field delimiters of station files and how a line is split into cells.
 *
 * Detection rule (header line only): count tabs, semicolons and commas outside double quotes;
 * the most frequent wins, ties going to tab, then semicolon, then comma. A header with none of
 * the three but with spaces is whitespace-delimited (any run of spaces/tabs separates fields,
 * leading and trailing blanks ignored). A header with no separator at all is one comma column.
 */
import { InputError, type InputErrorContext } from '../errors.js';

export type Delimiter = ',' | ';' | '\t' | 'whitespace';

export function detectDelimiter(headerLine: string): Delimiter {
  let tabs = 0;
  let semis = 0;
  let commas = 0;
  let inQuotes = false;
  for (let i = 0; i < headerLine.length; i++) {
    const ch = headerLine.charCodeAt(i);
    if (ch === 34 /* " */) inQuotes = !inQuotes;
    else if (inQuotes) continue;
    else if (ch === 9) tabs++;
    else if (ch === 59) semis++;
    else if (ch === 44) commas++;
  }
  if (tabs > 0 && tabs >= semis && tabs >= commas) return '\t';
  if (semis > 0 && semis >= commas) return ';';
  if (commas > 0) return ',';
  return /\S\s+\S/.test(headerLine.trim()) ? 'whitespace' : ',';
}

export function delimiterName(d: Delimiter): string {
  return d === '\t' ? 'tab' : d === 'whitespace' ? 'whitespace' : `'${d}'`;
}

const WHITESPACE_RUN = /[ \t]+/;

/**
 * Splits one line into cells. Lines without a double quote take the fast path (String.split).
 * Quoted fields follow RFC 4180 within the line: "a,b" is one cell, "" inside quotes is a
 * quote. A field cannot span lines. Cells keep their inner spaces; whitespace around a
 * delimited cell is kept too (numbers are trimmed when parsed, ids are trimmed by the reader).
 */
export function splitLine(line: string, delimiter: Delimiter, ctx: InputErrorContext): string[] {
  if (delimiter === 'whitespace') {
    if (line.indexOf('"') < 0) return line.trim().split(WHITESPACE_RUN);
    return splitQuoted(line.trim(), null, ctx);
  }
  if (line.indexOf('"') < 0) return line.split(delimiter);
  return splitQuotedDelimited(line, delimiter, ctx);
}

/** Quote-aware split on a single-character delimiter, scanning with indexOf. */
function splitQuotedDelimited(line: string, delimiter: string, ctx: InputErrorContext): string[] {
  const cells: string[] = [];
  const n = line.length;
  let i = 0;
  for (;;) {
    let j = i;
    while (j < n && (line.charCodeAt(j) === 32 || line.charCodeAt(j) === 9) && line[j] !== delimiter) j++;
    if (j < n && line.charCodeAt(j) === 34) {
      let cell = '';
      let from = j + 1;
      for (;;) {
        const q = line.indexOf('"', from);
        if (q < 0) throw new InputError(`unterminated quoted field: ${line}; expected a closing '"'`, ctx);
        cell += line.slice(from, q);
        if (line.charCodeAt(q + 1) === 34) {
          cell += '"';
          from = q + 2;
          continue;
        }
        j = q + 1;
        break;
      }
      while (j < n && (line.charCodeAt(j) === 32 || line.charCodeAt(j) === 9) && line[j] !== delimiter) j++;
      if (j < n && line[j] !== delimiter) {
        throw new InputError(`text after a closing quote in: ${line}; expected a delimiter`, ctx);
      }
      cells.push(cell);
    } else {
      const d = line.indexOf(delimiter, i);
      j = d < 0 ? n : d;
      cells.push(line.slice(i, j));
    }
    if (j >= n) return cells;
    i = j + 1;
    if (i === n) {
      cells.push('');
      return cells;
    }
  }
}

/** Quote-aware split; `delimiter` null means runs of spaces/tabs. */
function splitQuoted(line: string, delimiter: string | null, ctx: InputErrorContext): string[] {
  const cells: string[] = [];
  let cell = '';
  let i = 0;
  const n = line.length;
  const isSep = (c: string): boolean => (delimiter === null ? c === ' ' || c === '\t' : c === delimiter);
  while (i <= n) {
    // start of a field: skip blanks before an opening quote
    let j = i;
    while (j < n && (line[j] === ' ' || line[j] === '\t') && !isSep(line[j] as string)) j++;
    if (j < n && line[j] === '"') {
      j++;
      cell = '';
      for (;;) {
        if (j >= n) throw new InputError(`unterminated quoted field: ${line}; expected a closing '"'`, ctx);
        const c = line[j] as string;
        if (c === '"') {
          if (line[j + 1] === '"') {
            cell += '"';
            j += 2;
            continue;
          }
          j++;
          break;
        }
        cell += c;
        j++;
      }
      while (j < n && (line[j] === ' ' || line[j] === '\t') && !isSep(line[j] as string)) j++;
      if (j < n && !isSep(line[j] as string)) {
        throw new InputError(`text after a closing quote in: ${line}; expected a delimiter`, ctx);
      }
    } else {
      const start = i;
      while (j < n && !isSep(line[j] as string)) j++;
      cell = line.slice(start, j);
    }
    cells.push(cell);
    if (j >= n) break;
    // consume the separator (a whole run for whitespace)
    j++;
    if (delimiter === null) while (j < n && isSep(line[j] as string)) j++;
    i = j;
    if (i === n && delimiter !== null) {
      cells.push('');
      break;
    }
  }
  return cells;
}
