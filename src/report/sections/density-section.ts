/** Density estimates: the Nettleton correlation curve and the Parasnis scatter with its fitted line. */
import { esc, fmt } from '../escape.js';
import { lineChart } from '../charts/line-chart.js';
import { scatterChart } from '../charts/scatter-chart.js';
import { column } from '../report-data.js';
import type { ReportData } from '../report-data.js';
import { figure } from '../section-types.js';
import type { ReportSection, SectionResult } from '../section-types.js';

export const densitySection: ReportSection = {
  id: 'density',
  title: 'Density estimates',
  render: (data): SectionResult => {
    const d = data.density;
    const byDensity = densityAnomalies(data);
    if (!d || (!d.nettleton && !d.parasnis)) {
      if (byDensity) return { html: notesList(d?.notes ?? []) + byDensity };
      return { omitted: d && d.notes.length > 0 ? d.notes.join('; ') : 'no density estimate was computed' };
    }
    const parts: string[] = [];
    const rows: string[] = [];
    if (d.nettleton) {
      const n = d.nettleton;
      parts.push(
        figure(
          lineChart({
            id: 'nettleton',
            title: 'Nettleton: correlation of CBA with height',
            xLabel: 'Bouguer density (kg/m³)',
            yLabel: 'Correlation coefficient (dimensionless)',
            series: [{ label: `${n.n} stations`, points: n.curve }],
            markers: [{ x: n.densityKgM3, label: `${fmt(n.densityKgM3, 0)} kg/m³` }],
          }),
          'The estimate is the density whose anomaly correlates least with station height.',
        ),
      );
      rows.push(`<tr><th scope="row">Nettleton</th><td>${fmt(n.densityKgM3, 0)}</td><td>${fmt(n.stderrKgM3, 0)}</td><td>${n.n}</td><td>|r| = ${fmt(n.minAbsCorr, 3)}</td></tr>`);
    }
    if (d.parasnis) {
      const p = d.parasnis;
      parts.push(
        figure(
          scatterChart({
            id: 'parasnis',
            title: 'Parasnis: fitted density',
            xLabel: p.xLabel,
            yLabel: p.yLabel,
            series: [{ label: 'stations', x: p.points.map((q) => q.x), y: p.points.map((q) => q.y) }],
            line: { slope: p.slope, intercept: p.interceptMgal, label: `fit: ${fmt(p.densityKgM3, 0)} kg/m³` },
          }),
          `Slope of the line is the density; intercept ${fmt(p.interceptMgal)} mGal, r² = ${fmt(p.r2, 3)}, ${p.downweighted} stations down-weighted.`,
        ),
      );
      rows.push(`<tr><th scope="row">Parasnis</th><td>${fmt(p.densityKgM3, 0)}</td><td>${fmt(p.stderrKgM3, 0)}</td><td>${p.n}</td><td>r² = ${fmt(p.r2, 3)}</td></tr>`);
    }
    const table = `<table class="stats"><caption>Estimates</caption><thead><tr><th>Method</th><th>density (kg/m³)</th><th>std. error (kg/m³)</th><th>n</th><th>fit</th></tr></thead><tbody>${rows.join('')}</tbody></table>`;
    return { html: table + notesList(d.notes) + parts.join('') + (byDensity ?? '') };
  },
};

function notesList(notes: readonly string[]): string {
  return notes.length > 0 ? `<ul class="notes">${notes.map((n) => `<li>${esc(n)}</li>`).join('')}</ul>` : '';
}

const EXTRA_DENSITY = /^complete_bouguer_mgal_d(\d+(?:\.\d+)?)$/;

/** CBA at each density the run wrote (complete_bouguer_mgal_d<density>) against height, or undefined. */
function densityAnomalies(data: ReportData): string | undefined {
  const h = column(data, 'height_m');
  if (!h) return undefined;
  const series = [...data.stations.columns.keys()]
    .map((name) => ({ name, m: EXTRA_DENSITY.exec(name) }))
    .filter((e): e is { name: string; m: RegExpExecArray } => e.m !== null)
    .map((e) => ({ density: Number(e.m[1]), values: column(data, e.name) }))
    .filter((e): e is { density: number; values: Float64Array } => e.values !== undefined)
    .sort((a, b) => a.density - b.density);
  if (series.length === 0) return undefined;
  const main = column(data, 'complete_bouguer_mgal');
  const mainDensity = data.provenance?.parameters;
  const rho = typeof mainDensity === 'object' && mainDensity !== null ? (mainDensity as Record<string, unknown>).densityKgM3 : undefined;
  const all = [
    ...series.map((s) => ({ label: `${s.density} kg/m³`, x: h, y: s.values })),
    ...(main ? [{ label: typeof rho === 'number' ? `${rho} kg/m³ (main)` : 'main density', x: h, y: main }] : []),
  ];
  return figure(
    scatterChart({ id: 'cba-densities', title: 'CBA against height at each density of the run', xLabel: 'Station height (m)', yLabel: 'Complete Bouguer anomaly (mGal)', series: all }),
    'At the right density the anomaly shows no trend with height; too low a density leaves a positive trend, too high a negative one.',
  );
}
