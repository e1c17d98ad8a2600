/** Legacy against new terrain correction, with the 1:1 line. */
import { scatterChart } from '../charts/scatter-chart.js';
import { fmt } from '../escape.js';
import { column } from '../report-data.js';
import { figure } from '../section-types.js';
import type { ReportSection, SectionResult } from '../section-types.js';
import { summarize } from '../summary-stats.js';

export const legacySection: ReportSection = {
  id: 'legacy',
  title: 'Legacy versus new terrain correction',
  render: (data): SectionResult => {
    const legacy = column(data, 'legacy_tc_mgal');
    const tc = column(data, 'terrain_corr_mgal');
    if (!legacy) return { omitted: 'the results have no legacy_tc_mgal column' };
    if (!tc) return { omitted: 'the results have no terrain_corr_mgal values' };
    const diff = tc.map((v, i) => v - (legacy[i] as number));
    const s = summarize(diff);
    const svg = scatterChart({
      id: 'legacy-tc',
      title: 'Legacy versus new terrain correction',
      xLabel: 'Legacy terrain correction (mGal)',
      yLabel: 'New terrain correction (mGal)',
      series: [{ label: 'stations', x: legacy, y: tc }],
      identity: true,
    });
    return { html: figure(svg, `New − legacy over ${s.n} stations: mean ${fmt(s.mean)} mGal, sd ${fmt(s.sd)} mGal, range ${fmt(s.min)} to ${fmt(s.max)} mGal.`) };
  },
};
