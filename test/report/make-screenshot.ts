/**
 * Makes the README picture of the HTML report: a screenshot of chosen report sections in
 * headless Chromium.
 *
 *   node --import tsx test/report/make-screenshot.ts [REPORT.html] [OUT.png] [SECTION_ID ...]
 *
 * Without REPORT.html it writes a report of the invented survey of synthetic-results.ts over the
 * synthetic DEM fixture first. OUT.png defaults to docs/report-screenshot.png; the sections
 * default to the two maps, TC against height and the legacy comparison, two to a row.
 */
import { mkdtempSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { pathToFileURL } from 'node:url';
import { chromium } from 'playwright-core';
import { writeReport } from '../../src/report/write-report.js';
import { writeSyntheticResults } from './synthetic-results.js';

const CHROMIUM = process.env.CHROMIUM_PATH ?? '/usr/bin/chromium';

async function main(argv: string[]): Promise<void> {
  let [report, out, ...sections] = argv;
  if (report === undefined || report === '-') {
    const dir = mkdtempSync(join(tmpdir(), 'talus-shot-'));
    report = join(dir, 'report.html');
    await writeReport(writeSyntheticResults(dir), report, { demPath: new URL('../fixtures/dem/plain-f32.tif', import.meta.url).pathname, title: 'talus report: invented survey' });
  }
  out ??= new URL('../../docs/report-screenshot.png', import.meta.url).pathname;
  if (sections.length === 0) sections = ['map-cba', 'map-tc', 'tc-height', 'legacy'];
  const browser = await chromium.launch({ executablePath: CHROMIUM, args: ['--no-sandbox', '--disable-gpu', '--disable-background-networking', '--no-first-run'] });
  try {
    const page = await browser.newPage({ viewport: { width: 1340, height: 900 } });
    await page.goto(pathToFileURL(report).href);
    // lay the chosen sections out two to a row for one compact picture
    await page.addStyleTag({ content: `main { max-width: none; display: grid; grid-template-columns: 1fr 1fr; gap: 0 16px; } main > section { min-width: 0; } footer { display: none; }` });
    const keep = JSON.stringify(sections);
    await page.evaluate(`for (const s of document.querySelectorAll('main > section')) if (!${keep}.includes(s.id)) s.remove();`);
    const main = await page.$('main');
    if (!main) throw new Error('the report has no <main>');
    await main.screenshot({ path: out });
    process.stdout.write(`wrote ${out}\n`);
  } finally {
    await browser.close();
  }
}

await main(process.argv.slice(2));
