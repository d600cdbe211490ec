/**
 * Alloy designations by chemical symbols (`AlSi10Mg`, `CuZn37`, `AlMg3`, `CuSn8`, `CuNi10Fe1Mn`): a base
 * metal, then the alloying elements, each with its nominal content in mass percent (none written: a minor
 * addition, typically under 1 %); the base metal is the balance. This is the scheme of the European and
 * ISO designations (EN 573-2 for aluminium, EN 1412 for copper, EN 1754 for magnesium, ISO 209; common
 * practice), and it is not a chemical formula: the numbers are not atom counts.
 *
 * Where it applies (every condition):
 * - the text is one part with no brackets, charge, hydrate or state symbol, written as element symbols;
 * - the first symbol is a base metal of these designations (Al, Cu, Mg, Zn, Ni, Ti, Sn, Pb, Co) without
 *   a count;
 * - every alloying element is a metal or one of B, C, Si, P, Te (no O, N, H, S, halogens: `NaCl2`,
 *   `CuCl2`, `CuSO4` stay formulas), each written once, none equal to the base;
 * - at least one number is written, each at most 50, all together at most 50 (the base is the balance and
 *   the largest part), and the numbers do not increase along the designation (elements are written in
 *   decreasing content: `CuNi10Fe1Mn`, `AlSi7Mg0.3`);
 * - it is not one of the binary phases chemists write as formulas (MgB2, CuAl2, MgZn2, NiAl3, TiAl3,
 *   TiB2, …; ASM Handbook Vol. 3, Alloy Phase Diagrams, from memory), where the number is an atom count.
 */
import { isMetal } from '../data/elements';
import type { Formula } from './ast';

export interface AlloyComponent {
  element: string;
  /** Nominal mass percent; null for a minor addition written without a number. */
  massPercent: number | null;
  note?: string;
}

export interface AlloyDesignation {
  base: string;
  /** The base's share: 100 minus the numbered additions (less the minor ones). */
  baseMassPercent: number;
  components: AlloyComponent[];
}

const BASES = new Set(['Al', 'Cu', 'Mg', 'Zn', 'Ni', 'Ti', 'Sn', 'Pb', 'Co']);
const NONMETAL_ADDITIONS = new Set(['B', 'C', 'Si', 'P', 'Te']);
/** Binary phases written as formulas whose second count would otherwise read as a mass percent. */
const PHASES = new Set([
  'MgB2',
  'AlB2',
  'AlB12',
  'TiB2',
  'ZrB2',
  'MgZn2',
  'MgCu2',
  'MgNi2',
  'CuAl2',
  'NiAl3',
  'TiAl3',
  'TiSi2',
  'NiSi2',
  'CoSi2',
  'CoSb3',
  'CuZr2',
  'TiCr2',
  'ZnSb2',
  'NiSn4',
  'CoAl3',
  'AlCu2',
  'TiFe2',
  'TiCo2',
  'MgSn2',
  'NiP2',
  'CuP2',
  'CoP3',
]);

/** The nominal composition of an alloy designation, or null where the text is not one (see the rules above). */
export function readAlloyDesignation(f: Formula): AlloyDesignation | null {
  if (f.parts.length !== 1 || f.charge !== 0 || f.state || f.variableCounts) return null;
  const items = f.parts[0].items;
  if (items.length < 2 || f.parts[0].multiplierText !== '') return null;
  if (items.some((it) => it.kind !== 'element' || it.stock !== undefined)) return null;
  const [base, ...rest] = items as Array<Extract<(typeof items)[number], { kind: 'element' }>>;
  if (!BASES.has(base.symbol) || base.end !== base.symbolEnd) return null;
  if (PHASES.has(f.text)) return null;
  const seen = new Set([base.symbol]);
  const components: AlloyComponent[] = [];
  let total = 0;
  let previous = Infinity;
  let numbered = 0;
  for (const it of rest) {
    if (seen.has(it.symbol)) return null;
    seen.add(it.symbol);
    if (!isMetal(it.symbol) && !NONMETAL_ADDITIONS.has(it.symbol)) return null;
    const written = it.end > it.symbolEnd;
    if (written) {
      if (it.count > 50 || it.count > previous) return null;
      previous = it.count;
      total += it.count;
      numbered++;
      components.push({ element: it.symbol, massPercent: it.count });
    } else components.push({ element: it.symbol, massPercent: null, note: 'minor addition (typically under 1 %)' });
  }
  if (numbered === 0 || total > 50) return null;
  return { base: base.symbol, baseMassPercent: Math.round((100 - total) * 1e6) / 1e6, components };
}
