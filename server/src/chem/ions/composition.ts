/**
 * Reading a salt whatever order its formula is written in: the formula's atoms, less its counter-cations
 * (the metals it contains, and ammonium where the text shows NH4), are matched against the anion table by
 * composition. So `C6H5Na3O7` and `Na3C6H5O7` are both trisodium citrate, `C12H25NaO4S` is sodium
 * dodecyl sulfate, `Na2O4S` (a Hill formula) is sodium sulfate.
 *
 * Only the composition is matched, never the order, so this reading is used where the formula as written
 * names no polyatomic anion (see charge/balance.ts): what a chemist wrote as `Ni(SO4)2` stays two sulfates,
 * not one peroxodisulfate.
 */
import { isMetal } from '../data/elements';
import { ANIONS, CATIONS, type IonDef } from '../data/ions';
import type { FormulaItem } from '../formula/ast';
import { cleanCount, formulaAtoms, type AtomCounts } from '../formula/compute';
import { parseFormula } from '../formula/parse';
import { ionOptions, metalCharges, type Segment } from '../charge/segments';
import { SALT_STATES } from '../data/states';

/** A composition as a key: elements in alphabetical order with their counts (`C2H3O2`, `O4S`). */
export const keyOfAtoms = (atoms: AtomCounts) =>
  Object.keys(atoms)
    .sort()
    .map((el) => `${el}${cleanCount(atoms[el])}`)
    .join('');

/** Anions by composition key (one entry per ion; all forms of an ion have the same atoms). */
const BY_COMPOSITION = new Map<string, IonDef[]>();
for (const ion of ANIONS) {
  const r = parseFormula(ion.forms[0]);
  if (!r.ok || !r.formula) continue;
  const atoms = formulaAtoms(r.formula);
  // Monatomic and homonuclear ions (O2, S2, N3, I3…) are read from the sequence, never by composition.
  if (Object.keys(atoms).length < 2) continue;
  const k = keyOfAtoms(atoms);
  const at = BY_COMPOSITION.get(k);
  if (at) at.push(ion);
  else BY_COMPOSITION.set(k, [ion]);
}
const AMMONIUM = CATIONS.find((c) => c.forms[0] === 'NH4') as IonDef;

/** How many NH4 units the text shows (`(NH4)2CO3` → 2, `CH3COONH4` → 1), brackets multiplied out. */
export function visibleAmmonium(items: readonly FormulaItem[], factor = 1): number {
  let n = 0;
  for (let i = 0; i < items.length; i++) {
    const it = items[i];
    if (it.kind === 'group') {
      const inner = it.items;
      if (
        inner.length === 2 &&
        inner[0].kind === 'element' &&
        inner[0].symbol === 'N' &&
        inner[0].count === 1 &&
        inner[1].kind === 'element' &&
        inner[1].symbol === 'H' &&
        inner[1].count === 4
      )
        n += it.count * factor;
      else n += visibleAmmonium(inner, factor * it.count);
    } else if (it.kind === 'element' && it.symbol === 'N' && it.count === 1) {
      const next = items[i + 1];
      if (next && next.kind === 'element' && next.symbol === 'H' && next.count === 4) n += factor;
    }
  }
  return n;
}

/**
 * Readings of a part as counter-cations with one kind of table anion, by composition (at most a few).
 * Segments span the whole part (`start`, `end`); each metal carries its salt states.
 */
export function compositionReadings(atoms: AtomCounts, items: readonly FormulaItem[], span: { start: number; end: number }): Segment[][] {
  const els = Object.keys(atoms);
  const metals = els.filter(isMetal);
  const nh4Max = visibleAmmonium(items);
  if (metals.length === 0 && nh4Max === 0) return [];
  if (metals.some((m) => !Number.isInteger(atoms[m]))) return [];
  const out: Segment[][] = [];
  for (let k = nh4Max; k >= 0; k--) {
    if (k === 0 && metals.length === 0) break;
    const rest: AtomCounts = {};
    for (const el of els) if (!metals.includes(el)) rest[el] = atoms[el];
    if (k > 0) {
      rest.N = (rest.N ?? 0) - k;
      rest.H = (rest.H ?? 0) - 4 * k;
      if (rest.N < 0 || rest.H < 0) continue;
      if (rest.N === 0) delete rest.N;
      if (rest.H === 0) delete rest.H;
    }
    const restEls = Object.keys(rest);
    if (restEls.length < 2) continue;
    for (let m = 1; m <= 8; m++) {
      const unit: AtomCounts = {};
      let whole = true;
      for (const el of restEls) {
        const q = rest[el] / m;
        if (Math.abs(q - Math.round(q)) > 1e-9) whole = false;
        unit[el] = Math.round(q);
      }
      if (!whole) continue;
      for (const ion of BY_COMPOSITION.get(keyOfAtoms(unit)) ?? []) {
        const segs: Segment[] = metals.map((el) => ({
          kind: 'metal',
          role: 'cation',
          ionText: el,
          bracket: '',
          multiplicity: atoms[el],
          start: span.start,
          end: span.end,
          element: el,
          unitOptions: SALT_STATES[el] ? SALT_STATES[el].map((charge, j) => ({ charge, cost: j === 0 ? 0 : 0.25 })) : metalCharges(el, false),
        }));
        if (k > 0)
          segs.push({
            kind: 'polyatomic',
            role: 'cation',
            ion: AMMONIUM,
            ionText: 'NH4',
            bracket: '',
            multiplicity: k,
            start: span.start,
            end: span.end,
            unitOptions: ionOptions(AMMONIUM),
          });
        segs.push({
          kind: 'polyatomic',
          role: 'anion',
          ion,
          ionText: ion.forms[0],
          bracket: '',
          multiplicity: m,
          start: span.start,
          end: span.end,
          unitOptions: ionOptions(ion),
        });
        out.push(segs);
        if (out.length >= 8) return out;
      }
    }
  }
  return out;
}
