/**
 * Equivalents per mole, for normality (N = equivalents per litre): by the substance's acid–base role
 * (protons given or taken), its redox role (electrons in its usual titration half-reaction), or the
 * charge of its cations (precipitation and ion-exchange work).
 *
 * Sources: basicities from chem/names/acids.ts (IUPAC 2005 and the CRC Handbook's dissociation
 * constants); redox equivalents from Vogel's Textbook of Quantitative Chemical Analysis (the usual
 * half-reactions of the titrants), from memory; the rest common practice.
 */
import type { FormulaAnalysis } from '../analyse';
import { acidByForm } from '../names/acids';
import { itemsText, waterOf } from '../names/systematic';

export type EquivalentRole = 'acid' | 'base' | 'redox' | 'ion';

export interface Equivalents {
  perMole: number;
  role: EquivalentRole;
  /** How they were counted, as a card says it: `2 H⁺ per H2SO4 (acid)`. */
  basis: string;
}

/**
 * Redox titrants and reductants by Hill formula: electrons per formula unit in the usual half-reaction
 * (Vogel, from memory).
 */
const REDOX: Record<string, { n: number; reaction: string }> = {
  KMnO4: { n: 5, reaction: 'MnO₄⁻ → Mn²⁺ in acid (3 in neutral solution, to MnO₂)' },
  Cr2K2O7: { n: 6, reaction: 'Cr₂O₇²⁻ → 2 Cr³⁺' },
  Na2O3S2: { n: 1, reaction: '2 S₂O₃²⁻ → S₄O₆²⁻' },
  H10Na2O8S2: { n: 1, reaction: '2 S₂O₃²⁻ → S₄O₆²⁻' },
  I2: { n: 2, reaction: 'I₂ → 2 I⁻' },
  IKO3: { n: 6, reaction: 'IO₃⁻ → I⁻ (iodometry: 3 I₂ per IO₃⁻)' },
  BrKO3: { n: 6, reaction: 'BrO₃⁻ → Br⁻' },
  CeO8S2: { n: 1, reaction: 'Ce⁴⁺ → Ce³⁺' },
  CeH8N8O18: { n: 1, reaction: 'Ce⁴⁺ → Ce³⁺' },
  FeO4S: { n: 1, reaction: 'Fe²⁺ → Fe³⁺' },
  FeH14O11S: { n: 1, reaction: 'Fe²⁺ → Fe³⁺' },
  FeH20N2O14S2: { n: 1, reaction: 'Fe²⁺ → Fe³⁺' },
  C2Na2O4: { n: 2, reaction: 'C₂O₄²⁻ → 2 CO₂' },
  C2H2O4: { n: 2, reaction: 'C₂O₄²⁻ → 2 CO₂' },
  C2H6O6: { n: 2, reaction: 'C₂O₄²⁻ → 2 CO₂ (oxalic acid dihydrate)' },
  H2O2: { n: 2, reaction: 'H₂O₂ → O₂ (or → 2 H₂O)' },
  As2O3: { n: 4, reaction: 'As(III) → As(V), two As' },
};

/** Acids and bases the names tables do not list (primary standards; common practice). */
const BASES: Record<string, { n: number; note: string }> = {
  H3N: { n: 1, note: 'NH₃ + H⁺ → NH₄⁺' },
  H5NO: { n: 1, note: 'NH₃ + H⁺ → NH₄⁺' },
  CNa2O3: { n: 2, note: 'CO₃²⁻ + 2 H⁺ → CO₂ + H₂O (methyl orange end point)' },
  CHNaO3: { n: 1, note: 'HCO₃⁻ + H⁺ → CO₂ + H₂O' },
  B4H20Na2O17: { n: 2, note: 'B₄O₇²⁻ + 2 H⁺ + 5 H₂O → 4 H₃BO₃' },
  B4Na2O7: { n: 2, note: 'B₄O₇²⁻ + 2 H⁺ + 5 H₂O → 4 H₃BO₃' },
  C4H11NO3: { n: 1, note: 'tris(hydroxymethyl)aminomethane takes one H⁺' },
};
const ACID_SALTS: Record<string, { n: number; note: string }> = {
  C8H5KO4: { n: 1, note: 'potassium hydrogen phthalate gives one H⁺' },
};

/** The equivalents per mole of `a` in `role`, or in the role it most plainly has where none is given. */
export function equivalentsOf(a: FormulaAnalysis, role?: EquivalentRole): Equivalents | { error: string } {
  const f = a.formula;
  if (!a.ok || !f) return { error: `${a.input} is not a formula that can be read.` };
  const bare = waterOf(f.parts) !== undefined ? itemsText(f.parts[0].items) : undefined;
  const acid = bare ? acidByForm(bare) : undefined;
  const ions = a.charges?.basis === 'ionic' ? (a.charges.ions ?? []) : [];
  const hydroxide = ions.find((i) => i.role === 'anion' && i.ionName === 'hydroxide');
  const acidAnion = ions.find((i) => i.role === 'anion' && /^(?:(di|tri)?hydrogen) /.test(i.ionName ?? ''));
  const redox = REDOX[a.hill];
  const base = BASES[a.hill];
  const tryRole = (r: EquivalentRole): Equivalents | undefined => {
    if (r === 'acid') {
      if (acid) return { perMole: acid.basicity, role: r, basis: `${acid.basicity} H⁺ per ${a.display} (${acid.name}, acid)` };
      const extra = ACID_SALTS[a.hill];
      if (extra) return { perMole: extra.n, role: r, basis: `${extra.note} (acid)` };
      if (acidAnion) {
        const h = acidAnion.ionName?.startsWith('trihydrogen') ? 3 : acidAnion.ionName?.startsWith('dihydrogen') ? 2 : 1;
        const n = h * acidAnion.count;
        return { perMole: n, role: r, basis: `${n} H⁺ per ${a.display} (its ${acidAnion.ionName}, acid)` };
      }
      return undefined;
    }
    if (r === 'base') {
      if (hydroxide) return { perMole: hydroxide.count, role: r, basis: `${hydroxide.count} OH⁻ per ${a.display} (base)` };
      if (base) return { perMole: base.n, role: r, basis: `${base.note} (base)` };
      return undefined;
    }
    if (r === 'redox') return redox ? { perMole: redox.n, role: r, basis: `${redox.n} e⁻ per ${a.display}: ${redox.reaction} (redox)` } : undefined;
    const cationCharge = ions.filter((i) => i.role === 'cation').reduce((s, i) => s + i.charge * i.count, 0);
    return cationCharge > 0 ? { perMole: cationCharge, role: r, basis: `${cationCharge} cationic charges per ${a.display} (ion)` } : undefined;
  };
  if (role) {
    const r = tryRole(role);
    return r ?? { error: `${a.display} has no ${role} equivalents the tool knows: give the amount in M instead.` };
  }
  // The plainest role first: a named acid, a base, a redox titrant, an acid salt, a salt's charge.
  const order: EquivalentRole[] = acid ? ['acid'] : base || hydroxide ? ['base'] : redox ? ['redox'] : ['acid', 'ion'];
  for (const r of order) {
    const e = tryRole(r);
    if (e) return e;
  }
  return { error: `${a.display} has no equivalents the tool knows (no acid, base, redox or ionic role): give the amount in M instead.` };
}
