/** Terrain correction against station height: large corrections belong in rough, high ground. */
import { scatterChart } from '../charts/scatter-chart.js';
import { column } from '../report-data.js';
import { figure } from '../section-types.js';
import type { ReportSection, SectionResult } from '../section-types.js';

export const terrainHeightSection: ReportSection = {
  id: 'tc-height',
  title: 'Terrain correction versus height',
  render: (data): SectionResult => {
    const tc = column(data, 'terrain_corr_mgal');
    const h = column(data, 'height_m');
    if (!tc || !h) return { omitted: `the results have no ${!tc ? 'terrain_corr_mgal' : 'height_m'} values` };
    const svg = scatterChart({
      id: 'tc-height',
      title: 'Terrain correction versus station height',
      xLabel: 'Station height (m)',
      yLabel: 'Terrain correction (mGal)',
      series: [{ label: 'stations', x: h, y: tc }],
    });
    return { html: figure(svg, 'One point per station with both values.') };
  },
};
