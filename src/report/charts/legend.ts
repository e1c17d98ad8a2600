/** A one-row legend drawn in the title band at the top right of a chart. */
import { esc, px } from '../escape.js';

export interface LegendItem {
  label: string;
  colour: string;
  /** 'point' draws a dot, 'line' a short stroke, 'dash' a dashed stroke. */
  kind: 'point' | 'line' | 'dash';
}

const CHAR_W = 6.2; // px per character at 11 px (estimate)

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
