/**
 * Formulas and equations as HTML: counts as <sub>, charges as <sup>, hydrate dots kept, arrows as the
 * usual signs (→, ⇌). Built with the escaping `html` template over the normalised display forms.
 */
import type { FormulaAnalysis } from '../chem/analyse';
import { cautionsFor } from '../chem/cautions';
import type { ParsedEquation, Species } from '../chem/equation';
import { isReversible } from '../chem/equation';
import { displayFormula } from '../chem/formula/compute';
import { energy, molarMassText, shortMethod } from './format';
import { escapeHtml, Html, html, join } from './html';
import type { ServiceSettings } from './settings';

export { escapeHtml };

const SUB = '₀₁₂₃₄₅₆₇₈₉';
const SUP: Record<string, string> = { '⁰': '0', '¹': '1', '²': '2', '³': '3', '⁴': '4', '⁵': '5', '⁶': '6', '⁷': '7', '⁸': '8', '⁹': '9', '⁺': '+', '⁻': '−' };

const isSub = (c: string | undefined) => c !== undefined && SUB.includes(c);

/**
 * HTML for a display form such as `CuSO₄·5H₂O`, `Fe₀.₉₅O` or `SO₄²⁻`: runs of subscript characters (with a
 * decimal point between subscript digits) become one <sub>, runs of superscripts one <sup>.
 */
export function typesetDisplay(display: string): Html {
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
  return new Html(out);
}

/** The tooltip of a typeset formula: the headline numbers of its card. */
export function formulaTitle(a: FormulaAnalysis, s: ServiceSettings): string {
  const bits = [`${a.display}: ${a.molarMass ? `${molarMassText(a.molarMass.value, s)} g/mol` : 'no molar mass'}`];
  if (a.charges && !a.charges.balanced) bits.push(`not charge-balanced: ${a.charges.message}`);
  if (a.bond) bits.push(`${a.bond.type}, ΔEN ${a.bond.deltaEN.toFixed(2)} (${a.bond.pair.join('–')})`);
  if (a.lattice)
    bits.push(
      `lattice energy ${a.lattice.estimate ? '≈ ' : ''}${energy(a.lattice.kJPerMol, s)} (${shortMethod(a.lattice.method)}${a.lattice.estimate ? ', estimate' : ''})`,
    );
  const c = cautionsFor(a);
  if (c.length) bits.push(`caution: ${c.map((x) => x.text).join('; ')}; follow the SDS`);
  return bits.join(' · ');
}

/** A typeset formula's inner HTML and escaped tooltip, memoised per analysis (and settings object). */
const spans = new WeakMap<FormulaAnalysis, { settings: ServiceSettings; title: string; html: string; byClass: Map<string, Html> }>();

/** A formula typeset in a span with its card's headline in the tooltip; `cls` adds classes (' iw-warning'). */
export function formulaSpan(a: FormulaAnalysis, s: ServiceSettings, cls = ''): Html {
  let hit = spans.get(a);
  if (!hit || hit.settings !== s)
    spans.set(a, (hit = { settings: s, title: escapeHtml(formulaTitle(a, s)), html: typesetDisplay(a.display).value, byClass: new Map() }));
  let span = hit.byClass.get(cls);
  if (!span) hit.byClass.set(cls, (span = new Html(`<span class="iw-formula${escapeHtml(cls)}" title="${hit.title}">${hit.html}</span>`)));
  return span;
}

/** One species of an equation, with a coefficient (1 and null are not written). */
function speciesHtml(s: Species, coefficient: number | string | null): Html {
  const coef = coefficient === null || coefficient === 1 || coefficient === '' ? '' : html`<span class="iw-coef">${String(coefficient)}</span> `;
  const body = s.isElectron ? html`e<sup>−</sup>` : s.formula ? typesetDisplay(displayFormula(s.formula)) : s.formulaText;
  return html`${coef}${body}`;
}

/**
 * An equation as HTML, with the given coefficients in order of appearance (reactants, then products), or
 * with the coefficients as written when none are given.
 */
export function typesetEquation(eq: ParsedEquation, coefficients?: readonly number[] | null): Html {
  // Memoised per equation for the form as written (the preview re-renders every equation on each change).
  if (!coefficients) {
    let hit = written.get(eq);
    if (!hit) written.set(eq, (hit = typesetUncached(eq)));
    return hit;
  }
  return typesetUncached(eq, coefficients);
}

const written = new WeakMap<ParsedEquation, Html>();

function typesetUncached(eq: ParsedEquation, coefficients?: readonly number[] | null): Html {
  const all = [...eq.reactants, ...eq.products];
  const coef = (s: Species) => (coefficients ? (coefficients[all.indexOf(s)] ?? null) : s.coefficientText || null);
  const side = (list: Species[]) =>
    join(
      list.map((s) => speciesHtml(s, coef(s))),
      ' + ',
    );
  const arrow = eq.arrow ? (isReversible(eq.arrow.arrow) ? '⇌' : '→') : '→';
  return html`${side(eq.reactants)} <span class="iw-arrow">${arrow}</span> ${side(eq.products)}`;
}
