/**
 * HTML that escapes itself: the `html` tagged template escapes every interpolated value unless it is
 * already `Html` (the result of `html` itself, or text explicitly marked safe with `trusted`). Arrays are
 * joined, `null`, `undefined` and `false` write nothing. Every page and fragment the preview and the
 * report build goes through it, so text from the notes (formulas, batch names, messages) cannot become
 * markup: nothing is escaped by hand.
 *
 * Escaping covers content and double- or single-quoted attribute values (`& < > " '`).
 */

const ESCAPES: Record<string, string> = { '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' };
const SPECIAL = /[&<>"']/;

/** Escape text for HTML content and quoted attributes (the one HTML escaper). */
export function escapeHtml(t: string): string {
  return SPECIAL.test(t) ? t.replace(/[&<>"']/g, (c) => ESCAPES[c]) : t;
}

/** A piece of HTML that is safe to write as it is. */
export class Html {
  // Declared, then assigned: no defineProperty per instance (millions are made in a large preview).
  declare readonly value: string;
  constructor(value: string) {
    (this as { value: string }).value = value;
  }
  toString(): string {
    return this.value;
  }
}

/** What may be interpolated: text (escaped), numbers, HTML, lists of these, or nothing. */
export type HtmlValue = Html | string | number | null | undefined | false | readonly HtmlValue[];

function piece(v: HtmlValue): string {
  if (v instanceof Html) return v.value;
  if (v === null || v === undefined || v === false) return '';
  if (typeof v === 'string') return escapeHtml(v);
  if (typeof v === 'number') return String(v);
  let out = '';
  for (const x of v) out += piece(x);
  return out;
}

/** The tagged template: html`<td class="iw-n">${value}</td>`. */
export function html(strings: TemplateStringsArray, ...values: HtmlValue[]): Html {
  let out = strings[0];
  for (let i = 0; i < values.length; i++) out += piece(values[i]) + strings[i + 1];
  return new Html(out);
}

/**
 * Mark text as HTML that needs no escaping. Only for markup this program built itself (a rendered
 * Markdown page from markdown-it, the chart's SVG, a style sheet): never for text from the notes.
 */
export const trusted = (markup: string) => new Html(markup);

/** Join pieces of HTML with a separator (itself escaped when it is text). */
export function join(list: readonly HtmlValue[], sep: HtmlValue = ''): Html {
  const s = piece(sep);
  return new Html(list.map(piece).join(s));
}

/** Text or HTML as an HTML string (for hosts that take strings: markdown-it's renderer rules). */
export const toHtml = (v: HtmlValue) => piece(v);
