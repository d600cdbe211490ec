/**
 * Another form of an ingredient: the hexahydrate for the anhydrous salt, another assay, or another salt
 * of the same ion. The amount of the substance (or of the ion kept) stays; the mass to weigh is
 * recomputed: m₂ = m₁ · (a₁/a₂) · (M₂/M₁) for the same substance, where a is the assay.
 */
import type { FormulaAnalysis } from '../analyse';
import { formulaAtoms, hillFormula } from '../formula/compute';
import { waterOf } from '../names/systematic';
import { finding, type ReagentFinding } from './findings';

export interface FormChange {
  /** Mass of the new form to weigh, g. */
  massG: number;
  /** Moles of the substance (same substance) or of the kept element. */
  moles: number;
  /** m₂ / m₁. */
  factor: number;
  /** What was kept: `the same NiSO4`, `the same Ni`. */
  kept: string;
  basis: string;
  findings: ReagentFinding[];
}

/** The Hill formula of a formula without its water of crystallisation. */
function anhydrousHill(a: FormulaAnalysis): string | undefined {
  const f = a.formula;
  if (!a.ok || !f) return undefined;
  if (waterOf(f.parts) === undefined) return a.hill;
  return hillFormula(formulaAtoms({ ...f, parts: f.parts.slice(0, 1) }));
}

/**
 * The mass of `to` that replaces `massG` of `from`. Both the same substance up to water of
 * crystallisation: the same moles. Otherwise `keep` (an element both contain, e.g. `Ni`), or the one metal
 * both share, is kept, and a warning says the counter-ion changes.
 */
export function substituteForm(
  from: FormulaAnalysis,
  to: FormulaAnalysis,
  massG: number,
  options: { fromAssayPercent?: number; toAssayPercent?: number; keep?: string } = {},
): FormChange | { findings: ReagentFinding[] } {
  const fail = (message: string) => ({ findings: [finding('form-mismatch', 'error', message)] });
  const m1 = from.molarMass?.value;
  const m2 = to.molarMass?.value;
  if (!m1 || !m2) return fail('Both forms need a molar mass.');
  const a1 = (options.fromAssayPercent ?? 100) / 100;
  const a2 = (options.toAssayPercent ?? 100) / 100;
  if (!(a1 > 0 && a1 <= 1 && a2 > 0 && a2 <= 1)) return fail('An assay must be within 0–100 %.');
  if (!(massG >= 0)) return fail('The mass must be zero or more.');
  const core1 = anhydrousHill(from);
  const core2 = anhydrousHill(to);
  const pure = massG * a1;
  if (!options.keep && core1 && core1 === core2) {
    const moles = pure / m1;
    const out = (moles * m2) / a2;
    return {
      massG: out,
      moles,
      factor: massG ? out / massG : m2 / m1 / (a2 / a1),
      kept: `the same ${core1}`,
      basis: `${massG} g × ${a1 * 100} % ÷ ${m1.toFixed(2)} g/mol × ${m2.toFixed(2)} g/mol ÷ ${a2 * 100} %`,
      findings: [],
    };
  }
  let keep = options.keep;
  if (!keep) {
    const metals = Object.keys(from.atoms).filter((e) => to.atoms[e] && !['H', 'O', 'C', 'N', 'S', 'P', 'Cl', 'F', 'Br', 'I'].includes(e));
    if (metals.length !== 1)
      return fail(`${from.display} and ${to.display} are not one substance, and share no single metal to keep: say which element to keep.`);
    keep = metals[0];
  }
  const n1 = from.atoms[keep];
  const n2 = to.atoms[keep];
  if (!n1 || !n2) return fail(`${keep} is not in both ${from.display} and ${to.display}.`);
  const moles = (pure / m1) * n1;
  const out = ((moles / n2) * m2) / a2;
  return {
    massG: out,
    moles,
    factor: massG ? out / massG : 0,
    kept: `the same ${keep}`,
    basis: `${massG} g × ${a1 * 100} % ÷ ${m1.toFixed(2)} g/mol × ${n1} ${keep} ÷ ${n2} × ${m2.toFixed(2)} g/mol ÷ ${a2 * 100} %`,
    findings: [
      finding('form-mismatch', 'warning', `${to.display} is not ${from.display}: the ${keep} is kept, but the counter-ion changes, and with it the batch.`),
    ],
  };
}
