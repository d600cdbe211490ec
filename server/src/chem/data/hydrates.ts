/**
 * The hydrates a salt is commonly sold as, by the Hill formula of the anhydrous salt: the numbers of
 * water of crystallisation of the forms found on a lab's shelf, the usual one first. Used to offer
 * "another form" of a batch line (the hexahydrate for the anhydrous salt and back).
 *
 * FROM MEMORY: the forms as listed in suppliers' catalogues and the Merck Index entries for these salts,
 * recalled without the books at hand. A form missing here is not offered; any form can still be written.
 */
export const COMMON_HYDRATES: Readonly<Record<string, readonly number[]>> = Object.freeze({
  // Sulfates.
  NiO4S: [6, 7],
  CuO4S: [5],
  O4SZn: [7, 1],
  FeO4S: [7],
  MgO4S: [7, 1],
  CoO4S: [7],
  MnO4S: [1],
  Na2O4S: [10],
  Al2O12S3: [18],
  // Chlorides.
  Cl2Ni: [6],
  Cl2Co: [6],
  Cl2Cu: [2],
  CaCl2: [2, 6],
  Cl2Mg: [6],
  BaCl2: [2],
  Cl3Fe: [6],
  Cl2Sn: [2],
  Cl2Mn: [4],
  // Nitrates.
  N2NiO6: [6],
  CuN2O6: [3],
  N2O6Zn: [6],
  CaN2O6: [4],
  FeN3O9: [9],
  // Carbonates, phosphates, borates and others.
  CNa2O3: [10, 1],
  HNa2O4P: [7, 12, 2],
  H2NaO4P: [1, 2],
  B4Na2O7: [10, 5],
  Na2O3S2: [5],
  C2H3NaO2: [3],
  C6H5Na3O7: [2],
  Na2O3Si: [5, 9],
});

/** The usual word for n waters (`hexahydrate`); `n-hydrate` beyond the table. */
export function hydrateWord(n: number): string {
  const words: Record<number, string> = {
    0.5: 'hemihydrate',
    1: 'monohydrate',
    2: 'dihydrate',
    3: 'trihydrate',
    4: 'tetrahydrate',
    5: 'pentahydrate',
    6: 'hexahydrate',
    7: 'heptahydrate',
    8: 'octahydrate',
    9: 'nonahydrate',
    10: 'decahydrate',
    12: 'dodecahydrate',
    18: 'octadecahydrate',
  };
  return words[n] ?? `${n}-hydrate`;
}
