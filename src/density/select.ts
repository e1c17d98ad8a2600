/**
 * Station subsets for a density estimate (density varies over an area): `--where` on any
 * column of the results table, `--box` and `--polygon` on the station coordinates (in the
 * file's own units: metres for x/y, degrees for lon/lat).
 */
import { existsSync, readFileSync } from 'node:fs';
import { InputError } from '../errors.js';
import type { CsvTable } from '../io/read-results.js';
import type { DensityInput } from './input.js';
import { subsetDensityInput } from './input.js';

export type WhereOp = '=' | '!=' | '<' | '<=' | '>' | '>=';
export interface WhereClause {
  column: string;
  op: WhereOp;
  value: string;
}
export interface Box {
  minX: number;
  minY: number;
  maxX: number;
  maxY: number;
}
export interface Selection {
  where?: WhereClause[];
  box?: Box;
  /** Polygon vertices [x, y] (closed implicitly). */
  polygon?: [number, number][];
}

/** "COLUMN=VALUE", "COLUMN!=VALUE", "COLUMN>VALUE", "COLUMN<=VALUE" ... */
export function parseWhere(expr: string): WhereClause {
  const m = /^\s*([^<>=!]+?)\s*(!=|<=|>=|=|<|>)\s*(.*?)\s*$/.exec(expr);
  if (!m) throw new InputError(`bad condition "${expr}": expected COLUMN=VALUE, COLUMN!=VALUE or COLUMN>VALUE (<, <=, >=)`, { field: '--where' });
  const op = m[2] as WhereOp;
  const value = m[3] as string;
  if (op !== '=' && op !== '!=' && !Number.isFinite(Number(value)) ) {
    throw new InputError(`bad condition "${expr}": the value "${value}" must be a number for ${op}`, { field: '--where' });
  }
  return { column: m[1] as string, op, value };
}

function parseNumbers(s: string, option: string, what: string): number[] {
  const parts = s.trim().split(/[\s,]+/);
  const nums = parts.map(Number);
  if (parts.length === 0 || nums.some((v) => !Number.isFinite(v))) throw new InputError(`bad value "${s}": expected ${what}`, { field: option });
  return nums;
}

/** "minx,miny,maxx,maxy". */
export function parseBox(s: string): Box {
  const v = parseNumbers(s, '--box', 'four numbers minx,miny,maxx,maxy');
  const [minX, minY, maxX, maxY] = v as [number, number, number, number];
  if (v.length !== 4 || !(minX < maxX) || !(minY < maxY)) {
    throw new InputError(`bad value "${s}": expected four numbers minx,miny,maxx,maxy with minx < maxx and miny < maxy`, { field: '--box' });
  }
  return { minX, minY, maxX, maxY };
}

/**
 * A polygon from a file or an inline list "x1 y1, x2 y2, ...": vertices separated by commas
 * or new lines, coordinates by spaces. At least three vertices.
 */
export function parsePolygon(spec: string): [number, number][] {
  const fromFile = existsSync(spec);
  const text = fromFile ? readFileSync(spec, 'utf8') : spec;
  const vertices: [number, number][] = [];
  for (const raw of text.split(/[,\n]/)) {
    const t = raw.trim();
    if (t === '' || t.startsWith('#')) continue;
    const v = t.split(/\s+/).map(Number);
    if (v.length !== 2 || !v.every(Number.isFinite)) {
      throw new InputError(`bad vertex "${t}"${fromFile ? ` in ${spec}` : ''}: expected two numbers "x y"`, { field: '--polygon' });
    }
    vertices.push([v[0] as number, v[1] as number]);
  }
  if (vertices.length < 3) throw new InputError(`a polygon needs at least 3 vertices, got ${vertices.length}`, { field: '--polygon' });
  return vertices;
}

/** Even-odd ray-casting point-in-polygon test (common practice); points on an edge may fall either way. */
export function pointInPolygon(x: number, y: number, poly: readonly (readonly [number, number])[]): boolean {
  let inside = false;
  for (let i = 0, j = poly.length - 1; i < poly.length; j = i++) {
    const [xi, yi] = poly[i] as readonly [number, number];
    const [xj, yj] = poly[j] as readonly [number, number];
    if (yi > y !== yj > y && x < ((xj - xi) * (y - yi)) / (yj - yi) + xi) inside = !inside;
  }
  return inside;
}

function whereMatches(cell: string, c: WhereClause): boolean {
  const a = Number(cell);
  const b = Number(c.value);
  const numeric = cell !== '' && Number.isFinite(a) && Number.isFinite(b);
  switch (c.op) {
    case '=':
      return numeric ? a === b : cell === c.value;
    case '!=':
      return numeric ? a !== b : cell !== c.value;
    case '<':
      return numeric && a < b;
    case '<=':
      return numeric && a <= b;
    case '>':
      return numeric && a > b;
    case '>=':
      return numeric && a >= b;
  }
}

/** The stations meeting every criterion (all must hold). A --where column must exist. */
export function selectStations(input: DensityInput, table: CsvTable, sel: Selection): DensityInput {
  const where = (sel.where ?? []).map((c) => {
    const col = table.header.indexOf(c.column);
    if (col < 0) throw new InputError(`--where names column "${c.column}", which is not in the file; columns present: ${table.header.join(', ')}`, { file: table.file, line: 1, field: c.column });
    return { c, col };
  });
  const keep = new Array<boolean>(input.ids.length);
  for (let i = 0; i < input.ids.length; i++) {
    const x = input.x[i] as number;
    const y = input.y[i] as number;
    const row = table.rows[input.rowIndex[i] as number] as string[];
    let ok = where.every(({ c, col }) => whereMatches(row[col] ?? '', c));
    if (ok && sel.box) ok = x >= sel.box.minX && x <= sel.box.maxX && y >= sel.box.minY && y <= sel.box.maxY;
    if (ok && sel.polygon) ok = pointInPolygon(x, y, sel.polygon);
    keep[i] = ok;
  }
  return subsetDensityInput(input, keep);
}
