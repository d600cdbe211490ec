/**
 * Buffers a batch line can design (`phosphate buffer 0.1 M to pH 7.40`): for each acid–base system of
 * the tables, the pairs of shelf substances that make it, an acid form and a base form (one of them may
 * be a strong acid or base that titrates the other, as glycine–HCl or KHP–NaOH are made). `{M}` is the
 * counter-ion: sodium unless the line says `potassium` (or `sodium`). The pairs are the usual
 * laboratory recipes (common practice); which pair, and how much of each, is solved with the full model
 * (activities included) for the batch the buffer is made in.
 */
/** A form: one formula with `{M}` for the counter-ion, or one per counter-ion where the shelf hydrates differ. */
export type BufferForm = string | { Na: string; K: string };

export interface BufferPair {
  acid: BufferForm;
  base: BufferForm;
}

export interface BufferSystem {
  /** The acid–base system of the tables (acids.ts id). */
  system: string;
  /** Words that name it on a buffer line, lower case. */
  names: string[];
  /** Counter-ions the line may ask for (the first is the default). */
  counterIons: Array<'Na' | 'K'>;
  pairs: BufferPair[];
}

export const BUFFER_SYSTEMS: BufferSystem[] = [
  {
    system: 'phosphate',
    names: ['phosphate'],
    counterIons: ['Na', 'K'],
    pairs: [
      { acid: 'H3PO4', base: '{M}H2PO4' },
      { acid: '{M}H2PO4', base: '{M}2HPO4' },
      { acid: '{M}2HPO4', base: '{M}3PO4' },
    ],
  },
  {
    system: 'citrate',
    names: ['citrate', 'citric'],
    counterIons: ['Na', 'K'],
    pairs: [{ acid: 'C6H8O7·H2O', base: { Na: 'Na3C6H5O7·2H2O', K: 'K3C6H5O7·H2O' } }],
  },
  { system: 'acetate', names: ['acetate', 'acetic'], counterIons: ['Na', 'K'], pairs: [{ acid: 'CH3COOH', base: 'CH3COO{M}' }] },
  { system: 'formate', names: ['formate', 'formic'], counterIons: ['Na', 'K'], pairs: [{ acid: 'HCOOH', base: 'HCOO{M}' }] },
  { system: 'lactate', names: ['lactate', 'lactic'], counterIons: ['Na', 'K'], pairs: [{ acid: 'C3H6O3', base: '{M}C3H5O3' }] },
  {
    system: 'carbonate',
    names: ['carbonate', 'bicarbonate', 'carbonate-bicarbonate'],
    counterIons: ['Na', 'K'],
    pairs: [{ acid: '{M}HCO3', base: '{M}2CO3' }],
  },
  {
    system: 'borate',
    names: ['borate', 'boric', 'borax'],
    counterIons: ['Na'],
    pairs: [
      { acid: 'H3BO3', base: 'Na2B4O7·10H2O' },
      { acid: 'H3BO3', base: 'NaOH' },
    ],
  },
  {
    system: 'phthalate',
    names: ['phthalate', 'phthalic'],
    counterIons: ['K'],
    pairs: [
      { acid: 'HCl', base: 'KHC8H4O4' },
      { acid: 'KHC8H4O4', base: 'NaOH' },
    ],
  },
  { system: 'oxalate', names: ['oxalate', 'oxalic'], counterIons: ['Na', 'K'], pairs: [{ acid: 'H2C2O4·2H2O', base: '{M}2C2O4' }] },
  { system: 'tartrate', names: ['tartrate', 'tartaric'], counterIons: ['Na', 'K'], pairs: [{ acid: 'C4H6O6', base: '{M}2C4H4O6·2H2O' }] },
  { system: 'ammonia', names: ['ammonia', 'ammonium'], counterIons: ['Na'], pairs: [{ acid: 'NH4Cl', base: 'NH3' }] },
  { system: 'tris', names: ['tris', 'tris-hcl', 'trizma'], counterIons: ['Na'], pairs: [{ acid: 'C4H11NO3·HCl', base: 'C4H11NO3' }] },
  {
    system: 'glycine',
    names: ['glycine'],
    counterIons: ['Na', 'K'],
    pairs: [
      { acid: 'HCl', base: 'C2H5NO2' },
      { acid: 'C2H5NO2', base: '{M}OH' },
    ],
  },
  { system: 'mea', names: ['ethanolamine', 'mea', 'monoethanolamine'], counterIons: ['Na'], pairs: [{ acid: 'C2H7NO·HCl', base: 'C2H7NO' }] },
  { system: 'dea', names: ['diethanolamine', 'dea'], counterIons: ['Na'], pairs: [{ acid: 'C4H11NO2·HCl', base: 'C4H11NO2' }] },
  { system: 'tea', names: ['triethanolamine', 'tea'], counterIons: ['Na'], pairs: [{ acid: 'C6H15NO3·HCl', base: 'C6H15NO3' }] },
];

/** The buffer a line names (`phosphate`, `potassium phosphate`, `Tris`), with its counter-ion; null where none. */
export function bufferNamed(words: string): { buffer: BufferSystem; counterIon: 'Na' | 'K' } | null {
  const parts = words.toLowerCase().trim().split(/\s+/);
  let counter: 'Na' | 'K' | undefined;
  if (parts[0] === 'sodium' || parts[0] === 'potassium') {
    counter = parts[0] === 'sodium' ? 'Na' : 'K';
    parts.shift();
  }
  const name = parts.join(' ');
  const buffer = BUFFER_SYSTEMS.find((b) => b.names.includes(name));
  if (!buffer) return null;
  if (counter && !buffer.counterIons.includes(counter)) return null;
  return { buffer, counterIon: counter ?? buffer.counterIons[0] };
}

/** The pair's formulas with the counter-ion put in. */
export function pairFormulas(p: BufferPair, m: 'Na' | 'K'): { acid: string; base: string } {
  const form = (f: BufferForm) => (typeof f === 'string' ? f.replace('{M}', m) : f[m]);
  return { acid: form(p.acid), base: form(p.base) };
}

/** Every name a buffer line accepts, for messages. */
export const BUFFER_NAMES = BUFFER_SYSTEMS.map((b) => b.names[0]);
