/**
 * The report in a real browser (headless Chromium through playwright-core): every chart is
 * drawn with marks and a non-zero size, no text is clipped or overlaps its axis neighbours, the
 * page logs no errors and makes no requests. Saves test/artifacts/report.png.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { existsSync, mkdirSync, mkdtempSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { pathToFileURL } from 'node:url';
import type { Browser } from 'playwright-core';
import { chromium } from 'playwright-core';
import { writeReport } from '../../src/report/write-report.js';
import { EXPECTED_CHARTS, writeSyntheticResults } from './synthetic-results.js';

const CHROMIUM = '/usr/bin/chromium';
const HAVE_CHROMIUM = existsSync(CHROMIUM);
const ARTIFACTS = new URL('../artifacts/', import.meta.url).pathname;
const DEM = new URL('../fixtures/dem/plain-f32.tif', import.meta.url).pathname;

interface ChartCheck {
  id: string;
  width: number;
  height: number;
  marks: number;
  marksWidth: number;
  marksHeight: number;
  texts: number;
  clippedTexts: string[];
  overlappingTexts: string[];
}

/**
 * Runs in the page (a string, so the Node-side type check needs no DOM types): per chart, its
 * size, its marks and their bounding box, texts reaching outside the chart, and pairs of labels
 * (title, legend, ticks, axis labels) whose boxes intersect.
 */
const MEASURE_CHARTS_JS = `[...document.querySelectorAll('svg.chart')].map((svg) => {
  const box = svg.getBoundingClientRect();
  const marks = svg.querySelector('g.marks');
  const mb = marks ? marks.getBBox() : { width: 0, height: 0 };
  const clippedTexts = [];
  for (const t of svg.querySelectorAll('text')) {
    const r = t.getBoundingClientRect();
    if (r.width === 0) continue;
    if (r.left < box.left - 1 || r.right > box.right + 1 || r.top < box.top - 1 || r.bottom > box.bottom + 1) clippedTexts.push(t.textContent);
  }
  // every text outside the plotted marks: title, legend, tick and axis labels, colour bar
  const overlappingTexts = [];
  const rs = [...svg.querySelectorAll('text')].filter((t) => t.closest('g.marks') === null).map((t) => ({ r: t.getBoundingClientRect(), s: t.textContent }));
  for (let i = 0; i < rs.length; i++)
    for (let j = i + 1; j < rs.length; j++) {
      const a = rs[i].r, b = rs[j].r;
      if (a.width > 0 && b.width > 0 && a.left < b.right && b.left < a.right && a.top < b.bottom && b.top < a.bottom) overlappingTexts.push(rs[i].s + ' / ' + rs[j].s);
    }
  return {
    id: svg.getAttribute('data-chart'),
    width: box.width,
    height: box.height,
    marks: marks ? marks.querySelectorAll('circle, rect, path, line, image').length : 0,
    marksWidth: mb.width,
    marksHeight: mb.height,
    texts: svg.querySelectorAll('text').length,
    clippedTexts,
    overlappingTexts,
  };
})`;

describe('report in headless Chromium', () => {
  it('Chromium is installed where the browser test expects it (required when CI is set)', () => {
    if (!HAVE_CHROMIUM) {
      console.warn(
        `\n*** ${CHROMIUM} not found: the browser test of the HTML report did NOT run. ` +
          `Install it (Debian: apt-get install chromium) to check the report in a real browser. ***\n`,
      );
    }
    // On CI the browser is installed, so its absence is a failure there.
    expect(HAVE_CHROMIUM || !process.env.CI).toBe(true);
  });

  describe.runIf(HAVE_CHROMIUM)('with the browser', () => {
    let browser: Browser;
    beforeAll(async () => {
      browser = await chromium.launch({
        executablePath: CHROMIUM,
        args: ['--no-sandbox', '--disable-gpu', '--disable-background-networking', '--disable-component-update', '--disable-sync', '--no-first-run', '--disable-quic'],
      });
    });
    afterAll(async () => {
      await browser?.close();
    });

    it('draws every chart with marks, no clipped or overlapping labels, no console errors or requests', async () => {
      const dir = mkdtempSync(join(tmpdir(), 'talus-report-browser-'));
      const out = join(dir, 'report.html');
      await writeReport(writeSyntheticResults(dir), out, { demPath: DEM });
      const page = await browser.newPage({ viewport: { width: 1100, height: 900 } });
      const problems: string[] = [];
      const fileUrl = pathToFileURL(out).href;
      page.on('console', (m) => {
        if (m.type() === 'error' || m.type() === 'warning') problems.push(`console ${m.type()}: ${m.text()}`);
      });
      page.on('pageerror', (e) => problems.push(`page error: ${e.message}`));
      page.on('requestfailed', (r) => problems.push(`failed request: ${r.url()}`));
      page.on('request', (r) => {
        const url = r.url();
        if (url !== fileUrl && !url.startsWith('data:')) problems.push(`request: ${url}`);
      });
      await page.goto(fileUrl, { waitUntil: 'load' });

      const checks = (await page.evaluate(MEASURE_CHARTS_JS)) as ChartCheck[];
      expect(checks.map((c) => c.id).sort()).toEqual([...EXPECTED_CHARTS].sort());
      for (const c of checks) {
        expect(c.width, c.id).toBeGreaterThan(100);
        expect(c.height, c.id).toBeGreaterThan(100);
        expect(c.marks, c.id).toBeGreaterThan(0);
        expect(c.marksWidth, c.id).toBeGreaterThan(0);
        expect(c.marksHeight, c.id).toBeGreaterThan(0);
        expect(c.texts, `${c.id}: ticks and labels drawn`).toBeGreaterThan(5);
        expect(c.clippedTexts, `${c.id}: text outside the chart`).toEqual([]);
        expect(c.overlappingTexts, `${c.id}: overlapping labels`).toEqual([]);
      }
      // the relief PNGs decode in the browser: an SVG <image> that failed would have an empty box
      const reliefBoxes = (await page.evaluate(`[...document.querySelectorAll('image.relief')].map((i) => i.getBBox().width)`)) as number[];
      expect(reliefBoxes.length).toBe(3);
      for (const w of reliefBoxes) expect(w).toBeGreaterThan(0);

      mkdirSync(ARTIFACTS, { recursive: true });
      await page.screenshot({ path: join(ARTIFACTS, 'report.png'), fullPage: true });

      // printed: every section after the first starts a new page
      await page.emulateMedia({ media: 'print' });
      const breaks = (await page.evaluate(`[...document.querySelectorAll('section')].map((s) => getComputedStyle(s).breakBefore)`)) as string[];
      expect(breaks.slice(1).every((b) => b === 'page')).toBe(true);
      expect(problems).toEqual([]);
      await page.close();
    });
  });
});
