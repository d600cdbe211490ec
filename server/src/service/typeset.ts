/**
 * Formulas and equations as HTML: counts as <sub>, charges as <sup>, hydrate dots kept, arrows as the
 * usual signs. Pure string work over the normalised display forms; every piece of text is escaped.
 */
import type { ParsedEquation, Species } from '../chem/equation';
import { isReversible } from '../chem/equation';
import { displayFormula } from '../chem/formula/compute';

const ESCAPES: Record<string, string> = { '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' };

/** Escape text for HTML content and double- or single-quoted attributes. */
export const escapeHtml = (t: string) => t.replace(/[&<>"']/g, (c) => ESCAPES[c]);

const SUB = '₀₁₂₃₄₅₆₇₈₉';
const SUP: Record<string, string> = { '⁰': '0', '¹': '1', '²': '2', '³': '3', '⁴': '4', '⁵': '5', '⁶': '6', '⁷': '7', '⁸': '8', '⁹': '9', '⁺': '+', '⁻': '−' };

const isSub = (c: string | undefined) => c !== undefined && SUB.includes(c);

/**
 * HTML for a display form such as `CuSO₄·5H₂O`, `Fe₀.₉₅O` or `SO₄²⁻`: runs of subscript characters (with a
 * decimal point between subscript digits) become one <sub>, runs of superscripts one <sup>.
 */
export function typesetDisplay(display: string): string {
  let out = '';
  let i = 0;
  const chars = [...display];
  while (i < chars.length) {
    const c = chars[i];
    if (isSub(c)) {
      let run = '';
      while (i < chars.length && (isSub(chars[i]) || (chars[i] === '.' && isSub(chars[i - 1]) && isSub(chars[i + 1])))) {
        run += chars[i] === '.' ? '.' : String(SUB.indexOf(chars[i]));
        i++;
      }
      out += `<sub>${run}</sub>`;
    } else if (c in SUP) {
      let run = '';
      while (i < chars.length && chars[i] in SUP) run += SUP[chars[i++]];
      out += `<sup>${run}</sup>`;
    } else if (c === '·') {
      out += '<span class="iw-dot">·</span>';
      i++;
    } else {
      out += escapeHtml(c);
      i++;
    }
  }
  return out;
}

/** One species of an equation, with a coefficient (1 and null are not written). */
function speciesHtml(s: Species, coefficient: number | string | null): string {
  const coef = coefficient === null || coefficient === 1 || coefficient === '' ? '' : `<span class="iw-coef">${escapeHtml(String(coefficient))}</span> `;
  const body = s.isElectron ? 'e<sup>−</sup>' : s.formula ? typesetDisplay(displayFormula(s.formula)) : escapeHtml(s.formulaText);
  return coef + body;
}

/**
 * An equation as HTML, with the given coefficients in order of appearance (reactants, then products), or
 * with the coefficients as written when none are given.
 */
export function typesetEquation(eq: ParsedEquation, coefficients?: readonly number[] | null): string {
  const all = [...eq.reactants, ...eq.products];
  const coef = (s: Species) => (coefficients ? coefficients[all.indexOf(s)] ?? null : s.coefficientText || null);
  const side = (list: Species[]) => list.map((s) => speciesHtml(s, coef(s))).join(' + ');
  const arrow = eq.arrow ? (isReversible(eq.arrow.arrow) ? '⇌' : '→') : '→';
  return `${side(eq.reactants)} <span class="iw-arrow">${arrow}</span> ${side(eq.products)}`;
}
