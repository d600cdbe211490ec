/**
 * Names of substances, both ways.
 *
 * - Formula → name (`nameOf`, `namesOf`): the systematic English name by the IUPAC 2005 recommendations
 *   for inorganic compounds (./systematic.ts), and the names the trade uses beside it (./common.ts, the
 *   acid names of ./acids.ts).
 * - Name → formula (`readName`, `nameAtStart`): systematic, acid and shelf names, tolerant of case,
 *   spacing, hyphens and British or American spelling; a name not read exactly is never taken for the
 *   nearest one (./read.ts says how).
 * - Completion (`namesByPrefix`): every listed name and the salts of the usual ions, by prefix.
 */
import { analyseFormula, type FormulaAnalysis } from '../analyse';
import { acidByForm } from './acids';
import { COMMON_NAMES } from './common';
import { itemsText, systematicName, waterOf } from './systematic';

export { readName, nameAtStart, namesByPrefix, clearNameCache, type NameReading, type NameCandidate, type NameEntry, type NameStatus } from './read';
export { systematicName, complexName } from './systematic';
export { ACIDS, acidByForm, type AcidDef } from './acids';
export { COMMON_NAMES, type CommonName } from './common';

/**
 * The name of the substance where the reading makes it plain, e.g. `nickel(II) sulfate hexahydrate`,
 * `potassium hexacyanidoferrate(III)`, `dinitrogen tetraoxide`, `sulfuric acid`; undefined otherwise.
 */
export function nameOf(a: FormulaAnalysis): string | undefined {
  return systematicName(a);
}

/**
 * The name of the substance as it is in a water batch: an acid whose name is that of its solution goes by
 * it (HCl in water is hydrochloric acid, not hydrogen chloride; IUPAC 2005, IR-8.1); anything else as
 * `nameOf`.
 */
export function aqueousNameOf(a: FormulaAnalysis): string | undefined {
  const acid = a.ok && a.formula && a.formula.parts.length === 1 && a.charge === 0 ? acidByForm(a.ascii) : undefined;
  return acid?.compound ? acid.name : nameOf(a);
}

export interface SubstanceNames {
  /** The systematic name (as `nameOf`), or undefined. */
  systematic: string | undefined;
  /** Names the trade uses for it, the usual first (`blue vitriol`); a solution's name says so. */
  common: string[];
}

/** A solution's name says it is one: `bleach (solution)`, `ammonia solution`. */
const solutionLabel = (row: (typeof COMMON_NAMES)[number]) => (row.solution && !/solution/.test(row.names[0]) ? `${row.names[0]} (solution)` : row.names[0]);

const byHill = new Map<string, string[]>();
const byForm = new Map<string, string[]>();
for (const row of COMMON_NAMES) {
  if (row.iupac) continue;
  const label = solutionLabel(row);
  if (row.byForm) for (const f of row.forms ?? [row.formula]) byForm.set(f, [...(byForm.get(f) ?? []), label]);
}
/** Hill formulas of the table's rows, filled on first use. */
let hillFilled = false;

/** The systematic name and the trade's names of an analysed formula. */
export function namesOf(a: FormulaAnalysis): SubstanceNames {
  if (!hillFilled) {
    for (const row of COMMON_NAMES) {
      if (row.iupac || row.byForm) continue;
      const label = solutionLabel(row);
      const h = analyseFormula(row.formula).hill;
      if (systematicName(analyseFormula(row.formula)) === row.names[0]) continue;
      byHill.set(h, [...(byHill.get(h) ?? []), label]);
    }
    hillFilled = true;
  }
  const systematic = systematicName(a);
  const common: string[] = [];
  if (a.ok && a.formula) {
    const bare = waterOf(a.formula.parts) === 0 && a.formula.parts.length === 1 ? itemsText(a.formula.parts[0].items) : undefined;
    const acid = bare ? acidByForm(bare) : undefined;
    if (acid?.compound) common.push(`${acid.name} (solution)`);
    for (const n of (bare && byForm.get(bare)) || byHill.get(a.hill) || []) if (!common.includes(n) && n !== systematic) common.push(n);
  }
  return { systematic, common };
}
