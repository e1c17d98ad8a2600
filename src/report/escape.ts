/** Text escaping and number formatting for HTML and SVG output. */

const ENTITIES: Record<string, string> = {
  '&': '&amp;',
  '<': '&lt;',
  '>': '&gt;',
  '"': '&quot;',
  "'": '&#39;',
};

/** Escapes text for use in HTML/SVG element content and in double- or single-quoted attributes. */
export function esc(text: string | number): string {
  return String(text).replace(/[&<>"']/g, (c) => ENTITIES[c] ?? c);
}

/**
 * A number for display: `digits` significant decimals after the point, trailing zeros kept
 * so a column lines up; '–' for NaN/absent. Negative zero prints as 0.
 */
export function fmt(value: number | undefined, digits = 2): string {
  if (value === undefined || !Number.isFinite(value)) return '–';
  const s = value.toFixed(digits);
  return /^-0(\.0*)?$/.test(s) ? s.slice(1) : s;
}

/** A coordinate for SVG attributes: at most 2 decimals, no exponent. */
export function px(value: number): string {
  return Number.isFinite(value) ? String(Math.round(value * 100) / 100) : '0';
}

/** Tick label: as few decimals as the tick step needs (step 0.25 → 2 decimals, 20 → 0). */
export function tickLabel(value: number, step: number): string {
  const decimals = Math.max(0, Math.min(10, -Math.floor(Math.log10(step) + 1e-9)));
  const needsMore = Math.abs(step * 10 ** decimals - Math.round(step * 10 ** decimals)) > 1e-6;
  const s = value.toFixed(needsMore ? decimals + 1 : decimals);
  return /^-0(\.0*)?$/.test(s) ? s.slice(1) : s.replace('-', '−');
}
