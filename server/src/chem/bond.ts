/**
 * Bonding at a glance: Pauling electronegativity difference for the pair that governs the bond, the bond
 * type by thresholds (common practice: < 0.4 nonpolar covalent, 0.4–1.8 polar covalent, > 1.8 ionic;
 * settings, since texts differ) and percent ionic character by Pauling's relation 1 − exp(−ΔEN²/4).
 *
 * Which pair: for a formula read as ions, the main cation with the most electronegative atom of the main
 * anion (NaCl: Na–Cl; Na2SO4: Na–O); for a binary compound, its two elements; otherwise the most polar
 * pair of elements present (a formula does not say which atoms are bonded, and the card says so).
 * Metals and alloys get no bond type (metallic bonding is none of the three).
 */
import type { ChargeAssessment, IonInReading } from './charge/balance';
import { element, isMetal } from './data/elements';
import type { Formula } from './formula/ast';
import { formulaAtoms, type AtomCounts } from './formula/compute';
import { parseFormula } from './formula/parse';
import type { ChemSettings } from './settings';

export type BondType = 'nonpolar covalent' | 'polar covalent' | 'ionic';

export interface BondAssessment {
  pair: [string, string];
  deltaEN: number;
  type: BondType;
  percentIonic: number;
  /** How the pair was chosen. */
  basis: 'ionic' | 'binary' | 'most-polar' | 'element';
  note?: string;
}

export function bondType(deltaEN: number, s: ChemSettings): BondType {
  if (deltaEN < s.nonpolarBelow) return 'nonpolar covalent';
  if (deltaEN > s.ionicAbove) return 'ionic';
  return 'polar covalent';
}

/** Pauling's relation for the ionic character of a bond, in percent. */
export function percentIonic(deltaEN: number): number {
  return 100 * (1 - Math.exp(-(deltaEN * deltaEN) / 4));
}

const en = (el: string) => element(el)?.en ?? null;

function make(a: string, b: string, basis: BondAssessment['basis'], s: ChemSettings, note?: string): BondAssessment | null {
  const ea = en(a);
  const eb = en(b);
  if (ea === null || eb === null) return null;
  const d = Math.abs(ea - eb);
  // Less electronegative element first.
  const pair: [string, string] = ea <= eb ? [a, b] : [b, a];
  return { pair, deltaEN: d, type: bondType(d, s), percentIonic: percentIonic(d), basis, ...(note ? { note } : {}) };
}

function ionAtoms(ion: IonInReading): string[] {
  if (ion.element) return [ion.element];
  const r = parseFormula(ion.text);
  return r.ok && r.formula ? Object.keys(formulaAtoms(r.formula)) : [];
}

/** The ion contributing most charge; ties go to the first written. */
function main(ions: IonInReading[]): IonInReading | undefined {
  return [...ions].sort((x, y) => Math.abs(y.charge * y.count) - Math.abs(x.charge * x.count))[0];
}

export function assessBond(_f: Formula, atoms: AtomCounts, charges: ChargeAssessment | null, s: ChemSettings): BondAssessment | null {
  const els = Object.keys(atoms).filter((e) => en(e) !== null);
  const all = Object.keys(atoms);
  if (all.length === 0) return null;
  if (all.every(isMetal)) return null;
  if (all.length === 1) return make(all[0], all[0], 'element', s);
  const ions = charges?.basis === 'ionic' && charges.balanced ? charges.ions : null;
  if (ions) {
    const cat = main(ions.filter((i) => i.role === 'cation' && i.kind !== 'proton'));
    const an = main(ions.filter((i) => i.role === 'anion'));
    if (cat && an) {
      const ca = ionAtoms(cat).filter((e) => en(e) !== null);
      const aa = ionAtoms(an).filter((e) => en(e) !== null);
      if (ca.length && aa.length) {
        const c = ca.reduce((x, y) => ((en(y) as number) < (en(x) as number) ? y : x));
        const a = aa.reduce((x, y) => ((en(y) as number) > (en(x) as number) ? y : x));
        const poly = cat.kind !== 'metal' || an.kind !== 'monatomic-anion';
        return make(c, a, 'ionic', s, poly ? 'Pair of the cation and the anion\'s most electronegative atom; for polyatomic ions ΔEN is only a rough guide to the ionic bonding between them.' : undefined);
      }
    }
  }
  if (els.length === 2) return make(els[0], els[1], 'binary', s);
  if (els.length < 2) return null;
  // Central atom: the least electronegative element other than H (C in organic compounds, S in H2SO4);
  // the pair is the central atom with its most electronegative partner.
  const heavy = els.filter((e) => e !== 'H');
  const central = heavy.reduce((x, y) => ((en(y) as number) < (en(x) as number) ? y : x));
  const partner = els.filter((e) => e !== central).reduce((x, y) => (Math.abs((en(y) as number) - (en(central) as number)) > Math.abs((en(x) as number) - (en(central) as number)) ? y : x));
  return make(central, partner, 'most-polar', s, `Central atom ${central} with its most polar partner; a formula does not say which atoms are bonded.`);
}
