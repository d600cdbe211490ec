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
  /** Where the pair named is a bond inside an ion (`NH₄⁺` for NH4Cl's N–H), that ion. */
  pairWithin?: string;
  /** For a salt: the ions held together by ionic bonding (labels, e.g. `NH₄⁺`, `Cl⁻`). */
  betweenIons?: { cation: string; anion: string; type: 'ionic' };
  /** Covalent bonds inside the polyatomic ions (N–H in NH₄⁺, S–O in SO₄²⁻). */
  within?: Array<{ ion: string; pair: [string, string]; deltaEN: number; type: BondType; percentIonic: number }>;
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

/**
 * The bonds a molecule or polyatomic ion has, from its atoms (no structure is given): the central atom
 * (the least electronegative atom other than H) bonded to each other element, except that in an
 * oxo compound H sits on O (O–H, as in HNO3, H2SO4, OH⁻), never on the central atom.
 */
export function likelyBonds(els: string[]): Array<[string, string]> {
  const heavy = els.filter((e) => e !== 'H' && en(e) !== null);
  if (heavy.length === 0) return els.length === 1 ? [[els[0], els[0]]] : [];
  const central = heavy.reduce((x, y) => ((en(y) as number) < (en(x) as number) ? y : x));
  const out: Array<[string, string]> = [];
  const hasO = els.includes('O');
  for (const e of els) {
    if (e === central) continue;
    if (e === 'H' && hasO && central !== 'O') out.push(['O', 'H']);
    else out.push([central, e]);
  }
  if (out.length === 0) out.push([central, central]);
  return out;
}

const mostPolar = (pairs: Array<[string, string]>) =>
  pairs.reduce((x, y) => (Math.abs((en(y[0]) ?? 0) - (en(y[1]) ?? 0)) > Math.abs((en(x[0]) ?? 0) - (en(x[1]) ?? 0)) ? y : x));

/** The ion contributing most charge; ties go to the first written. */
function main(ions: IonInReading[]): IonInReading | undefined {
  return [...ions].sort((x, y) => Math.abs(y.charge * y.count) - Math.abs(x.charge * x.count))[0];
}

export function assessBond(_f: Formula, atoms: AtomCounts, charges: ChargeAssessment | null, s: ChemSettings): BondAssessment | null {
  const els = Object.keys(atoms).filter((e) => en(e) !== null);
  const all = Object.keys(atoms);
  if (all.length === 0) return null;
  if (all.every(isMetal) || charges?.designation) return null;
  if (all.length === 1) return make(all[0], all[0], 'element', s);
  const ions = charges?.basis === 'ionic' && charges.balanced ? charges.ions : null;
  if (ions) {
    const cat = main(ions.filter((i) => i.role === 'cation' && i.kind !== 'proton'));
    const an = main(ions.filter((i) => i.role === 'anion'));
    if (cat && an) {
      const ca = ionAtoms(cat).filter((e) => en(e) !== null);
      const aa = ionAtoms(an).filter((e) => en(e) !== null);
      if (ca.length && aa.length) {
        const within = withinBonds(ions, s);
        const betweenIons = { cation: cat.label, anion: an.label, type: 'ionic' as const };
        if (cat.kind === 'polyatomic' && !ca.some(isMetal)) {
          // NH4Cl: ionic between NH₄⁺ and Cl⁻; the pair named is a bond it has, N–H in the cation.
          const inCat = within.find((w) => w.ion === cat.label);
          if (inCat) {
            const b = make(
              inCat.pair[0],
              inCat.pair[1],
              'ionic',
              s,
              `Ionic bonding holds ${cat.label} and ${an.label} together; ΔEN does not apply between polyatomic ions. The pair named is the ${inCat.pair.join('–')} bond within ${cat.label}, which is covalent.`,
            );
            if (b) return { ...b, betweenIons, within, pairWithin: cat.label };
          }
        }
        const c = ca.reduce((x, y) => ((en(y) as number) < (en(x) as number) ? y : x));
        const a = aa.reduce((x, y) => ((en(y) as number) > (en(x) as number) ? y : x));
        const poly = cat.kind !== 'metal' || an.kind !== 'monatomic-anion';
        const b = make(
          c,
          a,
          'ionic',
          s,
          poly
            ? "Pair of the cation and the anion's most electronegative atom; for polyatomic ions ΔEN is only a rough guide to the ionic bonding between them."
            : undefined,
        );
        return b ? { ...b, betweenIons, ...(within.length ? { within } : {}) } : null;
      }
    }
  }
  if (els.length === 2) return make(els[0], els[1], 'binary', s);
  if (els.length < 2) return null;
  const organic = els.includes('C') && els.includes('H');
  if (!organic) {
    // An inorganic molecule: the most polar of the bonds it has (HNO3: O–H, not H–N).
    const bonds = likelyBonds(els);
    const [x, y] = mostPolar(bonds);
    return make(
      x,
      y,
      'most-polar',
      s,
      `Most polar of its bonds (${bonds.map((p) => p.join('–')).join(', ')}); a formula does not say which atoms are bonded, and in an oxo compound H is taken to sit on O.`,
    );
  }
  // Central atom: the least electronegative element other than H (C in organic compounds, S in H2SO4);
  // the pair is the central atom with its most electronegative partner.
  const heavy = els.filter((e) => e !== 'H');
  const central = heavy.reduce((x, y) => ((en(y) as number) < (en(x) as number) ? y : x));
  const partner = els
    .filter((e) => e !== central)
    .reduce((x, y) => (Math.abs((en(y) as number) - (en(central) as number)) > Math.abs((en(x) as number) - (en(central) as number)) ? y : x));
  return make(central, partner, 'most-polar', s, `Central atom ${central} with its most polar partner; a formula does not say which atoms are bonded.`);
}

/** The covalent bonds inside each polyatomic ion of a reading (one entry per ion, its most polar bond). */
function withinBonds(ions: IonInReading[], s: ChemSettings): NonNullable<BondAssessment['within']> {
  const out: NonNullable<BondAssessment['within']> = [];
  for (const i of ions) {
    if (i.kind === 'metal' || i.kind === 'monatomic-anion' || i.kind === 'proton' || out.some((w) => w.ion === i.label)) continue;
    const els = ionAtoms(i).filter((e) => en(e) !== null);
    if (els.length < 2) continue;
    const [x, y] = mostPolar(likelyBonds(els));
    const b = make(x, y, 'most-polar', s);
    if (b) out.push({ ion: i.label, pair: b.pair, deltaEN: b.deltaEN, type: b.type, percentIonic: b.percentIonic });
  }
  return out;
}
