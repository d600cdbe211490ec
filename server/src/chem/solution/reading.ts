/**
 * What an ingredient gives in water, as components of the solution model: a salt is read into its
 * components whatever way it is written. The formula's atoms (hydrate water left out), less its metal
 * cations, are matched against the forms of the tables by composition (ions/composition.ts's key):
 * `CH3COONa`, `NaCH3COO` and `NaC2H3O2` are all Na⁺ + C2H3O2 = acetate; `KHC8H4O4` is K⁺ + hydrogen
 * phthalate; `C10H14N2Na2O8·2H2O` is 2 Na⁺ + H₂EDTA²⁻; `C4H11NO3·HCl` is TRIS-H⁺ + Cl⁻. What is left
 * after the metals is one form of the tables, times a count, or one of a few common ions (H⁺, OH⁻, Cl⁻,
 * SO₄²⁻, NH₄⁺ …) and one form; the metals' charges are the ones that balance.
 *
 * A formula the tables cannot read goes by its nominal ions (ions/dissociation.ts): an ion the model
 * does not know (MnO₄⁻, S₂O₃²⁻, [Fe(CN)₆]⁴⁻) is an inert component, which counts in the ionic strength and
 * the charge and forms nothing. A complex of a centre that exchanges its ligands slowly (Fe, Co(III), Cr,
 * the platinum metals) stays whole that way too. A molecule (ethanol, glucose, H2O2) is left out of the
 * equilibrium, and said so.
 */
import type { FormulaAnalysis } from '../analyse';
import { analysisDerivedCache } from '../cache';
import { itemAtoms, type AtomCounts } from '../formula/compute';
import type { FormulaPart } from '../formula/ast';
import { keyOfAtoms } from '../ions/composition';
import { electrolyteIons } from '../ions/dissociation';
import { parseFormula } from '../formula/parse';
import { SPECIES } from './model';
import { ACID_SYSTEMS } from './tables/acids';
import { METAL_CHARGES, metalLabel, PROTON, STRONG_ANIONS } from './tables/ions';

/** One component's share of a formula unit. */
export interface ComponentShare {
  label: string;
  charge: number;
  /** mol of the component per mol of the ingredient (H⁺ may be negative: hydroxide). */
  count: number;
  /** Not in the tables: forms nothing. */
  inert?: boolean;
}

export interface IngredientReading {
  /** Components and their counts; empty where the substance is left out of the equilibrium. */
  shares: ComponentShare[];
  /** What it was read as, in labels with counts (`2 Na^+`, `H2EDTA^2-`), for the hover. */
  as: string[];
  /** Why it is left out (a molecule, a solid not dissolved), where it is. */
  leftOut?: string;
  /** Ions that are inert components (not in the tables). */
  inert: string[];
}

/** A form a formula may be written with: a species of the model, and what one unit gives. */
interface Form {
  label: string;
  charge: number;
  gives: Array<[string, number]>;
}

const BY_KEY = new Map<string, Form[]>();
function addForm(formula: string, f: Form) {
  const p = parseFormula(formula);
  if (!p.ok || !p.formula) return;
  const key = keyOfAtoms(itemAtoms(p.formula.parts[0].items));
  const at = BY_KEY.get(key);
  if (at) at.push(f);
  else BY_KEY.set(key, [f]);
}

const H = PROTON.label;
for (const s of ACID_SYSTEMS) {
  const basis = s.forms[s.forms.length - 1].label;
  for (const f of s.forms) {
    if (!f.formula) continue;
    addForm(f.formula, {
      label: f.label,
      charge: s.charge + f.h,
      gives: f.h
        ? [
            [basis, 1],
            [H, f.h],
          ]
        : [[basis, 1]],
    });
  }
  for (const r of s.readings ?? [])
    addForm(r.formula, {
      label: `${r.formula}${caret(r.charge)}`,
      charge: r.charge,
      gives: r.h
        ? [
            [basis, r.basis],
            [H, r.h],
          ]
        : [[basis, r.basis]],
    });
}
for (const a of STRONG_ANIONS) addForm(a.formula, { label: a.label, charge: a.charge, gives: [[a.label, 1]] });
// Water's own: hydroxide, oxide (O²⁻ + H2O → 2 OH⁻), the proton.
addForm('OH', { label: 'OH^-', charge: -1, gives: [[H, -1]] });
addForm('O', { label: 'O^2-', charge: -2, gives: [[H, -2]] });
addForm('H', { label: H, charge: 1, gives: [[H, 1]] });

function caret(q: number): string {
  return q === 0 ? '' : `^${Math.abs(q) === 1 ? '' : Math.abs(q)}${q > 0 ? '+' : '-'}`;
}

/** The common ions tried beside one form (`NH4H2PO4` = NH₄⁺ + H₂PO₄⁻, `C4H11NO3·HCl` = Cl⁻ + TRIS-H⁺). */
const COMMON = ['H', 'OH', 'Cl', 'Br', 'I', 'F', 'NO3', 'ClO4', 'SO4', 'NH4', 'CO3'].map((formula) => {
  const p = parseFormula(formula);
  const atoms = itemAtoms((p.formula as NonNullable<typeof p.formula>).parts[0].items);
  return { atoms, forms: BY_KEY.get(keyOfAtoms(atoms)) ?? [] };
});

/** Centres whose complexes exchange ligands slowly: such a complex stays whole (an inert ion). */
const INERT_CENTRES = new Set(['Fe', 'Co', 'Cr', 'Pt', 'Pd', 'Ru', 'Rh', 'Ir', 'Os', 'Au', 'Hg']);

const isWater = (p: FormulaPart) => {
  const a = itemAtoms(p.items);
  const keys = Object.keys(a);
  return keys.length === 2 && a.H === 2 && a.O === 1;
};

const readings = analysisDerivedCache<IngredientReading>(20_000, 8 * 1024 * 1024);

/** What an ingredient gives in water (memoised by formula text; read-only). */
export function readIngredient(a: FormulaAnalysis): IngredientReading {
  let hit = readings.get(a.input);
  if (!hit) {
    hit = read(a);
    readings.set(a.input, hit, 200 + 120 * hit.shares.length);
  }
  return hit;
}

function read(a: FormulaAnalysis): IngredientReading {
  if (!a.ok || !a.formula || !a.molarMass) return { shares: [], as: [], inert: [], leftOut: 'not readable' };
  const parts = a.formula.parts;
  const main = parts.filter((p, k) => k === 0 || !isWater(p));
  const atoms: AtomCounts = {};
  for (const p of main) itemAtoms(p.items, p.multiplier, atoms);
  if (Object.values(atoms).some((n) => !Number.isInteger(n) || n < 0)) return nominal(a);
  if (parts.length === 1 && isWater(parts[0]) && a.charge === 0) return { shares: [], as: [], inert: [], leftOut: 'water: the solvent' };
  const els = Object.keys(atoms);
  if (els.length === 1 && a.charge === 0 && METAL_CHARGES[els[0]])
    return { shares: [], as: [], inert: [], leftOut: 'a metal: not dissolved (redox is not modelled)' };
  if (Object.keys(atoms).some((e) => INERT_CENTRES.has(e))) {
    const ions = a.charges?.ions ?? [];
    // [Co(NH3)6]Cl3, K4[Fe(CN)6]: the complex stays whole.
    if (ions.some((i) => i.kind === 'complex')) return nominal(a);
    if (ions.some((i) => i.ionName === 'cyanide'))
      return {
        shares: [],
        as: [],
        inert: [],
        leftOut: 'a cyanide complex of a slowly exchanging centre: write it in brackets (K4[Fe(CN)6]) to count it as one ion',
      };
  }
  return byComposition(atoms, a.charge) ?? nominal(a);
}

interface Pick {
  form: Form;
  count: number;
}

/** Metals as their ions, the rest as at most one common ion and one form of the tables; null where none fits. */
function byComposition(atoms: AtomCounts, charge: number): IngredientReading | null {
  const metals = Object.keys(atoms).filter((e) => METAL_CHARGES[e]);
  const rest: AtomCounts = {};
  for (const [el, n] of Object.entries(atoms)) if (!METAL_CHARGES[el]) rest[el] = n;
  if (Object.keys(rest).length === 0) {
    // A metal ion listed on its own (`Cu^2+`); a bare metal is not dissolved.
    if (metals.length !== 1 || charge === 0) return null;
    const q = charge / atoms[metals[0]];
    if (!METAL_CHARGES[metals[0]].includes(q)) return null;
    return result(metals, [q], atoms, []);
  }
  for (const anions of decompositions(rest)) {
    // Without a metal, two ions both more than once is a molecule read twice over (C6H12O6 is no 2 H⁺ + 2
    // lactate), and so are protons with more than one anion unit.
    if (metals.length === 0 && anions.length === 2 && anions[1].count > 1 && (anions[0].count > 1 || anions[0].form.label === H)) continue;
    const anionCharge = anions.reduce((s, p) => s + p.count * p.form.charge, 0);
    const need = charge - anionCharge;
    const combo = metalCharges(metals, atoms, need);
    if (combo) return result(metals, combo, atoms, anions);
  }
  return null;
}

/** Ways of writing `rest` as one form × m, or a common ion × m2 and one form × m1 (a few at most). */
function* decompositions(rest: AtomCounts): Generator<Pick[]> {
  yield* single(rest, []);
  for (const c of COMMON) {
    for (let m2 = 1; m2 <= 12; m2++) {
      const left: AtomCounts = { ...rest };
      let fits = true;
      for (const [el, n] of Object.entries(c.atoms)) {
        left[el] = (left[el] ?? 0) - n * m2;
        if (left[el] < 0) fits = false;
        else if (left[el] === 0) delete left[el];
      }
      if (!fits) break;
      for (const form of c.forms) {
        if (Object.keys(left).length === 0) continue;
        yield* single(left, [{ form, count: m2 }]);
      }
    }
  }
}

function* single(rest: AtomCounts, before: Pick[]): Generator<Pick[]> {
  const els = Object.keys(rest);
  if (els.length === 0) return;
  for (let m = 1; m <= 12; m++) {
    const unit: AtomCounts = {};
    let whole = true;
    for (const el of els) {
      const q = rest[el] / m;
      if (!Number.isInteger(q)) {
        whole = false;
        break;
      }
      unit[el] = q;
    }
    if (!whole) continue;
    // A molecule is one unit: C6H12O6 is no pair of lactic acids.
    for (const form of BY_KEY.get(keyOfAtoms(unit)) ?? []) if (m === 1 || form.charge !== 0) yield [...before, { form, count: m }];
  }
}

/** Charges of the metals (the usual first) that give `need` in total; null where none does. */
function metalCharges(metals: string[], atoms: AtomCounts, need: number): number[] | null {
  if (metals.length === 0) return need === 0 ? [] : null;
  const options = metals.map((m) => METAL_CHARGES[m]);
  const pick = new Array<number>(metals.length).fill(0);
  for (;;) {
    let sum = 0;
    metals.forEach((m, k) => (sum += options[k][pick[k]] * atoms[m]));
    if (sum === need) return pick.map((p, k) => options[k][p]);
    let k = 0;
    while (k < pick.length && ++pick[k] === options[k].length) pick[k++] = 0;
    if (k === pick.length) return null;
  }
}

function result(metals: string[], charges: number[], atoms: AtomCounts, anions: Pick[]): IngredientReading {
  const shares = new Map<string, ComponentShare>();
  const add = (label: string, count: number) => {
    const at = shares.get(label);
    if (at) at.count += count;
    else shares.set(label, { label, charge: (SPECIES.get(label)?.charge ?? 0) as number, count });
  };
  const as: string[] = [];
  metals.forEach((m, k) => {
    const label = metalLabel(m, charges[k]);
    add(label, atoms[m]);
    as.push(`${atoms[m] === 1 ? '' : `${atoms[m]} `}${label}`);
  });
  for (const p of anions) {
    for (const [label, n] of p.form.gives) add(label, n * p.count);
    as.push(`${p.count === 1 ? '' : `${p.count} `}${p.form.label}`);
  }
  const list = [...shares.values()].filter((s) => s.count !== 0);
  return { shares: list, as, inert: [] };
}

/** By the nominal ions: each ion read on its own where the tables know it, else inert. */
function nominal(a: FormulaAnalysis): IngredientReading {
  const d = electrolyteIons(a);
  if (d.ions.length === 0) {
    const why = d.undissociated?.startsWith('molecular')
      ? 'a molecule the equilibrium tables do not know: left out, it moves no pH in the model'
      : (d.undissociated ?? 'not dissolved');
    return { shares: [], as: [], inert: [], leftOut: why };
  }
  const shares = new Map<string, ComponentShare>();
  const as: string[] = [];
  const inert: string[] = [];
  for (const ion of d.ions) {
    const p = parseFormula(ion.key);
    const known = p.ok && p.formula && !ion.key.startsWith('[') ? byComposition(itemAtoms(p.formula.parts[0].items), ion.charge) : null;
    if (known) {
      for (const s of known.shares) {
        const at = shares.get(s.label);
        if (at) at.count += s.count * ion.count;
        else shares.set(s.label, { ...s, count: s.count * ion.count });
      }
    } else {
      const at = shares.get(ion.key);
      if (at) at.count += ion.count;
      else shares.set(ion.key, { label: ion.key, charge: ion.charge, count: ion.count, inert: true });
      if (!inert.includes(ion.key)) inert.push(ion.key);
    }
    as.push(`${ion.count === 1 ? '' : `${ion.count} `}${ion.key}`);
  }
  return { shares: [...shares.values()].filter((s) => s.count !== 0), as, inert };
}
