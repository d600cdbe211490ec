/**
 * The units of a batch, in one table: every stage reads amounts through it, and the messages that list
 * the accepted units are made from it.
 *
 * Each unit has a kind, a factor to its kind's base (g, mol, mol/L, L; a mass fraction in percent), the
 * other spellings read as it (ASCII `u` for µ, `mol/L` for M, `%w/w` for wt%), and the places it may
 * stand: on an ingredient line, in `volume:` or in `total:`. Units marked `listed` for a place are the
 * ones its messages name; the others are accepted there without being offered (the µ units, mg for a
 * total).
 */

/** Where a unit may stand. */
export type UnitPlace = 'ingredient' | 'volume' | 'total';

export type UnitKind = 'mass' | 'amount' | 'concentration' | 'fraction' | 'volume';

export interface BatchUnit {
  /** The unit as the results write it. */
  unit: string;
  kind: UnitKind;
  /** Multiply by this for g, mol, mol/L or L (1 for wt%, a percentage). */
  factor: number;
  /** Other spellings read as this unit. */
  aliases: readonly string[];
  /** Where it is accepted. */
  places: readonly UnitPlace[];
  /** Where the messages that list the accepted units name it. */
  listed: readonly UnitPlace[];
}

export const BATCH_UNITS = [
  { unit: 'g', kind: 'mass', factor: 1, aliases: [], places: ['ingredient', 'total'], listed: ['ingredient', 'total'] },
  { unit: 'mg', kind: 'mass', factor: 1e-3, aliases: [], places: ['ingredient', 'total'], listed: ['ingredient'] },
  { unit: 'µg', kind: 'mass', factor: 1e-6, aliases: ['ug'], places: ['ingredient'], listed: [] },
  { unit: 'kg', kind: 'mass', factor: 1e3, aliases: [], places: ['ingredient', 'total'], listed: ['ingredient', 'total'] },
  { unit: 'mol', kind: 'amount', factor: 1, aliases: [], places: ['ingredient'], listed: ['ingredient'] },
  { unit: 'mmol', kind: 'amount', factor: 1e-3, aliases: [], places: ['ingredient'], listed: ['ingredient'] },
  { unit: 'µmol', kind: 'amount', factor: 1e-6, aliases: ['umol'], places: ['ingredient'], listed: [] },
  { unit: 'M', kind: 'concentration', factor: 1, aliases: ['mol/L'], places: ['ingredient'], listed: ['ingredient'] },
  { unit: 'mM', kind: 'concentration', factor: 1e-3, aliases: ['mmol/L'], places: ['ingredient'], listed: ['ingredient'] },
  { unit: 'µM', kind: 'concentration', factor: 1e-6, aliases: ['uM'], places: ['ingredient'], listed: [] },
  { unit: 'wt%', kind: 'fraction', factor: 1, aliases: ['%w/w', '%'], places: ['ingredient'], listed: ['ingredient'] },
  { unit: 'L', kind: 'volume', factor: 1, aliases: ['l'], places: ['volume'], listed: ['volume'] },
  { unit: 'mL', kind: 'volume', factor: 1e-3, aliases: ['ml'], places: ['volume'], listed: ['volume'] },
  { unit: 'µL', kind: 'volume', factor: 1e-6, aliases: ['uL'], places: ['volume'], listed: ['volume'] },
] as const satisfies readonly BatchUnit[];

/** A unit an ingredient line can be given in (as the results write it). */
export type AmountUnit = Exclude<(typeof BATCH_UNITS)[number], { kind: 'volume' }>['unit'];

/** Every spelling, to its unit (a Map: a unit named like an object property is no unit). */
const BY_SPELLING = new Map<string, BatchUnit>();
for (const u of BATCH_UNITS as readonly BatchUnit[]) for (const s of [u.unit, ...u.aliases]) BY_SPELLING.set(s, u);

/** The unit written `text` (any spelling), whatever place it may stand in. */
export function unitSpelled(text: string): BatchUnit | undefined {
  return BY_SPELLING.get(text);
}

/** The unit written `text` where it stands in `place`, or undefined where it is not accepted there. */
export function unitIn(place: UnitPlace, text: string): BatchUnit | undefined {
  const u = BY_SPELLING.get(text);
  return u && u.places.includes(place) ? u : undefined;
}

const LISTS = new Map<UnitPlace, string>();

/** The units a message offers for `place`, in the table's order: `g, mg, kg, … or wt%` (made once per place). */
export function unitList(place: UnitPlace): string {
  let list = LISTS.get(place);
  if (list === undefined) {
    const names = (BATCH_UNITS as readonly BatchUnit[]).filter((u) => u.listed.includes(place)).map((u) => u.unit);
    list = names.length > 1 ? `${names.slice(0, -1).join(', ')} or ${names[names.length - 1]}` : names.join('');
    LISTS.set(place, list);
  }
  return list;
}
