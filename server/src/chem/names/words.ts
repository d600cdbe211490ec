/**
 * The words names are made of: multiplying prefixes, Roman numerals, hydrate words, the anion forms of
 * element names, the older -ous/-ic cation names, and the spelling variants a reader must accept.
 *
 * Sources: IUPAC, Nomenclature of Inorganic Chemistry, Recommendations 2005 (the "Red Book"): Table IV
 * (multiplying prefixes), IR-5.3.2.2 (Stock numbers), IR-5.5 (hydrates), IR-9.2.2.3 (the "-ate" names of
 * central atoms of anionic complexes: ferrate, cuprate, argentate, aurate, plumbate, stannate), Table I
 * (element names, IUPAC spellings). The -ous/-ic names are the traditional ones the trade still uses
 * (common practice); IUPAC 2005 no longer recommends them.
 */

/** Multiplying prefixes for simple names (IUPAC 2005, Table IV); index = count. */
export const PREFIX = [
  '',
  'mono',
  'di',
  'tri',
  'tetra',
  'penta',
  'hexa',
  'hepta',
  'octa',
  'nona',
  'deca',
  'undeca',
  'dodeca',
  'trideca',
  'tetradeca',
  'pentadeca',
  'hexadeca',
  'heptadeca',
  'octadeca',
  'nonadeca',
  'icosa',
];

/** Multiplying prefixes for names that contain a prefix or locant themselves (IUPAC 2005, Table IV). */
export const COMPLEX_PREFIX = ['', '', 'bis', 'tris', 'tetrakis', 'pentakis', 'hexakis', 'heptakis', 'octakis', 'nonakis', 'decakis'];

export const ROMAN = ['0', 'I', 'II', 'III', 'IV', 'V', 'VI', 'VII', 'VIII', 'IX'];
export const ROMAN_VALUE: Record<string, number> = Object.fromEntries(ROMAN.map((r, i) => [r.toLowerCase(), i]));

/** Hydrate words (IUPAC 2005, IR-5.5; hemi and sesqui are the trade's words for ½ and 1½). */
export const HYDRATE_WORDS: Array<[string, number]> = [
  ['hemihydrate', 0.5],
  ['sesquihydrate', 1.5],
  ['monohydrate', 1],
  ...PREFIX.slice(2, 21).map((p, i): [string, number] => [`${p}hydrate`, i + 2]),
];
export const hydrateWord = (n: number): string | undefined => HYDRATE_WORDS.find(([, v]) => v === n)?.[0];

/** Central atoms of anionic complexes whose "-ate" name is built on the Latin stem (IUPAC 2005, IR-9.2.2.3). */
const LATIN_ATE: Record<string, string> = {
  Fe: 'ferrate',
  Cu: 'cuprate',
  Ag: 'argentate',
  Au: 'aurate',
  Pb: 'plumbate',
  Sn: 'stannate',
  Hg: 'mercurate',
  // Not Latin, but not the plain rule either (IUPAC 2005, Table IX: molybdate, arsenate).
  Mo: 'molybdate',
  As: 'arsenate',
};

/** The "-ate" form of an element's name, for the central atom of an anionic complex. */
export function ateName(symbol: string, name: string): string {
  const latin = LATIN_ATE[symbol];
  if (latin) return latin;
  for (const [end, cut] of [
    ['ium', 3],
    ['ese', 3],
    ['um', 2],
    ['on', 2],
    ['en', 2],
    ['y', 1],
    ['ine', 3],
    ['e', 1],
  ] as const)
    if (name.endsWith(end)) return name.slice(0, name.length - cut) + 'ate';
  return name + 'ate';
}

/** Traditional cation names with -ous (lower) and -ic (higher state); common practice. */
export const OLD_CATION_NAMES: Record<string, { symbol: string; charge: number }> = {
  ferrous: { symbol: 'Fe', charge: 2 },
  ferric: { symbol: 'Fe', charge: 3 },
  cuprous: { symbol: 'Cu', charge: 1 },
  cupric: { symbol: 'Cu', charge: 2 },
  stannous: { symbol: 'Sn', charge: 2 },
  stannic: { symbol: 'Sn', charge: 4 },
  plumbous: { symbol: 'Pb', charge: 2 },
  plumbic: { symbol: 'Pb', charge: 4 },
  cobaltous: { symbol: 'Co', charge: 2 },
  cobaltic: { symbol: 'Co', charge: 3 },
  chromous: { symbol: 'Cr', charge: 2 },
  chromic: { symbol: 'Cr', charge: 3 },
  manganous: { symbol: 'Mn', charge: 2 },
  manganic: { symbol: 'Mn', charge: 3 },
  nickelous: { symbol: 'Ni', charge: 2 },
  mercuric: { symbol: 'Hg', charge: 2 },
  aurous: { symbol: 'Au', charge: 1 },
  auric: { symbol: 'Au', charge: 3 },
  ceric: { symbol: 'Ce', charge: 4 },
  cerous: { symbol: 'Ce', charge: 3 },
  titanous: { symbol: 'Ti', charge: 3 },
  vanadous: { symbol: 'V', charge: 2 },
  antimonous: { symbol: 'Sb', charge: 3 },
  thallous: { symbol: 'Tl', charge: 1 },
  thallic: { symbol: 'Tl', charge: 3 },
};

/**
 * Spelling variants read as the IUPAC spelling, applied to a squashed lower-case name (see `squash`):
 * British and American spellings (sulphate/sulfate, aluminum/aluminium, cesium/caesium), and the older
 * elided prefixes of binary oxides (pentoxide for pentaoxide; IUPAC 2005, IR-5.2, keeps the vowel and
 * allows only "monoxide").
 */
const SPELLINGS: Array<[string, RegExp, string]> = [
  ['sulph', /sulph/g, 'sulf'],
  ['aluminum', /aluminum/g, 'aluminium'],
  ['cesium', /cesium/g, 'caesium'],
  ['oxide', /(tetr|pent|hex|hept|oct|non|dec)oxide/g, '$1aoxide'],
  ['monooxide', /monooxide/g, 'monoxide'],
  ['glycerine', /glycerine/g, 'glycerin'],
  ['saltpeter', /saltpeter/g, 'saltpetre'],
  ['deioniz', /deioniz/g, 'deionis'],
  ['ethylalcohol', /ethylalcohol/g, 'ethanol'],
  ['κ', /κ/g, 'k'],
  ['kappa', /kappa/g, 'k'],
];

/**
 * A name reduced to the key it is matched by: lower case, the spelling variants above, and no spaces,
 * hyphens, commas, primes or periods, so that `Copper (II) Sulphate Penta-hydrate` and
 * `copper(II) sulfate pentahydrate` have one key. Em and en dashes (IUPAC's `—water (1/5)`) go too.
 */
export function squash(name: string): string {
  let s = name.toLowerCase().replace(/[\s\-‐‑‒–—_,'’′″.·]+/g, '');
  // A regular expression only where its word occurs (most names have none of them).
  for (const [word, re, to] of SPELLINGS) if (s.includes(word)) s = s.replace(re, to);
  return s;
}
