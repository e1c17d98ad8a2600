/** A one-row legend drawn in the title band at the top right of a chart. */
import { esc, px } from '../escape.js';

export interface LegendItem {
  label: string;
  colour: string;
  /** 'point' draws a dot, 'line' a short stroke, 'dash' a dashed stroke. */
  kind: 'point' | 'line' | 'dash';
}

const CHAR_W = 6.2; // px per character at 11 px (estimate)

/** Estimated width of a legend row, px. */
export function legendWidth(items: readonly LegendItem[]): number {
  return items.reduce((w, it) => w + it.label.length * CHAR_W + 36, 0);
}

/** Title font: 13 px bold, about 7.4 px per character (estimate). */
const TITLE_CHAR_W = 7.4;

/** Whether the legend fits beside the title in a chart of `width` px, or needs its own row. */
export function legendNeedsOwnRow(title: string, items: readonly LegendItem[], width: number): boolean {
  return items.length > 0 && 70 + title.length * TITLE_CHAR_W + 24 + legendWidth(items) > width - 16;
}

/** Extra top margin for a legend on its own row, px. */
export const LEGEND_ROW_PX = 18;

export function legendRow(items: readonly LegendItem[], rightX: number, y: number): string {
  let x = rightX;
  const parts: string[] = [];
  for (let i = items.length - 1; i >= 0; i--) {
    const it = items[i] as LegendItem;
    const textW = it.label.length * CHAR_W;
    x -= textW;
    parts.push(`<text x="${px(x)}" y="${y + 4}">${esc(it.label)}</text>`);
    x -= 22;
    if (it.kind === 'point') parts.push(`<circle cx="${px(x + 9)}" cy="${y}" r="4" fill="${esc(it.colour)}"/>`);
    else
      parts.push(
        `<line x1="${px(x)}" x2="${px(x + 18)}" y1="${y}" y2="${y}" stroke="${esc(it.colour)}" stroke-width="2"${it.kind === 'dash' ? ' stroke-dasharray="5 3"' : ''}/>`,
      );
    x -= 14;
  }
  return `<g class="legend">${parts.join('')}</g>`;
}

/** Colours for up to 8 categorical series (Okabe–Ito palette, distinguishable with colour-vision deficiencies). */
export const SERIES_COLOURS: readonly string[] = ['#0072b2', '#e69f00', '#009e73', '#cc79a7', '#56b4e9', '#d55e00', '#f0e442', '#000000'];

export function seriesColour(i: number): string {
  return SERIES_COLOURS[i % SERIES_COLOURS.length] as string;
}
