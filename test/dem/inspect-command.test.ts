/**
 * `talus inspect` through runCli, against GDAL (gdalinfo -json -stats) and PROJ (cs2cs corner
 * transforms, geod distances) as recorded by make-fixtures.sh.
 */
import { describe, expect, it } from 'vitest';
import { runCli } from '../../src/cli/main.js';
import { memoryIo } from '../../src/cli/io.js';
import type { DemDescription } from '../../src/dem/describe-dem.js';
import { assertClose } from '../helpers/assert-close.js';
import { cs2csCorners, fixturePath, gdalInfo, geodSpacingM, projinfoDef } from './gdal-reference.js';

async function inspectJson(args: string[]): Promise<DemDescription> {
  const io = memoryIo();
  const code = await runCli(['inspect', '--json', ...args], io);
  expect(io.err()).toBe('');
  expect(code).toBe(0);
  const lines = io.out().trim().split('\n');
  expect(lines).toHaveLength(1);
  return JSON.parse(lines[0]!) as DemDescription;
}

/** Corners sorted north to south, then west to east, so south-up files compare with GDAL's pixel order. */
const byPosition = (p: [number, number][]): [number, number][] => [...p].sort((a, b) => b[1] - a[1] || a[0] - b[0]);

function checkAgainstGdal(d: DemDescription, name: string, cornerTolDeg = 1e-9): void {
  const info = gdalInfo(name);
  expect([d.width, d.height]).toEqual(info.size);
  const cc = Object.entries(info.cornerCoordinates!).filter(([k]) => k !== 'center').map(([, v]) => v);
  const xs = cc.map((c) => c[0]);
  const ys = cc.map((c) => c[1]);
  // gdalinfo prints corner coordinates to 3 decimals for projected grids: 5e-4 CRS units
  const tol = { abs: d.crs.kind === 'geographic' ? 5e-8 : 5e-4 };
  assertClose(d.extent.minX, Math.min(...xs), tol, 'minX');
  assertClose(d.extent.maxX, Math.max(...xs), tol, 'maxX');
  assertClose(d.extent.minY, Math.min(...ys), tol, 'minY');
  assertClose(d.extent.maxY, Math.max(...ys), tol, 'maxY');
  const st = info.bands[0]!.metadata![''] as Record<string, string>;
  // GDAL prints statistics with 14 significant digits
  assertClose(d.stats.minM, Number(st.STATISTICS_MINIMUM), { rel: 1e-13 }, 'min');
  assertClose(d.stats.maxM, Number(st.STATISTICS_MAXIMUM), { rel: 1e-13 }, 'max');
  assertClose(d.stats.meanM, Number(st.STATISTICS_MEAN), { rel: 1e-13 }, 'mean');
  // VALID_PERCENT is printed with 2 decimals
  assertClose(100 * (1 - d.stats.nodataFraction), Number(st.STATISTICS_VALID_PERCENT), { abs: 0.005 }, 'valid %');
  const corners = cs2csCorners(name);
  if (corners !== undefined) {
    const ours = byPosition(d.cornersLonLatDeg);
    byPosition(corners).forEach(([lon, lat], i) => {
      assertClose(ours[i]![0], lon, { abs: cornerTolDeg }, `corner ${i} lon`);
      assertClose(ours[i]![1], lat, { abs: cornerTolDeg }, `corner ${i} lat`);
    });
  }
}

describe('talus inspect', () => {
  // corners: proj4 and PROJ agree to < 1e-6 m (~1e-11 deg) for UTM and LCC with one definition;
  // 1e-9 deg (0.1 mm) leaves room for cs2cs's 12 printed decimals
  it.each(['plain-f32', 'int16-lzw-pred2', 'south-up', 'ftus-crs', 'cog'])('%s --json matches gdalinfo and cs2cs', async (name) => {
    const d = await inspectJson([fixturePath(name)]);
    checkAgainstGdal(d, name);
  });

  it('projected spacing in metres uses the CRS unit (98.425 US survey ft = 30.0000 m)', async () => {
    const d = await inspectJson([fixturePath('ftus-crs')]);
    // 98.425 usft x 1200/3937 = 30.0000600 m; the fixture's extent was rounded to 0.1 ft
    assertClose(d.spacingEastM, 98.42500000000291 * (1200 / 3937), { rel: 1e-15 }, 'E-W');
    expect(d.crs.linearUnitM).toBe(1200 / 3937);
  });

  it('geographic spacing in metres at the centre latitude matches PROJ geod distances', async () => {
    const d = await inspectJson([fixturePath('geographic-4326')]);
    checkAgainstGdal(d, 'geographic-4326');
    const geod = geodSpacingM('geographic-4326');
    // geod prints 1e-9 m; a one-cell geodesic and the radius-of-curvature arc differ by ~1e-11 m
    assertClose(d.spacingEastM, geod.ewM, { abs: 2e-9 }, 'E-W m');
    assertClose(d.spacingNorthM, geod.nsM, { abs: 2e-9 }, 'N-S m');
    expect(d.crs.kind).toBe('geographic');
  });

  it('--dem-crs supplies a CRS the offline table lacks (EPSG:3794, definition from projinfo)', async () => {
    const d = await inspectJson([fixturePath('national-3794'), '--dem-crs', projinfoDef('national-3794')]);
    // measured 1.1e-9 deg (0.12 mm): proj4's series transverse Mercator vs PROJ's exact one,
    // 1.3 deg from the central meridian; 3e-9 deg (0.33 mm) is far below a DEM cell
    checkAgainstGdal(d, 'national-3794', 3e-9);
  });

  it('--dem-units ft reports elevations in metres', async () => {
    const ft = await inspectJson([fixturePath('feet-elevations'), '--dem-units', 'ft']);
    const st = gdalInfo('feet-elevations').bands[0]!.metadata![''] as Record<string, string>;
    // min/max are single float32 products v*0.3048: half an ulp at ~1100 m is 6.2e-5 m
    assertClose(ft.stats.maxM, Number(st.STATISTICS_MAXIMUM) * 0.3048, { abs: 6.2e-5 }, 'max');
    assertClose(ft.stats.minM, Number(st.STATISTICS_MINIMUM) * 0.3048, { abs: 6.2e-5 }, 'min');
    expect(ft.elevationUnit).toBe('ft');
  });

  it('prints a readable table by default', async () => {
    const io = memoryIo();
    expect(await runCli(['inspect', fixturePath('cog')], io)).toBe(0);
    const out = io.out();
    expect(out).toMatch(/^size\s+64 x 48 cells/m);
    expect(out).toMatch(/^CRS\s+EPSG:32633 \(projected, 1 m per unit\)/m);
    expect(out).toMatch(/^spacing \(m\)\s+30 E-W x 30 N-S/m);
    expect(out).toMatch(/^nodata cells\s+26 of 3072 \(0\.85 %\)/m);
    expect(out).toMatch(/^compression\s+deflate/m);
    expect(out).toMatch(/^layout\s+tiles 16 x 16; 2 overviews; classic TIFF/m);
  });

  it.each([
    ['no-such-dem', /no-such-dem\.tif: cannot be opened \(no such file\)/],
    ['not-a-tiff', /not-a-tiff\.tif: cannot be read as a TIFF/],
    ['truncated', /truncated\.tif: is truncated/],
    ['non-geo', /non-geo\.tif: is a plain TIFF with no GeoTIFF keys/],
    ['lzma', /lzma\.tif: uses LZMA compression \(TIFF code 34925\), which talus cannot decode/],
    ['user-defined-crs', /user-defined-crs\.tif: .*pass its definition with --dem-crs/],
  ])('%s → exit 2 with one line naming the file', async (name, message) => {
    const io = memoryIo();
    expect(await runCli(['inspect', fixturePath(name)], io)).toBe(2);
    expect(io.out()).toBe('');
    const lines = io.err().trim().split('\n');
    expect(lines).toHaveLength(1);
    expect(lines[0]).toMatch(message);
  });

  it('a bad --dem-units is an input error', async () => {
    const io = memoryIo();
    expect(await runCli(['inspect', fixturePath('plain-f32'), '--dem-units', 'yards'], io)).toBe(2);
    expect(io.err()).toMatch(/--dem-units yards: expected m, ft or usft/);
  });
});
