/**
 * The legacy input columns of `talus reduce` that the station reader does not know: the
 * per-row datum offset, the printed legacy anomalies and the height the old reduction used. They are found by their canonical
 * name (case-insensitive) or by a `--columns` entry (canonical=file column), and are read
 * from the passthrough cells of the station table, with file, line, station and column in
 * every message.
 */
import { InputError } from '../errors.js';
import { parseDatumOffsetCell } from '../legacy/gravity-datum.js';
import type { StationTable } from '../stations/table.js';
import { metresPer, type LengthUnit } from '../units.js';

/** Canonical names of the legacy columns. */
export const LEGACY_COLUMN_KEYS = ['datum_offset_mgal', 'legacy_fa_mgal', 'legacy_cba_mgal', 'legacy_height_m'] as const;
export type LegacyColumnKey = (typeof LEGACY_COLUMN_KEYS)[number];

function isLegacyKey(s: string): s is LegacyColumnKey {
  return (LEGACY_COLUMN_KEYS as readonly string[]).includes(s);
}

/**
 * Splits a `--columns` value into the part the station reader parses and the legacy
 * entries (canonical=file column), so that both share one option.
 */
export function splitLegacyColumns(spec: string): { readerSpec: string; legacy: Partial<Record<LegacyColumnKey, string>> } {
  const keep: string[] = [];
  const legacy: Partial<Record<LegacyColumnKey, string>> = {};
  for (const part of spec.split(',')) {
    const eq = part.indexOf('=');
    const key = eq < 0 ? '' : part.slice(0, eq).trim().toLowerCase();
    if (!isLegacyKey(key)) {
      keep.push(part);
      continue;
    }
    const col = part.slice(eq + 1).trim();
    if (col === '') throw new InputError(`empty file column for '${key}' in --columns; expected ${key}=COLUMN`, { field: '--columns' });
    if (legacy[key] !== undefined)
      throw new InputError(`'${key}' is mapped twice in --columns (to '${legacy[key]}' and '${col}')`, { field: '--columns' });
    legacy[key] = col;
  }
  return { readerSpec: keep.join(','), legacy };
}

/** Index of a legacy column in the header: mapped name (exact, then case-insensitive) or canonical name; -1 when absent. */
export function findLegacyColumn(table: StationTable, key: LegacyColumnKey, mapping: Partial<Record<LegacyColumnKey, string>>): number {
  const lower = table.header.map((h) => h.toLowerCase());
  const mapped = mapping[key];
  if (mapped !== undefined) {
    let at = table.header.indexOf(mapped);
    if (at < 0) at = lower.indexOf(mapped.toLowerCase());
    if (at < 0)
      throw new InputError(
        `--columns maps ${key} to '${mapped}', which is not in the header; columns found: ${table.header.map((h) => `'${h}'`).join(', ')}`,
        { file: table.source },
      );
    return at;
  }
  return lower.indexOf(key);
}

/**
 * Values of a legacy mGal column for every station (NaN for empty cells, bad rows and an
 * absent column). A cell that is not a number is an InputError naming file, line, station,
 * column and value.
 */
export function readLegacyColumn(table: StationTable, index: number, what: string): Float64Array {
  const n = table.ids.length;
  const out = new Float64Array(n).fill(NaN);
  if (index < 0) return out;
  const field = table.header[index] as string;
  for (let i = 0; i < n; i++) {
    if ((table.flags[i] ?? []).includes('bad_row')) continue;
    const text = (table.rows[i] ?? [])[index] ?? '';
    const ctx = { file: table.source, line: table.lines[i] as number, station: table.ids[i] as string, field };
    if (what === 'datum offset') {
      out[i] = parseDatumOffsetCell(text, ctx);
      continue;
    }
    if (text.trim() === '') continue;
    const v = Number(text);
    if (!Number.isFinite(v)) throw new InputError(`"${text}" is not ${what}`, ctx);
    out[i] = v;
  }
  return out;
}

/**
 * The heights the legacy reduction used: the `legacy_height_m` column (in the same
 * --height-units as height_m) where it has a value, else the station height. With it, the
 * change explanation's delta_height_mgal shows the effect of a re-surveyed height.
 */
export function legacyHeightsM(table: StationTable, index: number, heightUnits: LengthUnit): Float64Array {
  const out = Float64Array.from(table.heightM);
  if (index < 0) return out;
  const values = readLegacyColumn(table, index, 'a height (same unit as height_m)');
  const k = metresPer(heightUnits);
  for (let i = 0; i < out.length; i++) {
    const v = values[i] as number;
    if (Number.isFinite(v)) out[i] = v * k;
  }
  return out;
}
