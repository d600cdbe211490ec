/**
 * What a substance gives in water, for a batch's nominal ions: the ions of a strong electrolyte, or why
 * it stays whole. The ionic reading of the formula decides (charge/balance.ts), whatever order the salt
 * is written in (`C6H5Na3O7`, `Na3C6H5O7`).
 *
 * Model (nominal, as the batch header says): salts fully dissolved and dissociated into the ions of their
 * formula; strong acids give up their first proton; weak acids and bases, molecules, oxides and
 * mixed-valence solids stay whole.
 */
import type { FormulaAnalysis } from '../analyse';
import { formatCharge, subscriptDigits } from '../formula/compute';

export interface IonShare {
  ion: string;
  /** ASCII form with caret charge (`SO4^2-`), the key ions are summed by. */
  key: string;
  charge: number;
  count: number;
}

/** Strong acids and the ion they give with their first proton (common practice). */
const STRONG_ACIDS: Record<string, [string, number]> = {
  HCl: ['Cl', -1],
  HBr: ['Br', -1],
  HI: ['I', -1],
  HNO3: ['NO3', -1],
  HClO4: ['ClO4', -1],
  HClO3: ['ClO3', -1],
  H2SO4: ['HSO4', -1],
};

/**
 * "Ammonium hydroxide" is aqueous ammonia, NH3·H2O: a weak base (Kb 1.8 × 10⁻⁵ at 25 °C; CRC Handbook,
 * "Dissociation constants of inorganic acids and bases"), not a salt of NH₄⁺ and OH⁻.
 */
const AQUEOUS_AMMONIA = 'ammonium hydroxide is aqueous ammonia (NH₃·H₂O), a weak base (Kb 1.8 × 10⁻⁵): treated as undissociated';

export function electrolyteIons(a: FormulaAnalysis): { ions: IonShare[]; undissociated?: string } {
  if (!a.ok || !a.formula) return { ions: [], undissociated: 'not readable' };
  const ascii = a.formula.parts.length === 1 ? a.ascii.replace(/\(aq\)$/, '') : '';
  if (a.charge !== 0 && a.formula.parts.length === 1) {
    return { ions: [{ ion: a.display.replace(/\(aq\)$/, ''), key: a.ascii.replace(/\(aq\)$/, ''), charge: a.charge, count: 1 }] };
  }
  const acid = STRONG_ACIDS[ascii];
  if (acid) {
    return {
      ions: [
        { ion: 'H⁺', key: 'H^+', charge: 1, count: 1 },
        { ion: subscriptDigits(acid[0]) + formatCharge(acid[1], true), key: acid[0] + formatCharge(acid[1], false), charge: acid[1], count: 1 },
      ],
    };
  }
  const c = a.charges;
  if (!c || !c.balanced || c.basis !== 'ionic' || !c.ions)
    return { ions: [], undissociated: c?.basis === 'ionic' ? 'charges do not balance' : 'molecular or weak: treated as undissociated' };
  const ions = c.ions.filter((i) => i.role !== 'neutral');
  if (ions.some((i) => i.kind === 'proton')) return { ions: [], undissociated: 'weak acid: treated as undissociated' };
  if (ions.length === 2 && ions.some((i) => i.ionName === 'ammonium') && ions.some((i) => i.ionName === 'hydroxide'))
    return { ions: [], undissociated: AQUEOUS_AMMONIA };
  if (ions.some((i) => i.kind === 'monatomic-anion' && (i.element === 'O' || i.element === 'N' || i.element === 'C')))
    return { ions: [], undissociated: 'oxide, nitride or carbide: not dissolved' };
  if (ions.some((i) => new Set(i.states).size > 1 || !Number.isInteger(i.charge))) return { ions: [], undissociated: 'mixed-valence solid: not dissolved' };
  const out = new Map<string, IonShare>();
  for (const i of ions) {
    const key = (i.kind === 'complex' ? `[${i.text}]` : i.text) + formatCharge(i.charge, false);
    const label = subscriptDigits(i.kind === 'complex' ? `[${i.text}]` : i.text) + formatCharge(i.charge, true);
    const at = out.get(key);
    if (at) at.count += i.count;
    else out.set(key, { ion: label, key, charge: i.charge, count: i.count });
  }
  return { ions: [...out.values()] };
}
