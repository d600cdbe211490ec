/**
 * How a batch's safety reading is written (hover, tables, plain text, preview, report): the dangerous
 * pairs, the heat of making up with its temperature change (always labelled an estimate), the advice where
 * it is over the setting, and the one notice that these are an aid, not a safety assessment.
 */
import type { BatchAnalysis, Ingredient } from '../chem/batch';
import type { FormulaAnalysis } from '../chem/analyse';
import {
  enthalpyOfSolution,
  ghsFor,
  HAZARD_CAUTION,
  SAFETY_NOTICE,
  SDS_NOTE,
  type GhsReading,
  type Hazard,
  type HeatReading,
  type HeatStep,
  type SolutionEnthalpy,
} from '../chem/safety';
import { DASH, MINUS, sig } from './format';

export { SAFETY_NOTICE, SDS_NOTE };

/** What a safety section says where no ingredient's heat of solution is known. */
export const NO_HEAT = 'No heat of making up estimated: no counted ingredient has a known enthalpy of solution.';

/** Whether the batch has anything for a safety section (a hazard or a heat estimate). */
export const hasSafety = (b: BatchAnalysis) => b.hazards.length > 0 || b.heat !== null;

/** A hazard's message without the caution every one ends with (a section shows the notice once instead). */
export function hazardText(h: Hazard): string {
  const m = h.message;
  return m.endsWith(HAZARD_CAUTION) ? m.slice(0, m.length - HAZARD_CAUTION.length).trimEnd() : m;
}

/** What forms, in words: `hydrogen-cyanide` → `hydrogen cyanide`. */
export const hazardKindText = (h: Hazard) => h.kind.replace(/-/g, ' ');

/** The ingredients a hazard names: `NaOCl + HCl`. */
export const hazardIngredients = (h: Hazard) => h.ingredients.join(' + ');

/** A signed figure with the true minus: `+52`, `−0.13`. */
const signedSig = (x: number, digits: number) => {
  const t = sig(Math.abs(x), digits);
  return x < 0 ? `${MINUS}${t}` : `+${t}`;
};

/** `ΔT ≈ +52 K (20 → 72 °C)`, or `no ΔT (the batch water is not known)`. */
export function temperatureText(h: HeatReading): string {
  if (h.temperatureRiseK === null) return 'no temperature change estimated (the batch water is not known)';
  const rise = h.temperatureRiseK;
  const from = h.finalC === null ? '' : ` (${sig(h.startC, 3)} → ${sig(h.finalC, 3)} °C)`;
  return `ΔT ≈ ${signedSig(rise, 2)} K${from}${rise < 0 ? ', cooling' : ''}`;
}

/** One line: `Heat of making up: ΔH ≈ −213 kJ, ΔT ≈ +52 K (20 → 72 °C) — estimate, over the 15 K setting`. */
export function heatSummary(h: HeatReading): string {
  const over = h.exceeds ? `, over the ${sig(h.thresholdK, 3)} K setting` : '';
  return `Heat of making up: ΔH ≈ ${signedSig(h.kJ, 3)} kJ, ${temperatureText(h)} — estimate${over}`;
}

/** The advice of the trade, as sentences (only where the estimate is over the setting). */
export const heatAdvice = (h: HeatReading) => (h.exceeds ? h.advice.map((a) => (/[.!?]$/.test(a) ? a : `${a}.`)) : []);

/** A step of the heat estimate, for its table. */
export const stepKindText: Record<HeatStep['kind'], string> = {
  solution: 'dissolution',
  dilution: 'dilution',
  neutralisation: 'neutralisation',
  estimate: 'dissolution (estimated)',
  'not-counted': 'not counted',
};

/** A step's ΔH as a cell: `−212.7`, or a dash for a step not counted. */
export const stepKJText = (st: HeatStep) => (st.kind === 'not-counted' ? DASH : signedSig(st.kJ, 4));

/** The hazards whose lines include this ingredient's (for its hover). */
export const hazardsOf = (b: BatchAnalysis, i: Ingredient) => b.hazards.filter((h) => h.lines.includes(i.lineStart));

// ── the formula card ──────────────────────────────────────────────────────

/** The GHS reading of a substance for its card, or null where Ionwright's table has none. */
export const ghsOf = (a: FormulaAnalysis): GhsReading | null => (a.ok && a.molarMass ? ghsFor(a) : null);

/** The enthalpy of solution of a substance for its card, or null where none is known. */
export const solutionEnthalpyOf = (a: FormulaAnalysis): SolutionEnthalpy | null => (a.ok && a.molarMass ? enthalpyOfSolution(a) : null);

/** `Danger · corrosion (GHS05), skull and crossbones (GHS06)`. */
export function ghsHead(g: GhsReading): string {
  const pics = g.pictograms.map((p) => `${p.name} (${p.code})`).join(', ');
  return [g.signalWord ?? 'No signal word', pics ? `pictograms ${pics}` : 'no pictogram'].join(' · ');
}

/** `H300 Fatal if swallowed.`, one per statement. */
export const ghsStatements = (g: GhsReading) => g.statements.map((x) => `${x.code} ${x.text}`);

/** The basis and the notes of a classification, and the note to check the SDS, in one line. */
export const ghsFoot = (g: GhsReading) => [`${g.substance}: ${g.basis}`, ...g.notes].join('; ') + `. ${SDS_NOTE}`;

/** `+3.88 kJ/mol, cools the water (CRC Handbook…)`; an estimate says so, with its typical error. */
export function solutionEnthalpyText(e: SolutionEnthalpy): string {
  const k = e.kJPerMol;
  const dir = k < 0 ? 'warms the water' : k > 0 ? 'cools the water' : 'neither warms nor cools the water';
  const est = e.basis === 'table' ? '' : `, an estimate${e.typicalErrorKJ !== undefined ? ` (typical error ± ${sig(e.typicalErrorKJ, 2)} kJ/mol)` : ''}`;
  return `${signedSig(k, 3)} kJ/mol at infinite dilution: dissolving it ${dir}${est} — ${e.source}`;
}
