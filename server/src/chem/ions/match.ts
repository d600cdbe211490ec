/**
 * Recognising ions in a formula: a run of items, or the content of a bracket, is matched against the
 * ways chemists write each polyatomic ion (exact sequence of symbols and counts, as written).
 */
import { ANIONS, CATIONS, LIGAND_CHARGES, type IonDef } from '../data/ions';
import type { FormulaItem } from '../formula/ast';
import { parseFormula } from '../formula/parse';

/** A sequence key: `S1O4` for SO4; groups and abbreviations contribute their text. */
export function itemsKey(items: readonly FormulaItem[]): string | undefined {
  let key = '';
  for (const it of items) {
    if (it.kind === 'element') {
      if (it.stock !== undefined) return undefined;
      key += it.symbol + it.count;
    } else if (it.kind === 'abbrev') key += it.name + it.count;
    else {
      const inner = itemsKey(it.items);
      if (inner === undefined) return undefined;
      key += '(' + inner + ')' + it.count;
    }
  }
  return key;
}

function keyOf(form: string): string {
  const r = parseFormula(form);
  if (!r.ok || !r.formula || r.formula.parts.length !== 1) throw new Error(`bad ion form ${form}`);
  return itemsKey(r.formula.parts[0].items) as string;
}

export interface IonMatch {
  ion: IonDef;
  role: 'cation' | 'anion';
}

const TABLE = new Map<string, IonMatch[]>();
for (const [list, role] of [
  [ANIONS, 'anion'],
  [CATIONS, 'cation'],
] as const) {
  for (const ion of list) {
    for (const form of ion.forms) {
      const k = keyOf(form);
      const at = TABLE.get(k);
      if (at) at.push({ ion, role });
      else TABLE.set(k, [{ ion, role }]);
    }
  }
}

const LIGANDS = new Map<string, number>();
for (const [form, charge] of Object.entries(LIGAND_CHARGES)) {
  const r = parseFormula(form.length <= 4 && /^[a-z]+$/.test(form) ? `(${form})` : form);
  if (!r.ok || !r.formula) continue;
  const items = r.formula.parts[0].items;
  const inner = items.length === 1 && items[0].kind === 'group' ? items[0].items : items;
  LIGANDS.set(itemsKey(inner) as string, charge);
}

/** Longest ion form, in items, so that run matching stays bounded. */
export const MAX_ION_ITEMS = 6;

export function matchIon(items: readonly FormulaItem[]): IonMatch[] {
  const k = itemsKey(items);
  return k === undefined ? [] : (TABLE.get(k) ?? []);
}

const NONE: IonMatch[] = [];
/** Ions whose written form has this key (see itemsKey). */
export function matchKey(key: string): IonMatch[] {
  return TABLE.get(key) ?? NONE;
}

/** Charge of a ligand written as these items (`NH3`, `CN`, `(en)`), or undefined. */
export function ligandCharge(items: readonly FormulaItem[]): number | undefined {
  const k = itemsKey(items);
  return k === undefined ? undefined : LIGANDS.get(k);
}
