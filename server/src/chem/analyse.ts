/**
 * Everything the core knows about one formula, computed once per formula text (memoised).
 */
import { BoundedCache, CachesBySettings, clearAnalysisDerived, detach } from './cache';
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

/**
 * Analyses memoised by formula text, one bounded cache per settings content. A formula's analysis is a
 * few kilobytes (its tree, atoms, composition, charge readings); the estimate below errs high.
 */
const CACHE_ENTRIES = 50_000;
const CACHE_BYTES = 96 * 1024 * 1024;
const analysisBytes = (text: string) => 3072 + 16 * text.length;
const caches = new CachesBySettings<FormulaAnalysis>(CACHE_ENTRIES, CACHE_BYTES);

/**
 * Analyse a formula. Offsets in diagnostics are relative to `text`. Results are shared: treat them as
 * read-only.
 */
export function analyseFormula(text: string, settings: ChemSettings = DEFAULT_CHEM_SETTINGS): FormulaAnalysis {
  const cache = caches.for(settings);
  const hit = cache.get(text);
  if (hit) return hit;
  // The analysis keeps slices of its text: analyse a flat copy, so that they cannot pin a whole document.
  const own = detach(text);
  const result = compute(own, settings);
  cache.set(own, result, analysisBytes(own));
  return result;
}

export function clearFormulaCache() {
  caches.clear();
  speciesCache.clear();
  clearAnalysisDerived();
}

/** What an equation needs of a species: the reading, its atoms and charge (no chemistry of the card). */
export interface SpeciesReading {
  formula: Formula | null;
  ok: boolean;
  atoms: AtomCounts;
  charge: number;
  diagnostics: ChemDiagnostic[];
}

const speciesCache = new BoundedCache<SpeciesReading>(CACHE_ENTRIES, CACHE_BYTES / 4);

/** Read a species of an equation (memoised); a full analysis already made for the same text is reused. */
export function readSpecies(text: string): SpeciesReading {
  const full = caches.for(DEFAULT_CHEM_SETTINGS).get(text);
  if (full) return full;
  const hit = speciesCache.get(text);
  if (hit) return hit;
  text = detach(text);
  const parsed = parseFormula(text);
  let r: SpeciesReading;
  if (!parsed.ok || !parsed.formula) r = { formula: parsed.formula, ok: false, atoms: {}, charge: 0, diagnostics: parsed.diagnostics };
  else {
    const formula = chooseReading(parsed.formula);
    r = { formula, ok: true, atoms: formulaAtoms(formula), charge: formula.charge, diagnostics: parsed.diagnostics };
  }
  speciesCache.set(text, r, analysisBytes(text) / 2);
  return r;
}

function compute(text: string, settings: ChemSettings): FormulaAnalysis {
  const parsed = parseFormula(text);
  const diagnostics = [...parsed.diagnostics];
  if (!parsed.ok || !parsed.formula) {
    return {
      input: text,
      formula: parsed.formula,
      ok: false,
      display: text,
      ascii: text,
      hill: '',
      charge: 0,
      atoms: {},
      molarMass: null,
      composition: [],
      charges: null,
      bond: null,
      lattice: null,
      latticeWithheld: null,
      diagnostics,
    };
  }
  const formula = chooseReading(parsed.formula);
  const atoms = formulaAtoms(formula);
  const variable = formula.variableCounts ?? [];
  const mm = variable.length ? null : molarMass(atoms);
  const charges = assessCharge(formula);
  for (const d of charges.diagnostics) diagnostics.push(d);
  for (const v of variable) {
    diagnostics.push({
      code: 'variable-count',
      severity: 'warning',
      start: v.start,
      end: v.end,
      message: `The count '${text.slice(v.start, v.end)}' is not a number: the ions are read, but a molar mass, a composition and amounts need it (e.g. ${text.slice(0, v.start)}4).`,
    });
  }
  if (mm?.nominal.length) {
    diagnostics.push({
      code: 'no-standard-weight',
      severity: 'information',
      start: 0,
      end: text.length,
      message: `${mm.nominal.join(', ')} ${mm.nominal.length === 1 ? 'has' : 'have'} no standard atomic weight; the mass number of a long-lived isotope was used.`,
    });
  }
  // Bonding and lattice energy are shown in cards, not needed for diagnostics: computed on first use.
  let bond: BondAssessment | null | undefined;
  let lattice: LatticeAssessment | null | undefined;
  let withheld: LatticeWithheld | null | undefined;
  return {
    input: text,
    formula,
    ok: true,
    display: displayFormula(formula, true),
    ascii: displayFormula(formula, false),
    hill: hillFormula(atoms),
    charge: formula.charge,
    atoms,
    molarMass: mm,
    composition: mm ? composition(atoms, mm.value) : [],
    charges,
    diagnostics,
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
