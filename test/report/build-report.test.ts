import { beforeAll, describe, expect, it } from 'vitest';
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { buildReport } from '../../src/report/build-report.js';
import { loadReportData } from '../../src/report/load-report-data.js';
import { REPORT_SECTIONS } from '../../src/report/report-sections.js';
import type { ReportSection } from '../../src/report/section-types.js';
import { EXPECTED_CHARTS, syntheticResultsCsv, writeSyntheticResults } from './synthetic-results.js';


let dir: string;
beforeAll(() => {
  dir = mkdtempSync(join(tmpdir(), 'talus-report-'));
});

function chartIds(html: string): string[] {
  return [...html.matchAll(/<svg class="chart[^"]*" data-chart="([^"]+)"/g)].map((m) => m[1] as string);
}

describe('buildReport', () => {
  it('draws every chart for full results, none of them empty', () => {
    const html = buildReport(loadReportData(writeSyntheticResults(dir)));
    expect(chartIds(html).sort()).toEqual([...EXPECTED_CHARTS].sort());
    expect(html).not.toContain('chart-empty');
  });

  it('is self-contained: no network URL, script, stylesheet link or external url()', () => {
    const html = buildReport(loadReportData(writeSyntheticResults(dir)));
    expect(html).not.toMatch(/https?:\/\//i);
    expect(html).not.toMatch(/<script/i);
    expect(html).not.toMatch(/<link/i);
    expect(html).not.toMatch(/\bsrc\s*=/i);
    expect(html).not.toMatch(/url\((?!#)/);
    expect(html).toMatch(/@media print/);
    expect(html).toContain("default-src 'none'");
  });

  it('lists flag codes with counts and ids, capped with "and N more"', () => {
    const html = buildReport(loadReportData(writeSyntheticResults(dir)));
    const row = /<tr><td><code>height_misfit<\/code>.*?<\/tr>/.exec(html)?.[0] ?? '';
    expect(row).toContain('<td class="num">40</td>');
    expect(row).toContain('S001, S002');
    expect(row).toContain('S030 and 10 more');
    expect(row).not.toContain('S031');
    expect(html).toContain('<code>tc_outlier</code>');
  });

  it('shows every delta_*_mgal column in the change table', () => {
    const html = buildReport(loadReportData(writeSyntheticResults(dir)));
    for (const part of ['dem', 'curvature', 'far_zone']) expect(html).toContain(`<tr><th scope="row">${part}</th>`);
  });

  it('shows the provenance from beside the CSV', () => {
    const html = buildReport(loadReportData(writeSyntheticResults(dir)));
    expect(html).toContain('talus reduce --stations invented.csv');
    expect(html).toContain('EPSG:32633');
    expect(html).toContain('Written by talus 0.1.0');
    // the tolerance recorded in the provenance is drawn on the misfit histogram
    expect(html).toContain('+5 m');
  });

  it('without legacy columns or provenance: sections listed as not shown, with the reason', () => {
    const p = writeSyntheticResults(dir, { name: 'plain.csv', legacy: false, provenance: false });
    const html = buildReport(loadReportData(p));
    expect(chartIds(html)).not.toContain('legacy-tc');
    expect(chartIds(html)).not.toContain('legacy-change');
    expect(html).toContain('not shown: the results have no legacy_tc_mgal column');
    expect(html).toContain('not shown: the results have no delta_*_mgal columns');
    expect(html).toContain('No provenance file');
  });

  it('without the unit-density columns: no estimates, a note naming the column, the per-density chart still drawn', () => {
    const csv = syntheticResultsCsv({ n: 30 }).replace(',bouguer_unit_mgal,', ',bouguer_unit_old,');
    const p = join(dir, 'nounit.csv');
    writeFileSync(p, csv);
    const html = buildReport(loadReportData(p));
    expect(chartIds(html)).not.toContain('parasnis');
    expect(chartIds(html)).not.toContain('nettleton');
    expect(chartIds(html)).toContain('cba-densities');
    expect(html).toMatch(/<li>density estimates need the unit-density columns: [^<]*bouguer_unit_mgal/);
  });

  it('without estimates or per-density columns the density section is listed as not shown, with the reason', () => {
    const header = syntheticResultsCsv({ n: 30 }).split('\n')[0] as string;
    const drop = new Set(['bouguer_unit_mgal', 'complete_bouguer_mgal_d2200', 'complete_bouguer_mgal_d2400'].map((c) => header.split(',').indexOf(c)));
    const csv = syntheticResultsCsv({ n: 30 })
      .split('\n')
      .map((line) => line.split(',').filter((_, i) => !drop.has(i)).join(','))
      .join('\n');
    const p = join(dir, 'nodensity.csv');
    writeFileSync(p, csv);
    expect(buildReport(loadReportData(p))).toMatch(/Density estimates — not shown: density estimates need the unit-density columns: [^<]*bouguer_unit_mgal/);
  });

  it('is deterministic: the same results give the same HTML byte for byte', () => {
    const p = writeSyntheticResults(dir, { name: 'twice.csv' });
    expect(buildReport(loadReportData(p))).toBe(buildReport(loadReportData(p)));
  });

  it('maps lon/lat stations with degree axes', () => {
    const html = buildReport(loadReportData(writeSyntheticResults(dir, { name: 'geo.csv', coords: 'lonlat' })));
    expect(html).toContain('Longitude (°E)');
    expect(html).toContain('Latitude (°N)');
  });

  it('escapes station ids and titles', () => {
    const csv = syntheticResultsCsv({ n: 30 }).replace('S002,', '<b>S2</b>,').replace('height_misfit;', 'height_misfit;');
    const p = join(dir, 'nasty.csv');
    writeFileSync(p, csv);
    const html = buildReport({ ...loadReportData(p), title: 'Run <one> & "two"' });
    expect(html).toContain('&lt;b&gt;S2&lt;/b&gt;');
    expect(html).not.toContain('<b>S2</b>');
    expect(html).toContain('<title>Run &lt;one&gt; &amp; &quot;two&quot;</title>');
  });

  it('takes an extended section list (the hook for further sections)', () => {
    const extra: ReportSection = { id: 'extra', title: 'Extra part', render: () => ({ html: '<p>extra body</p>' }) };
    const html = buildReport(loadReportData(writeSyntheticResults(dir)), [...REPORT_SECTIONS, extra]);
    expect(html).toContain('<section id="extra"><h2>Extra part</h2><p>extra body</p></section>');
    expect(html).toContain('<a href="#extra">Extra part</a>');
  });

  it('reads every station row, flags split on ";", empty cells as NaN', () => {
    const data = loadReportData(writeSyntheticResults(dir, { name: 'again.csv' }));
    expect(data.stations.ids.length).toBe(140);
    expect(data.stations.flags[5]).toEqual(['height_misfit', 'tc_outlier']);
    expect(data.stations.flags[139]).toEqual([]);
    expect(Number.isNaN(data.stations.columns.get('complete_bouguer_mgal')?.[139])).toBe(true);
  });
});
