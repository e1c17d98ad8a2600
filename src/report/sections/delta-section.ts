/**
 * Legacy change explanation: every results column named delta_<part>_mgal is one part of the
 * change from the legacy values; a table of their statistics and a box/strip chart of each.
 */
import { boxStripChart } from '../charts/box-strip-chart.js';
import { esc, fmt } from '../escape.js';
import { column } from '../report-data.js';
import type { ReportData } from '../report-data.js';
import { figure } from '../section-types.js';
import type { ReportSection, SectionResult } from '../section-types.js';
import { summarize } from '../summary-stats.js';

const DELTA_PATTERN = /^delta_(.+)_mgal$/;

/** The delta_*_mgal columns with values, in results-column order. */
export function deltaColumns(data: ReportData): { name: string; part: string; values: Float64Array }[] {
  const out: { name: string; part: string; values: Float64Array }[] = [];
  for (const name of data.stations.columns.keys()) {
    const m = DELTA_PATTERN.exec(name);
    const values = column(data, name);
    if (m && values) out.push({ name, part: m[1] as string, values });
  }
  return out;
}

/** Axis label of a part: short enough that neighbouring labels do not touch. */
function shortLabel(part: string): string {
  const known: Record<string, string> = { legacy_residual: 'residual', terrain_outside_range: 'beyond range', free_air: 'free-air' };
  return known[part] ?? part.replace(/_/g, ' ');
}

export const deltaSection: ReportSection = {
  id: 'legacy-change',
  title: 'Legacy change explanation',
  render: (data): SectionResult => {
    const deltas = deltaColumns(data);
    if (deltas.length === 0) return { omitted: 'the results have no delta_*_mgal columns' };
    const rows = deltas
      .map((d) => {
        const s = summarize(d.values);
        return `<tr><th scope="row">${esc(d.part)}</th><td>${s.n}</td><td>${fmt(s.mean)}</td><td>${fmt(s.sd)}</td><td>${fmt(s.min)}</td><td>${fmt(s.max)}</td></tr>`;
      })
      .join('');
    const table = `<table class="stats"><caption>Parts of the change (mGal; column delta_&lt;part&gt;_mgal)</caption><thead><tr><th>Part</th><th>n</th><th>mean</th><th>sd</th><th>min</th><th>max</th></tr></thead><tbody>${rows}</tbody></table>`;
    const svg = boxStripChart({
      id: 'legacy-change',
      title: 'Distribution of each part of the change',
      xLabel: 'Part of the change (column delta_<part>_mgal)',
      yLabel: 'Change (mGal)',
      groups: deltas.map((d) => ({ label: shortLabel(d.part), values: d.values })),
    });
    return { html: table + figure(svg, 'Boxes: quartiles and median; whiskers: 1.5 × interquartile range; dots: stations.') };
  },
};
