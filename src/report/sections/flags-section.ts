/** Flag table: each code with its count and the ids of the stations that carry it (capped). */
import { esc } from '../escape.js';
import type { ReportData } from '../report-data.js';
import type { ReportSection, SectionResult } from '../section-types.js';
import { QC_FLAGS } from '../../qc/flag-codes.js';

/** Station ids listed per flag code before "and N more". */
export const MAX_IDS_PER_FLAG = 30;

/** Meaning of each flag code (the table in src/qc/flag-codes.ts, also the README's). */
export const FLAG_MEANINGS: Readonly<Record<string, string>> = Object.fromEntries(QC_FLAGS.map((f) => [f.code, f.meaning]));

/** code → ids in station order. */
export function flagIndex(data: ReportData): Map<string, string[]> {
  const idx = new Map<string, string[]>();
  data.stations.flags.forEach((codes, i) => {
    for (const code of codes) {
      const list = idx.get(code) ?? [];
      list.push(data.stations.ids[i] ?? `#${i + 1}`);
      idx.set(code, list);
    }
  });
  return idx;
}

export const flagsSection: ReportSection = {
  id: 'flags',
  title: 'Flagged stations',
  render: (data): SectionResult => {
    const idx = flagIndex(data);
    if (idx.size === 0) return { html: '<p>No station carries a flag.</p>' };
    const rows = [...idx.entries()]
      .sort((a, b) => b[1].length - a[1].length || a[0].localeCompare(b[0]))
      .map(([code, ids]) => {
        const shown = ids.slice(0, MAX_IDS_PER_FLAG).map(esc).join(', ');
        const more = ids.length > MAX_IDS_PER_FLAG ? ` and ${ids.length - MAX_IDS_PER_FLAG} more` : '';
        return `<tr><td><code>${esc(code)}</code></td><td>${esc(FLAG_MEANINGS[code] ?? '')}</td><td class="num">${ids.length}</td><td class="ids">${shown}${more}</td></tr>`;
      })
      .join('');
    return { html: `<table class="flags"><thead><tr><th>Flag</th><th>Meaning</th><th>Stations</th><th>Station ids</th></tr></thead><tbody>${rows}</tbody></table>` };
  },
};
