/**
 * Everything the core knows about one formula, computed once per formula text (memoised).
 */
import type { ChemDiagnostic } from './diagnostic';
import type { Formula } from './formula/ast';
import { composition, displayFormula, formulaAtoms, hillFormula, molarMass, type AtomCounts, type CompositionRow, type MolarMass } from './formula/compute';
import { parseFormula } from './formula/parse';
import { chooseReading } from './ions/reading';
import { assessCharge, type ChargeAssessment } from './charge/balance';
import { assessBond, type BondAssessment } from './bond';
import { estimateLattice, latticeWithheld, type LatticeAssessment, type LatticeWithheld } from './lattice/lattice';
import type { ChemSettings } from './settings';
import { DEFAULT_CHEM_SETTINGS } from './settings';

export interface FormulaAnalysis {
  input: string;
  /** Null when the text could not be read as a formula. */
  formula: Formula | null;
  ok: boolean;
  display: string;
  ascii: string;
  hill: string;
  charge: number;
  atoms: AtomCounts;
  molarMass: MolarMass | null;
  composition: CompositionRow[];
  charges: ChargeAssessment | null;
  bond: BondAssessment | null;
  lattice: LatticeAssessment | null;
  /** Why there is no lattice energy, where the reason is that the substance is molecular (null otherwise). */
  latticeWithheld: LatticeWithheld | null;
  diagnostics: ChemDiagnostic[];
}

const cache = new Map<string, FormulaAnalysis>();
let cacheSettings: ChemSettings = DEFAULT_CHEM_SETTINGS;
const CACHE_LIMIT = 50_000;

/**
 * Analyse a formula. Offsets in diagnostics are relative to `text`. Results are shared: treat them as
 * read-only.
 */
export function analyseFormula(text: string, settings: ChemSettings = DEFAULT_CHEM_SETTINGS): FormulaAnalysis {
  if (settings !== cacheSettings) {
    cache.clear();
    cacheSettings = settings;
  }
  const hit = cache.get(text);
  if (hit) return hit;
  const result = compute(text, settings);
  if (cache.size >= CACHE_LIMIT) cache.clear();
  cache.set(text, result);
  return result;
}

export function clearFormulaCache() {
  cache.clear();
  speciesCache.clear();
}

/** What an equation needs of a species: the reading, its atoms and charge (no chemistry of the card). */
export interface SpeciesReading {
  formula: Formula | null;
  ok: boolean;
  atoms: AtomCounts;
  charge: number;
  diagnostics: ChemDiagnostic[];
}

const speciesCache = new Map<string, SpeciesReading>();

/** Read a species of an equation (memoised); a full analysis already made for the same text is reused. */
export function readSpecies(text: string): SpeciesReading {
  const full = cache.get(text);
  if (full) return full;
  const hit = speciesCache.get(text);
  if (hit) return hit;
  const parsed = parseFormula(text);
  let r: SpeciesReading;
  if (!parsed.ok || !parsed.formula) r = { formula: parsed.formula, ok: false, atoms: {}, charge: 0, diagnostics: parsed.diagnostics };
  else {
    const formula = chooseReading(parsed.formula);
    r = { formula, ok: true, atoms: formulaAtoms(formula), charge: formula.charge, diagnostics: parsed.diagnostics };
  }
  if (speciesCache.size >= CACHE_LIMIT) speciesCache.clear();
  speciesCache.set(text, r);
  return r;
}

function compute(text: string, settings: ChemSettings): FormulaAnalysis {
  const parsed = parseFormula(text);
  const diagnostics = [...parsed.diagnostics];
  if (!parsed.ok || !parsed.formula) {
    return {
      input: text, formula: parsed.formula, ok: false, display: text, ascii: text, hill: '', charge: 0, atoms: {},
      molarMass: null, composition: [], charges: null, bond: null, lattice: null, latticeWithheld: null, diagnostics,
    };
  }
  const formula = chooseReading(parsed.formula);
  const atoms = formulaAtoms(formula);
  const mm = molarMass(atoms);
  const charges = assessCharge(formula);
  for (const d of charges.diagnostics) diagnostics.push(d);
  if (mm.nominal.length) {
    diagnostics.push({
      code: 'no-standard-weight', severity: 'information', start: 0, end: text.length,
      message: `${mm.nominal.join(', ')} ${mm.nominal.length === 1 ? 'has' : 'have'} no standard atomic weight; the mass number of a long-lived isotope was used.`,
    });
  }
  // Bonding and lattice energy are shown in cards, not needed for diagnostics: computed on first use.
  let bond: BondAssessment | null | undefined;
  let lattice: LatticeAssessment | null | undefined;
  let withheld: LatticeWithheld | null | undefined;
  return {
    input: text, formula, ok: true, display: displayFormula(formula, true), ascii: displayFormula(formula, false),
    hill: hillFormula(atoms), charge: formula.charge, atoms, molarMass: mm, composition: composition(atoms, mm.value),
    charges, diagnostics,
    get bond() {
      return bond === undefined ? (bond = assessBond(formula, atoms, charges, settings)) : bond;
    },
    get lattice() {
      return lattice === undefined ? (lattice = estimateLattice(formula, atoms, charges, settings)) : lattice;
    },
    get latticeWithheld() {
      return withheld === undefined ? (withheld = latticeWithheld(formula, charges)) : withheld;
    },
  };
}
