/**
 * Which formulas are molecular (or covalent-polymeric) substances rather than ionic solids, so that they get
 * no lattice energy, and the sentence the card shows instead.
 *
 * Two sources, in this order:
 * 1. The table of known molecular binary oxides and halides with their melting and boiling points
 *    (data/reference/molecular-substances.csv; CRC Handbook, Physical Constants of Inorganic Compounds,
 *    recalled from memory). Their state at 25 °C follows from those points.
 * 2. A rule from Fajans' rules (K. Fajans, Naturwissenschaften 11 (1923) 165: a small, highly charged
 *    cation polarises its anions into covalent bonds, the more so the larger the anion). As thresholds of
 *    formal charge, following the pattern of the oxides and halides of the metals in Greenwood & Earnshaw
 *    (common practice, from memory):
 *    - oxides with the metal at +7 or above are molecular (Mn2O7, Tc2O7, RuO4, OsO4), while the +6 oxides
 *      and below form extended solids (CrO3 chains, MoO3 layers, WO3, and ionic lattices further down);
 *    - fluorides at +5 or above are molecular (NbF5 and TaF5 tetramers, MoF6, WF6, UF6), the tetrafluorides
 *      are extended solids (ZrF4, UF4, TiF4, SnF4);
 *    - chlorides, bromides and iodides at +4 or above are molecular (TiCl4, SnCl4, GeCl4, VCl4, PbCl4,
 *      NbCl5, WCl6), except where the cation is large: Shannon radius (six-coordinate) of 0.85 Å or more
 *      (Th⁴⁺ 0.94, U⁴⁺ 0.89, Ce⁴⁺ 0.87 Å), whose tetrahalides are ionic solids (ThCl4 melts at 770 °C).
 *      The 0.85 Å limit is this project's, set between Pb⁴⁺ (0.775 Å; PbCl4 is a liquid) and Ce⁴⁺.
 *    In a formula with more than one anion (CrO2Cl2, VOCl3) the lowest threshold of its anions applies.
 * Formulas the charge analysis already reads as molecular (SiCl4, PCl5) are described from the table.
 */
import type { ChargeAssessment } from '../charge/balance';
import { shannonRadius } from '../data/radii';
import { MOLECULAR_SUBSTANCES, SOURCES, type MolecularSubstance } from '../data/thermo';
import type { Formula } from '../formula/ast';
import { displayFormula } from '../formula/compute';

/** Formal charge from which a metal's binary compound with this anion is molecular (see the header). */
export const MOLECULAR_FROM_CHARGE: Readonly<Record<string, number>> = { O: 7, F: 5, Cl: 4, Br: 4, I: 4 };
/** Cations at least this large (Shannon, six-coordinate, Å) keep ionic tetrahalides. */
export const LARGE_CATION_A = 0.85;
/** Room temperature for the state shown on the card, °C. */
export const ROOM_TEMPERATURE_C = 25;

export interface LatticeWithheld {
  /** `molecular` and `polymeric` from the table; `covalent` from the rule. */
  reason: 'molecular' | 'polymeric' | 'covalent';
  /** The sentence for the card. */
  text: string;
  /** State at 25 °C and 1 atm, where the table knows the melting and boiling points. */
  stateAt25C?: 'solid' | 'liquid' | 'gas';
  meltingPointC?: number | null;
  boilingPointC?: number | null;
  boilingKind?: MolecularSubstance['boilingKind'];
  source: string;
}

/** State at 25 °C from the melting and boiling (sublimation, decomposition) points. */
export function stateAt(m: MolecularSubstance, t = ROOM_TEMPERATURE_C): 'solid' | 'liquid' | 'gas' | undefined {
  if (m.boilingKind === 'sublimes' && m.boilingPointC !== null) return m.boilingPointC <= t ? 'gas' : 'solid';
  if (m.meltingPointC !== null && m.meltingPointC > t) return 'solid';
  if (m.boilingKind === 'boils' && m.boilingPointC !== null && m.boilingPointC <= t) return 'gas';
  if (m.meltingPointC !== null) return 'liquid';
  return undefined;
}

const deg = (x: number) => `${x < 0 ? '−' : ''}${Math.abs(x)} °C`;

function points(m: MolecularSubstance): string {
  const bits: string[] = [];
  if (m.meltingPointC !== null && m.boilingKind !== 'sublimes') bits.push(`mp ${deg(m.meltingPointC)}`);
  if (m.boilingPointC !== null) {
    bits.push(
      m.boilingKind === 'boils'
        ? `bp ${deg(m.boilingPointC)}`
        : m.boilingKind === 'sublimes'
          ? `sublimes at ${deg(m.boilingPointC)}`
          : `decomposes near ${deg(m.boilingPointC)}`,
    );
  } else if (m.boilingKind === 'decomposes') bits.push('decomposes on heating');
  return bits.join(', ');
}

/** The text of a formula's main part as the table is keyed (no adducts, no state symbol); neutral formulas only. */
function key(formula: Formula): string | undefined {
  if (formula.parts.length === 0 || formula.charge !== 0 || formula.parts[0].multiplier !== 1) return undefined;
  return displayFormula({ ...formula, parts: [formula.parts[0]], charge: 0 }, false, false);
}

/** The table's entry for a formula as written, or undefined. */
export function molecularEntry(formula: Formula): MolecularSubstance | undefined {
  const k = key(formula);
  return k === undefined ? undefined : MOLECULAR_SUBSTANCES.get(k);
}

/** The rule of the header: the cation, its charge and the anion that make the formula covalent, or undefined. */
export function covalentByCharge(charges: ChargeAssessment | null): { cation: string; charge: number; anion: string } | undefined {
  if (!charges || charges.basis !== 'ionic' || !charges.ions) return undefined;
  const cations = charges.ions.filter((i) => i.role === 'cation');
  const anions = charges.ions.filter((i) => i.role === 'anion');
  if (cations.length !== 1 || anions.length === 0) return undefined;
  const [c] = cations;
  if (c.kind !== 'metal' || !c.element || !Number.isInteger(c.charge)) return undefined;
  const governing = anions
    .filter((a) => a.kind === 'monatomic-anion' && a.element && MOLECULAR_FROM_CHARGE[a.element] !== undefined)
    .sort((x, y) => MOLECULAR_FROM_CHARGE[x.element!] - MOLECULAR_FROM_CHARGE[y.element!])[0];
  if (!governing || c.charge < MOLECULAR_FROM_CHARGE[governing.element!]) return undefined;
  // Large cations keep ionic halides (Fajans: a large cation polarises little); oxides and fluorides at these charges have no large cations.
  const r = shannonRadius(c.element, c.charge, 6);
  if (r && r.ionicRadius >= LARGE_CATION_A && governing.element !== 'O' && governing.element !== 'F') return undefined;
  return { cation: c.element, charge: c.charge, anion: governing.element! };
}

const ANION_NAME: Record<string, string> = { O: 'oxide', F: 'fluoride', Cl: 'chloride', Br: 'bromide', I: 'iodide' };

/**
 * Why a formula gets no lattice energy because it is a molecular (or covalent-polymeric) substance, or null
 * when it is not known or judged to be one.
 */
export function latticeWithheld(formula: Formula, charges: ChargeAssessment | null): LatticeWithheld | null {
  const name = key(formula);
  const entry = molecularEntry(formula);
  if (entry && name) {
    const state = stateAt(entry);
    const pts = points(entry);
    const what =
      entry.kind === 'molecular'
        ? `${name} is a molecular substance, not an ionic solid`
        : `${name} is a covalent, polymeric solid (molecular in the vapour), not an ionic lattice`;
    const where = state ? `${state === 'solid' ? 'a solid' : state === 'liquid' ? 'a liquid' : 'a gas'} at ${ROOM_TEMPERATURE_C} °C` : '';
    const detail = [where, pts].filter(Boolean).join(': ');
    const text = `No lattice energy${formula.parts.length > 1 ? ' (for the substance without its adducts)' : ''}: ${what}${detail ? ` (${detail}; ${SOURCES.molecular})` : ''}${entry.note ? `; ${entry.note}` : ''}.`;
    return {
      reason: entry.kind,
      text,
      ...(state ? { stateAt25C: state } : {}),
      meltingPointC: entry.meltingPointC,
      boilingPointC: entry.boilingPointC,
      boilingKind: entry.boilingKind,
      source: SOURCES.molecular,
    };
  }
  const rule = covalentByCharge(charges);
  if (rule && name) {
    return {
      reason: 'covalent',
      text: `No lattice energy${formula.parts.length > 1 ? ' (for the substance without its adducts)' : ''}: ${rule.cation} at +${rule.charge} with ${ANION_NAME[rule.anion]} is covalent by Fajans' rules (${ANION_NAME[rule.anion]}s from +${MOLECULAR_FROM_CHARGE[rule.anion]} up are molecular or polymeric, common practice), so ${name} is taken as a molecular substance, not an ionic solid; its state is not tabulated here.`,
      source: "Fajans' rules (common practice)",
    };
  }
  return null;
}
