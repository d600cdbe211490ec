/**
 * How Ionwright writes numbers, charges, units and formulas for people, in every output: hovers, tables,
 * the preview, the report, the card text. One place, so that a figure reads the same everywhere.
 *
 * - Numbers: significant figures for what is weighed and poured, decimals from the settings for molar
 *   masses, digits grouped by thousands with a narrow no-break space from 10 000 up (SI style: four-digit
 *   numbers stay whole), powers of ten as `1.2×10⁻⁵`.
 * - Signs: one minus sign, U+2212, in numbers, charges and oxidation states; the hyphen only where the
 *   text is meant to be typed back (the ASCII forms of formulas in edits).
 * - Formulas: the Unicode display form (`SO₄²⁻`, `CuSO₄·5H₂O`); equations with `→` and `⇌`.
 */
import { cleanCount, formatCharge, MINUS, signed, subscriptDigits } from '../chem/formula/compute';
import { parseFormula } from '../chem/formula/parse';
import { displayFormula } from '../chem/formula/compute';
import type { ServiceSettings } from './settings';

export { MINUS, signed };

/** What a missing number is written as. */
export const DASH = '—';
/** Narrow no-break space: between groups of thousands. */
export const THIN = '\u202f';

const SUP: Record<string, string> = { '0': '⁰', '1': '¹', '2': '²', '3': '³', '4': '⁴', '5': '⁵', '6': '⁶', '7': '⁷', '8': '⁸', '9': '⁹', '-': '⁻', '+': '' };

/** Group the integer part of a plain decimal string by thousands (10 000 and up). */
function group(t: string): string {
  const m = /^(\d+)(\.\d+)?$/.exec(t);
  if (!m || m[1].length < 5) return t;
  return m[1].replace(/\B(?=(\d{3})+(?!\d))/g, THIN) + (m[2] ?? '');
}

/** A number with the true minus sign and grouped thousands, from its plain digits. */
function written(x: number, digits: string): string {
  return (x < 0 && /[1-9]/.test(digits) ? MINUS : '') + group(digits);
}

/**
 * Significant figures without exponent noise, for the quantities a chemist weighs: 2.922, 0.05, 12 500,
 * 1.235×10⁻⁵ (below 10⁻⁴ and from 10⁶ up). A dash for a missing number.
 */
export function sig(x: number | null | undefined, digits = 4): string {
  if (x === null || x === undefined || !Number.isFinite(x)) return DASH;
  if (x === 0) return '0';
  const abs = Math.abs(x);
  if (abs >= 1e6 || abs < 1e-4) {
    const [mantissa, exp] = abs.toExponential(digits - 1).split('e');
    return `${x < 0 ? MINUS : ''}${mantissa}×10${[...exp].map((c) => SUP[c] ?? c).join('')}`;
  }
  return written(x, String(Number(abs.toPrecision(digits))));
}

/** Fixed decimals (molar masses: the `decimalPlaces` setting). */
export function fixed(x: number | null | undefined, decimals: number): string {
  if (x === null || x === undefined || !Number.isFinite(x)) return DASH;
  return written(x, Math.abs(x).toFixed(decimals));
}

/** A molar mass in the settings' decimals, without its unit. */
export const molarMassText = (x: number | null | undefined, s: Pick<ServiceSettings, 'decimals'>) => fixed(x, s.decimals);

/** A fraction 0–1 as a percentage (`80.0 %`), or a dash. */
export function percent(x: number | null | undefined, places = 1): string {
  if (x === null || x === undefined || !Number.isFinite(x)) return DASH;
  return `${fixed(x * 100, places)} %`;
}

/** A number and its unit, with the space SI asks for (`2.922 g`, `0.1 M`, `240 g/L`). */
export const quantity = (x: number | null | undefined, unit: string, digits = 4) => `${sig(x, digits)} ${unit}`;

/** A mass in grams in the unit a balance shows it in: `240 g`, `2 mg`, `15 µg` (below 1 g in mg, below 1 mg in µg). */
export function massText(g: number | null | undefined, digits = 4): string {
  if (g === null || g === undefined || !Number.isFinite(g)) return DASH;
  const a = Math.abs(g);
  if (a === 0 || a >= 1) return `${sig(g, digits)} g`;
  return a >= 1e-3 ? `${sig(g * 1e3, digits)} mg` : `${sig(g * 1e6, digits)} µg`;
}

/** A mass concentration in g/L, or in mg/L below 1 g/L (`240 g/L`, `1.25 mg/L`). */
export function perLitreText(gPerL: number, digits = 3): string {
  return Math.abs(gPerL) >= 1 || gPerL === 0 ? `${sig(gPerL, digits)} g/L` : `${sig(gPerL * 1e3, digits)} mg/L`;
}

/** A volume in litres, written in mL (the unit batch notes use): `500 mL`, `2000 mL`. */
/** A volume as a chemist writes it: litres from 1 L up, millilitres below (`2 L`, `500 mL`, `2.5 mL`). */
/** A volume to pour, mL (µL below 0.1 mL, L from 10 L). */
export function mlText(mL: number): string {
  if (mL >= 10_000) return `${sig(mL / 1000)} L`;
  if (mL < 0.1) return `${sig(mL * 1000)} µL`;
  return `${sig(mL)} mL`;
}

export const volumeText = (litres: number) => (litres >= 1 ? `${sig(litres)} L` : `${sig(litres * 1000)} mL`);

const KCAL = 4.184;

/** A lattice energy in the settings' unit, to the whole number (`787 kJ/mol`, `188 kcal/mol`). */
export function energy(kJ: number, s: Pick<ServiceSettings, 'energyUnit'>): string {
  return s.energyUnit === 'kcal/mol' ? `${fixed(Math.round(kJ / KCAL), 0)} kcal/mol` : `${fixed(Math.round(kJ), 0)} kJ/mol`;
}

/** An ion's charge as a number: +1, −1, +2 (the ion table's column). */
export const chargeNumber = (q: number) => signed(q);

/** A charge as a superscript: `²⁻`, `⁺` (empty for 0). */
export const chargeSuperscript = (q: number) => formatCharge(q, true);

/** A charge in words for a formula's head: `charge −2`, `charge +1`. */
export const chargeWords = (q: number) => `charge ${signed(q)}`;

/** Oxidation states as `Fe +3, O −2`. */
export function oxidationText(states: Record<string, number>): string {
  return Object.entries(states)
    .map(([el, v]) => `${el} ${signed(v)}`)
    .join(', ');
}

/** A count in a formula or an equation: whole numbers as they are, decimals without noise. */
export const countText = (n: number) => String(cleanCount(n));

/**
 * The Unicode display of a formula given as text in any notation (`SO4^2-`, `CuSO4*5H2O`, `Ca(NO3)2`):
 * read and written in the display form where it reads, else with its digits as subscripts.
 */
export function formulaText(text: string): string {
  const p = parseFormula(text);
  if (p.ok && p.formula) return displayFormula(p.formula, true);
  return subscriptDigits(text);
}

/** A lattice-energy method without its kind: 'Kapustinskii', 'Born–Haber'. */
export const shortMethod = (method: string) => method.replace(' equation', '').replace(' cycle', '');

/** `3 ingredients`, `1 line`. */
export const plural = (n: number, word: string, many = `${word}s`) => `${n} ${n === 1 ? word : many}`;
