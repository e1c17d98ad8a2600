import { describe, expect, it } from 'vitest';
import { parseCsvTable } from '../../src/io/read-results.js';
import { densityInputFromTable, localMetres, parseColumnMapping } from '../../src/density/input.js';
import { parseBox, parsePolygon, parseWhere, pointInPolygon, selectStations } from '../../src/density/select.js';
import { parasnisVariables } from '../../src/density/parasnis.js';
import { assertClose } from '../helpers/assert-close.js';

const CSV = [
  'id,lon,lat,height_m,free_air_anomaly_mgal,bouguer_unit_mgal,terrain_corr_unit_mgal,inner_tc_mgal,zone',
  'A,7.00,45.00,100,10,4.2,0.5,0.1,n',
  'B,7.01,45.00,200,20,8.4,0.7,,n',
  'C,7.02,45.01,300,30,,0.9,0.2,s', // empty Bouguer cell: not available, skipped
  'D,7.03,45.02,400,40,16.8,1.1,0.3,s',
].join('\n');

describe('density input from a results table', () => {
  const table = parseCsvTable(CSV, 'r.csv');
  const input = densityInputFromTable(table);

  it('reads lon/lat as geographic, skips rows with an empty required cell and keeps their lines', () => {
    expect(input.coords).toBe('geographic');
    expect(input.ids).toEqual(['A', 'B', 'D']);
    expect(input.lines).toEqual([2, 3, 5]);
    expect(input.skippedRows).toBe(1);
  });

  it('Parasnis variables: x = BC_unit - TC_unit, y = FAA + inner TC (an empty inner TC counts as 0)', () => {
    const v = parasnisVariables(input);
    expect(Array.from(v.x)).toEqual([4.2 - 0.5, 8.4 - 0.7, 16.8 - 1.1]);
    expect(Array.from(v.y)).toEqual([10 + 0.1, 20, 40 + 0.3]);
  });

  it('local metres: 0.01 deg of longitude near 45 deg is 786.2 m on the 6371 km sphere', () => {
    const { xM, yM } = localMetres(input);
    // by hand: 6371000 * pi/180 * 0.01 * cos(45.0067 deg, the mean latitude) = 786.19 m; 0.1 m covers the rounding
    assertClose((xM[1] as number) - (xM[0] as number), 786.19, { abs: 0.1 }, 'dx');
    // 0.02 deg of latitude: 6371000 * pi/180 * 0.02 = 2223.9 m
    assertClose((yM[2] as number) - (yM[0] as number), 2223.9, { abs: 0.1 }, 'dy');
  });

  it('--where on any column (string and numeric), --box, --polygon', () => {
    expect(selectStations(input, table, { where: [parseWhere('zone=n')] }).ids).toEqual(['A', 'B']);
    expect(selectStations(input, table, { where: [parseWhere('height_m>=200'), parseWhere('zone!=n')] }).ids).toEqual(['D']);
    expect(selectStations(input, table, { box: parseBox('6.995,44.99,7.015,45.005') }).ids).toEqual(['A', 'B']);
    expect(selectStations(input, table, { polygon: parsePolygon('7.005 44.9, 7.05 44.9, 7.05 45.1, 7.005 45.1') }).ids).toEqual(['B', 'D']);
  });

  it('point in polygon (even-odd rule) on a concave L shape', () => {
    const l: [number, number][] = [[0, 0], [2, 0], [2, 1], [1, 1], [1, 2], [0, 2]];
    expect(pointInPolygon(0.5, 0.5, l)).toBe(true);
    expect(pointInPolygon(1.5, 1.5, l)).toBe(false); // the notch
    expect(pointInPolygon(0.5, 1.5, l)).toBe(true);
    expect(pointInPolygon(3, 0.5, l)).toBe(false);
  });

  it('malformed selections and mappings are input errors that say what was expected', () => {
    expect(() => parseWhere('height_m')).toThrow(/expected COLUMN=VALUE/);
    expect(() => parseWhere('height_m>abc')).toThrow(/must be a number/);
    expect(() => parseBox('3,0,1,1')).toThrow(/minx < maxx/);
    expect(() => parsePolygon('0 0, 1 1')).toThrow(/at least 3 vertices/);
    expect(() => parseColumnMapping('elevation=h')).toThrow(/unknown column "elevation"/);
    expect(parseColumnMapping('height_m=elev, id=STN')).toEqual({ height_m: 'elev', id: 'STN' });
  });
});
