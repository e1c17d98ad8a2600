import { describe, expect, it } from 'vitest';
import { PNG } from 'pngjs';
import { createFrame } from '../../src/report/charts/chart-frame.js';
import { scatterChart } from '../../src/report/charts/scatter-chart.js';
import { lineChart } from '../../src/report/charts/line-chart.js';
import { binValues, histogramChart } from '../../src/report/charts/histogram-chart.js';
import { boxStripChart } from '../../src/report/charts/box-strip-chart.js';
import { stationMap } from '../../src/report/charts/station-map.js';
import { sequentialScale } from '../../src/report/colour-scale.js';
import { hillshade, reliefBackground } from '../../src/report/relief-image.js';
import { gridFromFunction } from '../../src/dem/grid.js';
import { assertClose } from '../helpers/assert-close.js';

const count = (svg: string, re: RegExp) => (svg.match(re) ?? []).length;

describe('chart frame', () => {
  it('equal-aspect maps: one degree of longitude is cos(60°) = 0.5 of a degree of latitude on screen at 60°N', () => {
    const f = createFrame({ id: 'm', title: 't', xLabel: 'x', yLabel: 'y', xDomain: [10, 12], yDomain: [59.5, 60.5], equalAspect: 0.5 });
    const pxPerLon = f.sx(11) - f.sx(10);
    const pxPerLat = f.sy(60) - f.sy(61);
    // both are linear maps of doubles: agreement to rounding
    assertClose(pxPerLon / pxPerLat, 0.5, { rel: 1e-9 }, 'aspect');
    // the data still fit inside the plot
    expect(f.xDomain[0]).toBeLessThanOrEqual(10);
    expect(f.xDomain[1]).toBeGreaterThanOrEqual(12);
    expect(f.yDomain[0]).toBeLessThanOrEqual(59.5);
    expect(f.yDomain[1]).toBeGreaterThanOrEqual(60.5);
  });

  it('axis labels (with units) and the title are escaped into the SVG', () => {
    const f = createFrame({ id: 'a', title: 'TC <&> "x"', xLabel: 'Height (m)', yLabel: 'TC (mGal)', xDomain: [0, 1], yDomain: [0, 1] });
    const svg = f.open() + f.close();
    expect(svg).toContain('TC &lt;&amp;&gt; &quot;x&quot;');
    expect(svg).toContain('Height (m)');
    expect(svg).toContain('TC (mGal)');
    expect(svg).not.toContain('<&>');
  });
});

describe('charts', () => {
  it('scatter draws one dot per finite pair, and the fitted line', () => {
    const svg = scatterChart({
      id: 's',
      title: 'S',
      xLabel: 'x (m)',
      yLabel: 'y (mGal)',
      series: [{ label: 'st', x: [1, 2, 3, NaN, 5], y: [2, 4, 6, 8, NaN] }],
      line: { slope: 2, intercept: 0, label: 'fit' },
    });
    expect(count(svg, /<circle /g)).toBe(3 + 1); // 3 points + 1 legend dot
    expect(count(svg, /class="fit-line"/g)).toBe(1);
  });

  it('scatter with identity draws the 1:1 line over a shared domain', () => {
    const svg = scatterChart({ id: 'i', title: 'I', xLabel: 'a (mGal)', yLabel: 'b (mGal)', series: [{ label: 'st', x: [0, 1, 2], y: [0.1, 1.2, 2.5] }], identity: true });
    expect(count(svg, /class="ref-line"/g)).toBe(1);
  });

  it('an empty scatter says so instead of drawing nothing', () => {
    const svg = scatterChart({ id: 'e', title: 'E', xLabel: 'a', yLabel: 'b', series: [{ label: 'st', x: [NaN], y: [1] }] });
    expect(svg).toContain('chart-empty');
    expect(svg).toContain('No stations with both values.');
  });

  it('line chart draws a path per series and the marker', () => {
    const svg = lineChart({
      id: 'l',
      title: 'L',
      xLabel: 'Density (kg/m³)',
      yLabel: 'r',
      series: [{ label: 'c', points: [[2000, 0.5], [2200, 0], [2400, -0.4]] }],
      markers: [{ x: 2200, label: '2200 kg/m³' }],
    });
    expect(count(svg, /<path class="series"/g)).toBe(1);
    expect(svg).toContain('2200 kg/m³');
  });

  it('histogram bins hold every finite value once, with edges on multiples of the bin width', () => {
    const values = Array.from({ length: 250 }, (_, i) => Math.sin(i) * 7.3 + 0.1);
    const b = binValues([...values, NaN]);
    expect(b.counts.reduce((a, c) => a + c, 0)).toBe(250);
    assertClose(b.start / b.width, Math.round(b.start / b.width), { abs: 1e-9 }, 'start is a whole number of widths, to rounding');
    const svg = histogramChart({ id: 'h', title: 'H', xLabel: 'Misfit (m)', values });
    const bars = /<g class="bars"[^>]*>(.*?)<\/g>/.exec(svg)?.[1] ?? '';
    expect(count(bars, /<rect /g)).toBe(b.counts.filter((c) => c > 0).length);
  });

  it('box/strip chart: one box per group and one dot per finite value', () => {
    const svg = boxStripChart({ id: 'b', title: 'B', yLabel: 'Change (mGal)', groups: [{ label: 'dem', values: [1, 2, 3, 4] }, { label: 'far', values: [0.5, NaN, 0.7] }] });
    expect(count(svg, /class="box"/g)).toBe(2);
    expect(count(svg, /<circle /g)).toBe(6);
    expect(svg).toContain('>dem<');
  });

  it('station map: a coloured dot per station, a colour bar with its unit, and the background image', () => {
    const values = [1, 2, 3, NaN];
    const svg = stationMap({
      id: 'm',
      title: 'M',
      coords: 'projected',
      x: [0, 100, 200, 300],
      y: [0, 50, 100, 150],
      values,
      scale: sequentialScale(values),
      valueLabel: 'TC (mGal)',
      ids: ['A<1>', 'B', 'C', 'D'],
      background: { dataUri: 'data:image/png;base64,AAAA', xMin: 0, xMax: 300, yMin: 0, yMax: 150 },
    });
    expect(count(svg, /<circle /g)).toBe(4);
    expect(svg).toContain('linearGradient');
    expect(svg).toContain('TC (mGal)');
    expect(svg).toContain('<image class="relief" href="data:image/png;base64,AAAA"');
    expect(svg).toContain('A&lt;1&gt;');
    expect(svg).toContain('Easting (m)');
  });
});

describe('shaded relief', () => {
  it('a flat surface is lit at sin(45°) of full light (sun 45° above the horizon)', () => {
    const s = hillshade(new Float64Array(9).fill(100), 3, 3, 30, 30);
    for (const v of s) assertClose(v, Math.SQRT1_2, { abs: 1e-12 }, 'closed form for zero slope');
  });

  it('a slope facing the north-west sun is brighter than one facing away', () => {
    const w = 5;
    const toNW = new Float64Array(w * w);
    const toSE = new Float64Array(w * w);
    for (let j = 0; j < w; j++) for (let i = 0; i < w; i++) {
      // row j grows southwards; height rising to the south-east faces north-west
      toNW[j * w + i] = 10 * (i + j);
      toSE[j * w + i] = -10 * (i + j);
    }
    const a = hillshade(toNW, w, w, 30, 30)[12] as number;
    const b = hillshade(toSE, w, w, 30, 30)[12] as number;
    expect(a).toBeGreaterThan(Math.SQRT1_2);
    expect(b).toBeLessThan(Math.SQRT1_2);
  });

  it('the background is a PNG data URI at most 600 px wide covering the requested window', () => {
    const grid = gridFromFunction(
      { width: 1500, height: 300, originX: 0, originY: 3000, cellSizeX: 10, cellSizeY: 10, source: 'synthetic', crs: { kind: 'projected', proj4: '', label: 'local', linearUnitM: 1 } },
      (x, y) => 200 + 50 * Math.sin(x / 700) * Math.cos(y / 400),
    );
    const bg = reliefBackground(grid, { xMin: 0, xMax: 15000, yMin: 0, yMax: 3000 });
    expect(bg).toBeDefined();
    const png = PNG.sync.read(Buffer.from((bg?.dataUri ?? '').replace(/^data:image\/png;base64,/, ''), 'base64'));
    expect(png.width).toBeLessThanOrEqual(600);
    expect(png.width).toBeGreaterThanOrEqual(500);
    // 1500 columns at stride 3 → 500 px covering the full 15 km
    expect(bg?.xMin).toBe(0);
    expect(bg?.xMax).toBe(15000);
    expect(bg?.yMax).toBe(3000);
  });

  it('a window that misses the DEM gives no background', () => {
    const grid = gridFromFunction({ width: 10, height: 10, originX: 0, originY: 100, cellSizeX: 10, cellSizeY: 10, source: 's', crs: { kind: 'projected', proj4: '', label: 'local', linearUnitM: 1 } }, () => 1);
    expect(reliefBackground(grid, { xMin: 500, xMax: 600, yMin: 500, yMax: 600 })).toBeUndefined();
  });
});
