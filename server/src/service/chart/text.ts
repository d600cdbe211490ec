/** Numbers and text as the svg writes them. */

/** A coordinate or size for the svg: rounded to 2 decimals, no "-0", no exponent for the sizes a chart has. */
export function coord(value: number): string {
  if (!Number.isFinite(value)) return '0';
  const rounded = Math.round(value * 100) / 100;
  return rounded === 0 ? '0' : String(rounded);
}

/** Text for XML: characters XML 1.0 forbids (controls, lone surrogates) removed, the five specials escaped. */
export function escapeXml(text: string): string {
  return text
    .replace(/[\u0000-\u0008\u000B\u000C\u000E-\u001F\uFFFE\uFFFF]/g, '')
    .replace(/[\uD800-\uDBFF](?![\uDC00-\uDFFF])|(?<![\uD800-\uDBFF])[\uDC00-\uDFFF]/g, '')
    .replace(/&/g, '&amp;')
    .replace(/</g, '&lt;')
    .replace(/>/g, '&gt;')
    .replace(/"/g, '&quot;')
    .replace(/'/g, '&apos;');
}

/** Whatever slipped past the types, as a string ('' for null and undefined). */
export const asText = (value: unknown): string => (typeof value === 'string' ? value : value === null || value === undefined ? '' : String(value));

/** Whitespace collapsed: a label is one line. */
export const oneLine = (text: string): string => text.replace(/\s+/g, ' ').trim();

/** At most `max` code points, the last one an ellipsis when cut. */
export function shorten(text: string, max: number): string {
  const codePoints = Array.from(text);
  return codePoints.length <= max ? text : codePoints.slice(0, max - 1).join('') + '…';
}

/**
 * Rough advance width of a string in a sans-serif face, in px: no font metrics at hand, so a per-class guess
 * erring wide (the wider common system faces), which errs towards more room between labels.
 */
export function textWidth(text: string, fontSize: number): number {
  let em = 0;
  for (const ch of text) {
    if (/[ijlI1.,;:|!'\s]/.test(ch)) em += 0.32;
    else if (/[()[\]]/.test(ch)) em += 0.4;
    else if (/[mwMW]/.test(ch)) em += 0.9;
    else if (/[A-Z]/.test(ch)) em += 0.72;
    else if (/[0-9]/.test(ch)) em += 0.62;
    else if (/[a-z]/.test(ch)) em += 0.58;
    else if (/[\u2080-\u209F\u2070-\u207F\u00B2\u00B3\u00B9]/.test(ch)) em += 0.4;
    else em += 0.62;
  }
  return em * fontSize;
}

/** An energy the way the tooltip and <desc> say it: whole kJ/mol from 100 up, else 3 significant figures. */
export function energyText(value: number): string {
  return Math.abs(value) >= 100 ? String(Math.round(value)) : String(Number(value.toPrecision(3)));
}

/** A tick value with a fixed number of decimals and a true minus sign (never "−0"). */
export function tickText(value: number, decimals: number): string {
  const fixed = value.toFixed(decimals);
  return (/^-0(\.0*)?$/.test(fixed) ? fixed.slice(1) : fixed).replace(/^-/, '−');
}

/** "1 salt", "2 salts". */
export const count = (n: number, one: string, many = `${one}s`): string => `${n} ${n === 1 ? one : many}`;

/** FNV-1a, for ids that are unique per chart content yet deterministic. */
export function fnv1a(text: string): string {
  let h = 0x811c9dc5;
  for (let i = 0; i < text.length; i++) {
    h ^= text.charCodeAt(i);
    h = Math.imul(h, 0x01000193);
  }
  return (h >>> 0).toString(36);
}
