import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { parseStations, readStations } from '../../src/stations/read-csv.js';
import { parseColumnMapping } from '../../src/stations/columns.js';
import { detectDelimiter } from '../../src/stations/delimiter.js';
import { InputError } from '../../src/errors.js';
import { assertClose } from '../helpers/assert-close.js';

// Invented stations (no survey data): ids, positions and values are made up.
const BASIC = 'id,lon,lat,height_m,gobs_mgal\nA1,15.30,47.20,512.5,980712.31\nA2,15.31,47.21,498.0,980713.02\n';

function errorOf(f: () => unknown): InputError {
  try {
    f();
  } catch (e) {
    if (e instanceof InputError) return e;
    throw e;
  }
  throw new Error('expected an InputError');
}

describe('delimiters, BOM, comments, blank lines', () => {
  const variants: [string, string][] = [
    ['comma', BASIC],
    ['semicolon', BASIC.replaceAll(',', ';')],
    ['tab', BASIC.replaceAll(',', '\t')],
    ['whitespace', BASIC.replaceAll(',', '   ')],
  ];
  for (const [name, text] of variants) {
    it(`${name}-delimited file reads the same two stations`, () => {
      const t = parseStations(text, 'st.csv');
      expect(t.ids).toEqual(['A1', 'A2']);
      expect(Array.from(t.heightM)).toEqual([512.5, 498]);
      expect(Array.from(t.gobsMgal)).toEqual([980712.31, 980713.02]);
      expect(t.lines).toEqual([2, 3]);
    });
  }

  it('detection rule: most frequent of tab/semicolon/comma outside quotes, else whitespace', () => {
    expect(detectDelimiter('id;"a,b,c";lat')).toBe(';');
    expect(detectDelimiter('id\tname, with comma\tlat')).toBe('\t');
    expect(detectDelimiter('id  lon lat')).toBe('whitespace');
    expect(detectDelimiter('id')).toBe(',');
  });

  it('UTF-8 BOM, CRLF line ends, # comments and blank lines are skipped; line numbers stay physical', async () => {
    const dir = mkdtempSync(join(tmpdir(), 'talus-st-'));
    const p = join(dir, 'bom.csv');
    writeFileSync(p, '\uFEFF# survey X (invented)\r\n\r\nid,lon,lat,height_m\r\n# a comment\r\nB1,10,50,100\r\n\r\nB2,10.1,50,101\r\n');
    const t = await readStations(p, {});
    expect(t.header).toEqual(['id', 'lon', 'lat', 'height_m']);
    expect(t.ids).toEqual(['B1', 'B2']);
    expect(t.lines).toEqual([5, 7]);
  });

  it('quoted fields keep delimiters and doubled quotes', () => {
    const t = parseStations('id,name,lon,lat,height_m\nC1,"hill, north ""top""",10,50,100\n', 'q.csv');
    expect(t.rows[0]).toEqual(['C1', 'hill, north "top"', '10', '50', '100']);
  });

  it('every input column and cell is kept for passthrough', () => {
    const t = parseStations('id,lon,lat,height_m,operator\nD1,10,50,100,kb\n', 'p.csv');
    expect(t.header).toEqual(['id', 'lon', 'lat', 'height_m', 'operator']);
    expect(t.rows).toEqual([['D1', '10', '50', '100', 'kb']]);
  });
});

describe('columns and units', () => {
  it('absent optional columns give NaN arrays; an empty gobs cell gives NaN for that station', () => {
    const t = parseStations('id,lon,lat,height_m,gobs_mgal\nE1,10,50,100,\nE2,10,50.1,100,980000.5\n', 'o.csv');
    expect(Number.isNaN(t.gobsMgal[0] as number)).toBe(true);
    expect(t.gobsMgal[1]).toBe(980000.5);
    expect(Array.from(t.innerTcMgal).every(Number.isNaN)).toBe(true);
    expect(Array.from(t.legacyTcMgal).every(Number.isNaN)).toBe(true);
  });

  it('--columns maps canonical names to file columns; canonical names match case-insensitively', () => {
    const m = parseColumnMapping('id=STN, lon=LONG,lat=LAT,height_m=ELEV,inner_tc_mgal=TCI');
    const t = parseStations('STN,LONG,LAT,ELEV,TCI,Legacy_TC_mGal\nF1,10,50,100,0.12,0.5\n', 'm.csv', { columns: m });
    expect(t.innerTcMgal[0]).toBe(0.12);
    expect(t.legacyTcMgal[0]).toBe(0.5);
  });

  it('parseColumnMapping: unknown canonical name, missing "=", mapping twice are InputErrors', () => {
    expect(errorOf(() => parseColumnMapping('elev=H')).message).toContain("unknown canonical column 'elev'");
    expect(errorOf(() => parseColumnMapping('id')).message).toContain('expected canonical=column');
    expect(errorOf(() => parseColumnMapping('id=A,id=B')).message).toContain("'id' is mapped twice");
  });

  it('a mapping to a column not in the file lists the columns found', () => {
    const e = errorOf(() => parseStations(BASIC, 'st.csv', { columns: { height_m: 'ELEV' } }));
    expect(e.message).toBe(
      "st.csv:1: column ELEV: --columns maps height_m to 'ELEV', which is not in the header; columns found: 'id', 'lon', 'lat', 'height_m', 'gobs_mgal'",
    );
  });

  it('feet and US survey feet heights use the exact factors 0.3048 and 1200/3937', () => {
    const ft = parseStations('id,lon,lat,height_m\nG1,10,50,1000\n', 'f.csv', { heightUnits: 'ft' });
    const us = parseStations('id,lon,lat,height_m\nG1,10,50,1000\n', 'f.csv', { heightUnits: 'usft' });
    // definitions: international foot 0.3048 m (1959), US survey foot 1200/3937 m; only the
    // one multiplication rounds, so half an ulp of the product bounds the error
    assertClose(ft.heightM[0] as number, 304.8, { rel: 1.2e-16 }, 'ft');
    assertClose(us.heightM[0] as number, 1_200_000 / 3937, { rel: 1.2e-16 }, 'usft');
  });

  it('projected station CRS: x/y in US feet are converted to lon/lat WGS84', () => {
    // reference point: cs2cs EPSG:4326 -> EPSG:2263 of (-73.6, 40.8), from cs2cs-points.json
    const t = parseStations('id,x,y,height_m\nH1,1094995.5792535634,230991.4172352667,30\n', 's.csv', { stationCrs: 'EPSG:2263' });
    // 1e-8 degrees is about 1 mm, the tolerance of the cs2cs fixture tests
    assertClose(t.lonDeg[0] as number, -73.6, { abs: 1e-8 }, 'lon');
    assertClose(t.latDeg[0] as number, 40.8, { abs: 1e-8 }, 'lat');
    expect(t.crsLabel).toBe('EPSG:2263');
    expect(t.x[0]).toBe(1094995.5792535634);
  });
});

describe('fatal errors name file:line, station, column, value and expectation', () => {
  const cases: [string, string, string][] = [
    ['non-numeric', 'id,lon,lat,height_m\nK1,10,abc,100\n', "v.csv:2: station K1: column lat: 'abc' is not a number; expected a latitude in degrees (decimal point '.')"],
    ['non-finite', 'id,lon,lat,height_m\nK1,10,50,Infinity\n', "v.csv:2: station K1: column height_m: 'Infinity' is not a number; expected a height in m (decimal point '.')"],
    ['empty required', 'id,lon,lat,height_m\nK1,,50,100\n', 'v.csv:2: station K1: column lon: empty value; expected a longitude in degrees'],
    ['latitude range', 'id,lon,lat,height_m\nK1,10,91,100\n', 'v.csv:2: station K1: column lat: latitude 91 is outside [-90, 90] degrees'],
    ['longitude range', 'id,lon,lat,height_m\nK1,360,50,100\n', 'v.csv:2: station K1: column lon: longitude 360 is outside [-180, 360) degrees'],
    ['height in feet by mistake', 'id,lon,lat,height_m\nK1,10,50,12000\n', 'v.csv:2: station K1: column height_m: height 12000 m is outside [-500, 9000] m; did you mean --height-units ft?'],
    ['height absurd', 'id,lon,lat,height_m\nK1,10,50,-900\n', 'v.csv:2: station K1: column height_m: height -900 m is outside [-500, 9000] m'],
    ['ragged row', 'id,lon,lat,height_m\nK1,10,50\n', "v.csv:2: station K1: 3 fields, expected 4 as in the header (line 1, delimiter ',')"],
    ['duplicate id', 'id,lon,lat,height_m\nK1,10,50,1\nK1,11,50,1\n', "v.csv:3: station K1: column id: station id 'K1' appears twice: lines 2 and 3; expected unique ids"],
    ['missing column', 'id,lon,height_m\nK1,10,1\n', "v.csv:1: missing required column lat (or map them with --columns, e.g. --columns lon=LONG,lat=LAT); columns found: 'id', 'lon', 'height_m'"],
    ['empty file', '\n# nothing\n', 'v.csv: no header line: the file is empty or has only comments and blank lines'],
    ['header only', 'id,lon,lat,height_m\n', 'v.csv: no station rows after the header (line 1)'],
    ['bad optional value', 'id,lon,lat,height_m,gobs_mgal\nK1,10,50,1,98x\n', "v.csv:2: station K1: column gobs_mgal: '98x' is not a number; expected observed gravity in mGal (decimal point '.')"],
    ['decimal comma', 'id;lon;lat;height_m\nK1;10,5;50;1\n', "v.csv:2: station K1: column lon: '10,5' is not a number; expected a longitude in degrees (decimal point '.')"],
  ];
  for (const [name, text, message] of cases) {
    it(`${name} is fatal without keepGoing`, () => {
      expect(errorOf(() => parseStations(text, 'v.csv')).message).toBe(message);
    });
  }

  it('a projected station CRS without x/y columns asks for them', () => {
    const e = errorOf(() => parseStations(BASIC, 'v.csv', { stationCrs: 'EPSG:32633' }));
    expect(e.message).toContain('missing required columns x, y (the station CRS is projected');
  });
});

describe('keepGoing and flags', () => {
  it('with keepGoing, row-level problems become bad_row with NaN numbers and a warning', () => {
    const text = 'id,lon,lat,height_m,gobs_mgal\nL1,10,50,100,980000\nL2,10,95,100,980000\n,10,50.2,100,1\nL4,10\nL5,10,50.3,100,980001\n';
    const t = parseStations(text, 'k.csv', { keepGoing: true });
    expect(t.ids).toEqual(['L1', 'L2', '(line 4)', 'L4', 'L5']);
    expect(t.flags).toEqual([[], ['bad_row'], ['bad_row'], ['bad_row'], []]);
    for (const i of [1, 2, 3]) {
      for (const a of [t.lonDeg, t.latDeg, t.heightM, t.gobsMgal]) expect(Number.isNaN(a[i] as number)).toBe(true);
    }
    expect(t.warnings).toEqual([
      'k.csv:3: station L2: column lat: latitude 95 is outside [-90, 90] degrees',
      'k.csv:4: column id: empty station id',
      "k.csv:5: station L4: 2 fields, expected 5 as in the header (line 1, delimiter ',')",
    ]);
    expect(t.rows[3]).toEqual(['L4', '10']);
  });

  it('duplicate ids stay fatal with keepGoing', () => {
    expect(() => parseStations('id,lon,lat,height_m\nK1,10,50,1\nK1,11,50,1\n', 'v.csv', { keepGoing: true })).toThrow(
      "station id 'K1' appears twice: lines 2 and 3",
    );
  });

  it('two stations within 1 cm are both flagged duplicate_position, not an error', () => {
    // 0.005 m apart in UTM; 1 m apart is not a duplicate
    const text = 'id,x,y,height_m\nM1,500000,5200000,10\nM2,500000.003,5200000.004,10\nM3,500001,5200000,10\n';
    const t = parseStations(text, 'd.csv', { stationCrs: 'EPSG:32633' });
    expect(t.flags).toEqual([['duplicate_position'], ['duplicate_position'], []]);
  });

  it('duplicate_position works on lon/lat too (1e-8 degrees is about 1 mm)', () => {
    const t = parseStations('id,lon,lat,height_m\nN1,10,50,1\nN2,10.00000001,50,1\nN3,10.001,50,1\n', 'd.csv');
    expect(t.flags).toEqual([['duplicate_position'], ['duplicate_position'], []]);
  });
});
