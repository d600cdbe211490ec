/**
 * Nitrogen in organic formulas: its oxidation state depends on what it is bonded to, which a condensed
 * structural formula shows and a molecular formula does not.
 *
 * States (IUPAC, Pure Appl. Chem. 88 (2016) 831, bonding electrons to the more electronegative partner;
 * the group states are textbook values, from memory): amines, amides, nitriles, imines and amino acids
 * −3 (N bonded to C and H only); nitroso +1; nitro and nitrite esters +3; nitrate esters +5.
 *
 * A condensed structural formula (`H2NCH2COOH`, `CH3CH2NO2`, `CH3CN`, `CH3CONH2`: some element written
 * more than once, or a bracket) is read group by group: the atoms written right after an N are bonded to
 * it. A molecular formula (`C2H5NO2`: each element once) fixes N only where nothing but C and H can bond to
 * it (one N, no O, F or Cl): otherwise isomers differ (C2H5NO2 is glycine, N −3, and nitroethane, N +3),
 * and no state is given.
 */
import type { FormulaItem } from '../formula/ast';

export interface NitrogenSite {
  state: number;
  count: number;
  /** The group as written and its kind, e.g. `NH₂ (amine or amide)`. */
  site: string;
}

export type NitrogenReading = { kind: 'sites'; sites: NitrogenSite[] } | { kind: 'undetermined'; reason: string };

interface Flat {
  symbol: string;
  count: number;
  /** Multiplicity from the brackets around it. */
  factor: number;
}

/** Elements in written order, brackets opened (a bracket's count multiplies its atoms). */
function flatten(items: readonly FormulaItem[], factor = 1, out: Flat[] = []): Flat[] {
  for (const it of items) {
    if (it.kind === 'element') out.push({ symbol: it.symbol, count: it.count, factor });
    else if (it.kind === 'abbrev') for (const [el, n] of Object.entries(it.atoms)) out.push({ symbol: el, count: n, factor: factor * it.count });
    else flatten(it.items, factor * it.count, out);
  }
  return out;
}

const hasGroup = (items: readonly FormulaItem[]) => items.some((it) => it.kind === 'group' || it.kind === 'abbrev');

/** Is the formula written as a condensed structural formula (an element twice, or a bracket)? */
export function isCondensed(items: readonly FormulaItem[]): boolean {
  if (hasGroup(items)) return true;
  const seen = new Set<string>();
  for (const it of items) {
    if (it.kind !== 'element') continue;
    if (seen.has(it.symbol)) return true;
    seen.add(it.symbol);
  }
  return false;
}

const sub = (n: number) => (n === 1 ? '' : String(n).replace(/[0-9]/g, (d) => '₀₁₂₃₄₅₆₇₈₉'[Number(d)]));

/** The N of an organic formula: per group where the formula shows the groups, else firm or undetermined. */
export function organicNitrogen(items: readonly FormulaItem[], atoms: Record<string, number>, formulaText: string): NitrogenReading | null {
  if (!atoms.N) return null;
  if (!isCondensed(items)) {
    const others = ['O', 'F', 'Cl'].filter((el) => atoms[el]);
    if (atoms.N === 1 && others.length === 0) return { kind: 'sites', sites: [{ state: -3, count: 1, site: 'N bonded to C and H only' }] };
    const why = atoms.N > 1 && others.length === 0 ? 'N–N bonds (hydrazines, azo compounds) are possible' : `N may be bonded to ${others.join(' or ')}`;
    return {
      kind: 'undetermined',
      reason: `the molecular formula ${formulaText} does not show what N is bonded to (${why}): isomers differ — e.g. C2H5NO2 is glycine (N −3) and nitroethane (N +3). Write a condensed structural formula (H2NCH2COOH, CH3CH2NO2) for a firm state.`,
    };
  }
  const flat = flatten(items);
  const sites: NitrogenSite[] = [];
  for (let i = 0; i < flat.length; i++) {
    const a = flat[i];
    if (a.symbol !== 'N') continue;
    const prev = flat[i - 1];
    const next = flat[i + 1];
    const n = a.count * a.factor;
    if ((next && next.symbol === 'N') || (prev && prev.symbol === 'N') || a.count > 1) {
      return {
        kind: 'undetermined',
        reason: 'an N–N bond (hydrazine, azo or azide group) shares electrons equally, and the formula does not show how many bonds each N has to C, H and O.',
      };
    }
    // An O written right before N is bonded to it unless it is the carbonyl O of a C written just before
    // it (`CONH2`: an amide, the O on the C).
    const prevO = prev && prev.symbol === 'O' && prev.count === 1 && !(flat[i - 2] && flat[i - 2].symbol === 'C' && flat[i - 2].count === 1);
    const nextO = next && next.symbol === 'O' ? next.count : 0;
    if (nextO === 2 && prevO) sites.push({ state: 5, count: n, site: 'ONO₂ (nitrate ester)' });
    else if (nextO === 2) sites.push({ state: 3, count: n, site: 'NO₂ (nitro)' });
    else if (nextO === 1 && prevO) sites.push({ state: 3, count: n, site: 'ONO (nitrite ester)' });
    else if (nextO === 1) sites.push({ state: 1, count: n, site: 'NO (nitroso)' });
    else if (nextO > 2) return { kind: 'undetermined', reason: `N followed by O${nextO} is no usual group.` };
    else if (prevO) return { kind: 'undetermined', reason: 'an N bonded to O and to H or C (hydroxylamine, alkoxyamine) has no state the formula fixes.' };
    else {
      const h = next && next.symbol === 'H' ? next.count : i === 1 && prev.symbol === 'H' ? prev.count : 0;
      const label = next && next.symbol === 'H' ? `NH${sub(h)}` : h ? `H${sub(h)}N` : prev && prev.symbol === 'C' && !next ? 'C≡N' : 'N';
      const kind = label === 'C≡N' ? 'nitrile' : h === 3 ? 'ammonium-type' : 'amine or amide';
      sites.push({ state: -3, count: n, site: `${label} (${kind})` });
    }
  }
  return { kind: 'sites', sites };
}
