/**
 * `talus density` through runCli with in-memory streams, on the invented prism-terrain survey
 * written to a temporary results CSV. Density tolerance +-30 kg/m^3 as in recovery.test.ts.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { runCli } from '../../src/cli/main.js';
import { memoryIo } from '../../src/cli/io.js';
import { EAST0_M, NORTH0_M, makeSurvey, surveyCsv, terrainStations } from './synthetic-survey.js';
import { assertClose } from '../helpers/assert-close.js';

let dir: string;
let file: string;
let trendFile: string;
beforeAll(() => {
  dir = mkdtempSync(join(tmpdir(), 'talus-density-'));
  const t = terrainStations(200, 11);
  file = join(dir, 'results.csv');
  writeFileSync(file, surveyCsv(makeSurvey(t, { densityKgM3: 2670, noiseMgal: 0.1, seed: 5 })));
  trendFile = join(dir, 'trend.csv');
  writeFileSync(trendFile, surveyCsv(makeSurvey(t, { densityKgM3: 2670, noiseMgal: 0.1, seed: 5, trendMgalPerM: { ax: 0.0008, ay: 0.0003 } })));
});
afterAll(() => rmSync(dir, { recursive: true, force: true }));

async function run(args: string[]): Promise<{ code: number; out: string; err: string }> {
  const io = memoryIo();
  const code = await runCli(args, io);
  return { code, out: io.out(), err: io.err() };
}

interface DensityJson {
  parasnis: { density: number; stderr: number; r2: number; n: number; downweighted: number };
  nettleton: { density: number; curve: [number, number][]; zeroCrossing: boolean };
  verdict: { agree: boolean; warnings: string[] };
}

describe('talus density', () => {
  it('--json prints both estimates, recovering 2670 kg/m^3 within 30', async () => {
    const r = await run(['density', file, '--json']);
    expect(r.code).toBe(0);
    const j = JSON.parse(r.out) as DensityJson;
    assertClose(j.parasnis.density, 2670, { abs: 30 }, 'parasnis');
    assertClose(j.nettleton.density, 2670, { abs: 30 }, 'nettleton');
    expect(j.parasnis.n).toBe(200);
    expect(j.parasnis.stderr).toBeGreaterThan(0);
    expect(j.parasnis.r2).toBeGreaterThan(0.9);
    expect(j.nettleton.curve).toHaveLength(121); // default 1800:3000:10
    expect(j.nettleton.curve[0]).toEqual([1800, expect.any(Number)]);
    expect(j.verdict.agree).toBe(true);
  });

  it('prints a readable summary table with the verdict', async () => {
    const r = await run(['density', file]);
    expect(r.code).toBe(0);
    expect(r.out).toMatch(/^Parasnis\s+\d{4}\s+\d+/m);
    expect(r.out).toMatch(/^Nettleton\s+\d{4}\s+\d+/m);
    expect(r.out).toContain('200 stations used');
    expect(r.out).toMatch(/agree/);
  });

  it('warns about a trend without --trend and removes it with --trend linear', async () => {
    const plain = await run(['density', trendFile]);
    expect(plain.out).toMatch(/warning: .*--trend linear/);
    const j = JSON.parse((await run(['density', trendFile, '--trend', 'linear', '--json'])).out) as DensityJson;
    assertClose(j.parasnis.density, 2670, { abs: 30 }, 'parasnis + trend');
    assertClose(j.nettleton.density, 2670, { abs: 30 }, 'nettleton + trend');
  });

  it('--box, --where and --polygon select stations', async () => {
    const box = `${EAST0_M},${NORTH0_M},${EAST0_M + 3000},${NORTH0_M + 6000}`;
    const west = JSON.parse((await run(['density', file, '--box', box, '--json'])).out) as DensityJson;
    const where = JSON.parse((await run(['density', file, '--where', 'unit=west', '--json'])).out) as DensityJson;
    const poly = `${EAST0_M} ${NORTH0_M}, ${EAST0_M + 3000} ${NORTH0_M}, ${EAST0_M + 3000} ${NORTH0_M + 6000}, ${EAST0_M} ${NORTH0_M + 6000}`;
    const inPoly = JSON.parse((await run(['density', file, '--polygon', poly, '--json'])).out) as DensityJson;
    const east = JSON.parse((await run(['density', file, '--where', `x>${EAST0_M + 3000}`, '--json'])).out) as DensityJson;
    // the column "unit" marks x < 3000 m as west: all three selections pick the same stations
    expect(west.parasnis.n).toBe(where.parasnis.n);
    expect(inPoly.parasnis.n).toBe(where.parasnis.n);
    expect(west.parasnis.n + east.parasnis.n).toBe(200);
    expect(west.parasnis.n).toBeGreaterThan(50);
    // one density everywhere in the model: each half recovers it (fewer stations, same tolerance)
    assertClose(west.parasnis.density, 2670, { abs: 30 }, 'west');
    assertClose(east.parasnis.density, 2670, { abs: 30 }, 'east');
  });

  it('--columns maps renamed input columns', async () => {
    const renamed = join(dir, 'renamed.csv');
    const { readFileSync } = await import('node:fs');
    writeFileSync(renamed, readFileSync(file, 'utf8').replace(/^id,x,y,height_m/, 'STN,E,N,elev'));
    const r = await run(['density', renamed, '--columns', 'id=STN,x=E,y=N,height_m=elev', '--json']);
    expect(r.code).toBe(0);
    assertClose((JSON.parse(r.out) as DensityJson).parasnis.density, 2670, { abs: 30 }, 'renamed');
  });
});

describe('talus density input errors exit 2 with one clear line', () => {
  it('a missing file', async () => {
    const r = await run(['density', join(dir, 'nope.csv')]);
    expect(r.code).toBe(2);
    expect(r.err).toMatch(/nope\.csv: cannot read the file \(ENOENT\)/);
  });

  it('a missing column names the column and lists those present', async () => {
    const bad = join(dir, 'nocol.csv');
    writeFileSync(bad, 'id,x,y,height_m,free_air_anomaly_mgal,bouguer_unit_mgal\nA,1,2,3,4,5\n');
    const r = await run(['density', bad]);
    expect(r.code).toBe(2);
    expect(r.err).toMatch(/nocol\.csv:1: column terrain_corr_unit_mgal: missing column "terrain_corr_unit_mgal"/);
  });

  it('a bad number names file, line, station, column and value', async () => {
    const bad = join(dir, 'badnum.csv');
    writeFileSync(bad, 'id,x,y,height_m,free_air_anomaly_mgal,bouguer_unit_mgal,terrain_corr_unit_mgal\nA,1,2,3,4,5,6\nB,1,2,abc,4,5,6\n');
    const r = await run(['density', bad]);
    expect(r.code).toBe(2);
    expect(r.err).toContain('badnum.csv:3: station B: column height_m: value "abc" is not a number');
  });

  for (const range of ['3000:1800:10', '1800:3000:0', '1800:3000', 'a:b:c']) {
    it(`a bad --range ${range}`, async () => {
      const r = await run(['density', file, '--range', range]);
      expect(r.code).toBe(2);
      expect(r.err).toMatch(/column --range: bad value .*expected FROM:TO:STEP/);
    });
  }

  it('a bad --trend, --box, --where column and too few selected stations', async () => {
    expect((await run(['density', file, '--trend', 'quadratic'])).err).toMatch(/--trend: bad value "quadratic": expected one of none, linear/);
    expect((await run(['density', file, '--box', '1,2,3'])).code).toBe(2);
    const w = await run(['density', file, '--where', 'geology=granite']);
    expect(w.code).toBe(2);
    expect(w.err).toMatch(/--where names column "geology", which is not in the file/);
    const few = await run(['density', file, '--box', `${EAST0_M},${NORTH0_M},${EAST0_M + 1},${NORTH0_M + 1}`]);
    expect(few.code).toBe(2);
    expect(few.err).toMatch(/only 0 stations .* expected at least 4/);
  });
});
