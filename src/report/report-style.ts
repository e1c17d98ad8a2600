/** The report's inline stylesheet: system fonts only, printable, one section per printed page. */
export const REPORT_CSS = `
:root { color-scheme: light; }
* { box-sizing: border-box; }
body { font-family: system-ui, -apple-system, "Segoe UI", Roboto, "DejaVu Sans", sans-serif; margin: 0; color: #1b1b1b; background: #fafafa; line-height: 1.45; }
header, main, footer { max-width: 1040px; margin: 0 auto; padding: 0 20px; }
header { padding-top: 18px; }
h1 { font-size: 1.6rem; margin: 0.4em 0 0.2em; }
h2 { font-size: 1.25rem; border-bottom: 2px solid #31688e; padding-bottom: 4px; margin-top: 0; }
h3 { font-size: 1.05rem; }
section { background: #fff; border: 1px solid #ddd; border-radius: 6px; padding: 16px 20px; margin: 18px 0; }
nav ol { columns: 2; margin: 0.4em 0; }
nav .omitted { color: #666; }
table { border-collapse: collapse; margin: 10px 0 14px; font-size: 0.9rem; }
caption { text-align: left; font-weight: 600; padding-bottom: 4px; }
th, td { border: 1px solid #d6d6d6; padding: 3px 8px; text-align: left; vertical-align: top; }
thead th { background: #eef2f6; }
table.stats td, td.num { text-align: right; font-variant-numeric: tabular-nums; }
td.ids { max-width: 560px; word-break: break-word; }
td.hash { font-family: ui-monospace, "DejaVu Sans Mono", monospace; font-size: 0.75rem; word-break: break-all; }
figure { margin: 12px 0 18px; }
figcaption { font-size: 0.85rem; color: #444; max-width: 640px; }
svg.chart { display: block; max-width: 100%; height: auto; font-size: 11px; font-family: inherit; }
svg.chart .chart-title { font-size: 13px; font-weight: 600; }
svg.chart .axis-label { font-size: 12px; }
svg.chart .plot-bg { fill: #fff; }
svg.chart .plot-border { fill: none; stroke: #555; stroke-width: 1; }
svg.chart .grid line { stroke: #e6e6e6; stroke-width: 1; }
svg.chart .axis line { stroke: #555; }
svg.chart text { fill: #222; }
svg.chart .note { fill: #666; font-style: italic; }
svg.chart .marker-label { font-size: 11px; }
.note { color: #555; font-style: italic; }
ul.notes { color: #444; }
footer { color: #666; font-size: 0.8rem; padding-bottom: 24px; }
@media print {
  body { background: #fff; }
  header, main, footer { max-width: none; padding: 0; }
  nav { display: none; }
  section { border: none; padding: 0; margin: 0; break-before: page; page-break-before: always; }
  section:first-of-type { break-before: auto; page-break-before: auto; }
  figure, table { break-inside: avoid; page-break-inside: avoid; }
}
`;
