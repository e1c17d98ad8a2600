/** Assembles the self-contained HTML report: inline CSS and SVG, no scripts, no external resources. */
import { esc } from './escape.js';
import type { ReportData } from './report-data.js';
import { REPORT_SECTIONS } from './report-sections.js';
import { REPORT_CSS } from './report-style.js';
import type { ReportSection } from './section-types.js';

export function buildReport(data: ReportData, sections: readonly ReportSection[] = REPORT_SECTIONS): string {
  const drawn: string[] = [];
  const toc: string[] = [];
  for (const s of sections) {
    const r = s.render(data);
    if ('html' in r) {
      drawn.push(`<section id="${esc(s.id)}"><h2>${esc(s.title)}</h2>${r.html}</section>`);
      toc.push(`<li><a href="#${esc(s.id)}">${esc(s.title)}</a></li>`);
    } else {
      toc.push(`<li class="omitted">${esc(s.title)} — not shown: ${esc(r.omitted)}</li>`);
    }
  }
  return [
    '<!DOCTYPE html>',
    '<html lang="en"><head><meta charset="utf-8">',
    '<meta name="viewport" content="width=device-width, initial-scale=1">',
    // no network: forbid every external fetch, allow inline styles and data: images only
    `<meta http-equiv="Content-Security-Policy" content="default-src 'none'; style-src 'unsafe-inline'; img-src data:">`,
    `<title>${esc(data.title)}</title>`,
    `<style>${REPORT_CSS}</style></head><body>`,
    `<header><h1>${esc(data.title)}</h1><p>Results: <code>${esc(data.resultsPath)}</code> · ${data.stations.ids.length} stations</p>`,
    `<nav aria-label="Contents"><ol>${toc.join('')}</ol></nav></header>`,
    `<main>${drawn.join('\n')}</main>`,
    `<footer>${esc(data.generator ?? 'Written by talus')}</footer>`,
    '</body></html>',
    '',
  ].join('\n');
}
