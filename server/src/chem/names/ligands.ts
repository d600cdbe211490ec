/**
 * Ligands of coordination compounds: the formula a ligand is written with, its charge as a ligand, and
 * its name in a complex.
 *
 * Source: IUPAC, Nomenclature of Inorganic Chemistry, Recommendations 2005, IR-9.2.2 and Table VII
 * (anionic ligands end in -ido/-ato/-ito: chlorido, cyanido, hydroxido, oxido; neutral ligands keep
 * their names, with ammine, aqua, carbonyl and nitrosyl as the special ones; κ marks the donor atom of
 * an ambidentate ligand). `older` are the names before 2005 (chloro, cyano, hydroxo, oxo, nitro,
 * isothiocyanato), which a reader still meets on labels and in catalogues (common practice).
 */
export interface LigandDef {
  /** Keys the ligand is written with inside a complex, as element symbols and counts (`NH3`, `OH2`). */
  forms: string[];
  charge: number;
  name: string;
  older?: string[];
  /** Cited with bis/tris/tetrakis and in brackets (a name with locants, or one that could be misread). */
  enclosed?: boolean;
}

export const LIGANDS: LigandDef[] = [
  { forms: ['NH3', 'H3N'], charge: 0, name: 'ammine' },
  { forms: ['H2O', 'OH2'], charge: 0, name: 'aqua', older: ['aquo'] },
  { forms: ['CO'], charge: 0, name: 'carbonyl' },
  { forms: ['NO'], charge: 0, name: 'nitrosyl' },
  { forms: ['Cl'], charge: -1, name: 'chlorido', older: ['chloro'] },
  { forms: ['F'], charge: -1, name: 'fluorido', older: ['fluoro'] },
  { forms: ['Br'], charge: -1, name: 'bromido', older: ['bromo'] },
  { forms: ['I'], charge: -1, name: 'iodido', older: ['iodo'] },
  { forms: ['CN'], charge: -1, name: 'cyanido', older: ['cyano'] },
  { forms: ['OH', 'HO'], charge: -1, name: 'hydroxido', older: ['hydroxo'] },
  { forms: ['O'], charge: -2, name: 'oxido', older: ['oxo'] },
  { forms: ['H'], charge: -1, name: 'hydrido', older: ['hydro'] },
  { forms: ['N3'], charge: -1, name: 'azido' },
  { forms: ['NO2'], charge: -1, name: 'nitrito-κN', older: ['nitro'], enclosed: true },
  { forms: ['ONO'], charge: -1, name: 'nitrito-κO', enclosed: true },
  { forms: ['SCN'], charge: -1, name: 'thiocyanato-κS', older: ['thiocyanato'], enclosed: true },
  { forms: ['NCS'], charge: -1, name: 'thiocyanato-κN', older: ['isothiocyanato'], enclosed: true },
  { forms: ['C2O4', 'ox'], charge: -2, name: 'oxalato' },
  { forms: ['CO3'], charge: -2, name: 'carbonato' },
  { forms: ['SO4'], charge: -2, name: 'sulfato' },
  { forms: ['S2O3'], charge: -2, name: 'thiosulfato' },
  { forms: ['en'], charge: 0, name: 'ethane-1,2-diamine', older: ['ethylenediamine'], enclosed: true },
  { forms: ['py'], charge: 0, name: 'pyridine', enclosed: true },
  { forms: ['bpy'], charge: 0, name: '2,2′-bipyridine', older: ['bipyridine', 'bipyridyl'], enclosed: true },
  { forms: ['phen'], charge: 0, name: '1,10-phenanthroline', older: ['phenanthroline'], enclosed: true },
  { forms: ['acac'], charge: -1, name: 'acetylacetonato', older: ['pentane-2,4-dionato'] },
];

const BY_FORM = new Map<string, LigandDef>();
for (const l of LIGANDS) for (const f of l.forms) BY_FORM.set(f, l);

/** The ligand written `key` (element symbols and counts, or an abbreviation). */
export function ligandByForm(key: string): LigandDef | undefined {
  return BY_FORM.get(key);
}
