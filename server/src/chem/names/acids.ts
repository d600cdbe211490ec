/**
 * Acids by their usual names, with the number of protons each gives up to a strong base (its basicity,
 * used for normality).
 *
 * Sources, per row (`src`):
 * - RB: IUPAC, Nomenclature of Inorganic Chemistry, Recommendations 2005, IR-8 and Table IR-8.1 (the
 *   acceptable names of the oxoacids: sulfuric, nitric, phosphoric, phosphonic, phosphinic acid …).
 * - CRC: CRC Handbook of Chemistry and Physics, "Dissociation constants of inorganic acids and bases" and
 *   "… of organic acids and bases" (how many dissociable protons; boric acid is a monobasic Lewis acid,
 *   phosphonic acid dibasic, phosphinic acid monobasic), from memory.
 * - CP: common practice (the trade names of organic acids of formulation work).
 *
 * `aqueous`: the name is that of the solution in water; the pure substance is named as a hydrogen
 * compound (HCl is hydrogen chloride, its solution hydrochloric acid; IUPAC 2005, IR-8.1).
 */
export interface AcidDef {
  name: string;
  /** Written forms (ASCII), canonical first. */
  forms: string[];
  /** Protons given up to a strong base. */
  basicity: number;
  /** The name of the fully deprotonated anion. */
  anion: string;
  /** The name of the pure substance where the acid's name is that of its solution. */
  compound?: string;
  /** Where the name is that of a solution: its usual commercial strengths (% by mass), for messages. */
  typical?: string;
  /** Other names read as this acid. */
  aliases?: string[];
  src: 'RB' | 'CRC' | 'CP' | 'RB, CRC';
}

export const ACIDS: AcidDef[] = [
  { name: 'sulfuric acid', forms: ['H2SO4'], basicity: 2, anion: 'sulfate', src: 'RB, CRC' },
  { name: 'sulfurous acid', forms: ['H2SO3'], basicity: 2, anion: 'sulfite', src: 'RB, CRC' },
  { name: 'thiosulfuric acid', forms: ['H2S2O3'], basicity: 2, anion: 'thiosulfate', src: 'RB' },
  { name: 'nitric acid', forms: ['HNO3'], basicity: 1, anion: 'nitrate', src: 'RB, CRC' },
  { name: 'nitrous acid', forms: ['HNO2'], basicity: 1, anion: 'nitrite', src: 'RB, CRC' },
  { name: 'phosphoric acid', forms: ['H3PO4'], basicity: 3, anion: 'phosphate', aliases: ['orthophosphoric acid'], src: 'RB, CRC' },
  { name: 'phosphonic acid', forms: ['H3PO3'], basicity: 2, anion: 'phosphonate', aliases: ['phosphorous acid'], src: 'RB, CRC' },
  { name: 'phosphinic acid', forms: ['H3PO2'], basicity: 1, anion: 'phosphinate', aliases: ['hypophosphorous acid'], src: 'RB, CRC' },
  { name: 'diphosphoric acid', forms: ['H4P2O7'], basicity: 4, anion: 'diphosphate', aliases: ['pyrophosphoric acid'], src: 'RB, CRC' },
  { name: 'carbonic acid', forms: ['H2CO3'], basicity: 2, anion: 'carbonate', src: 'RB, CRC' },
  { name: 'perchloric acid', forms: ['HClO4'], basicity: 1, anion: 'perchlorate', src: 'RB, CRC' },
  { name: 'chloric acid', forms: ['HClO3'], basicity: 1, anion: 'chlorate', src: 'RB, CRC' },
  { name: 'chlorous acid', forms: ['HClO2'], basicity: 1, anion: 'chlorite', src: 'RB, CRC' },
  { name: 'hypochlorous acid', forms: ['HClO', 'HOCl'], basicity: 1, anion: 'hypochlorite', src: 'RB, CRC' },
  { name: 'bromic acid', forms: ['HBrO3'], basicity: 1, anion: 'bromate', src: 'RB' },
  { name: 'hypobromous acid', forms: ['HBrO', 'HOBr'], basicity: 1, anion: 'hypobromite', src: 'RB' },
  { name: 'iodic acid', forms: ['HIO3'], basicity: 1, anion: 'iodate', src: 'RB, CRC' },
  { name: 'periodic acid', forms: ['HIO4'], basicity: 1, anion: 'periodate', src: 'RB, CRC' },
  { name: 'boric acid', forms: ['H3BO3', 'B(OH)3'], basicity: 1, anion: 'borate', aliases: ['boracic acid', 'orthoboric acid'], src: 'RB, CRC' },
  { name: 'chromic acid', forms: ['H2CrO4'], basicity: 2, anion: 'chromate', src: 'RB' },
  { name: 'permanganic acid', forms: ['HMnO4'], basicity: 1, anion: 'permanganate', src: 'RB' },
  { name: 'selenic acid', forms: ['H2SeO4'], basicity: 2, anion: 'selenate', src: 'RB' },
  { name: 'arsenic acid', forms: ['H3AsO4'], basicity: 3, anion: 'arsenate', src: 'RB, CRC' },
  { name: 'silicic acid', forms: ['H4SiO4', 'Si(OH)4'], basicity: 4, anion: 'silicate', src: 'RB' },
  { name: 'hexafluorosilicic acid', forms: ['H2SiF6'], basicity: 2, anion: 'hexafluorosilicate', aliases: ['fluorosilicic acid'], src: 'RB' },
  { name: 'tetrafluoroboric acid', forms: ['HBF4'], basicity: 1, anion: 'tetrafluoroborate', aliases: ['fluoroboric acid'], src: 'RB' },
  {
    name: 'sulfamic acid',
    forms: ['H3NSO3', 'NH2SO3H', 'H2NSO3H', 'HSO3NH2'],
    basicity: 1,
    anion: 'sulfamate',
    aliases: ['amidosulfuric acid'],
    src: 'RB, CRC',
  },
  {
    name: 'hydrochloric acid',
    forms: ['HCl'],
    basicity: 1,
    anion: 'chloride',
    compound: 'hydrogen chloride',
    typical: '32–37 %',
    aliases: ['muriatic acid', 'spirit of salt', 'chlorhydric acid'],
    src: 'RB, CRC',
  },
  { name: 'hydrofluoric acid', forms: ['HF'], basicity: 1, anion: 'fluoride', compound: 'hydrogen fluoride', typical: '40–50 %', src: 'RB, CRC' },
  { name: 'hydrobromic acid', forms: ['HBr'], basicity: 1, anion: 'bromide', compound: 'hydrogen bromide', typical: '48 %', src: 'RB, CRC' },
  {
    name: 'hydroiodic acid',
    forms: ['HI'],
    basicity: 1,
    anion: 'iodide',
    compound: 'hydrogen iodide',
    typical: '57 %',
    aliases: ['hydriodic acid'],
    src: 'RB, CRC',
  },
  { name: 'hydrocyanic acid', forms: ['HCN'], basicity: 1, anion: 'cyanide', compound: 'hydrogen cyanide', aliases: ['prussic acid'], src: 'RB, CRC' },
  {
    name: 'acetic acid',
    forms: ['CH3COOH', 'CH3CO2H', 'HC2H3O2', 'AcOH', 'HOAc'],
    basicity: 1,
    anion: 'acetate',
    aliases: ['ethanoic acid', 'glacial acetic acid'],
    src: 'CRC',
  },
  { name: 'formic acid', forms: ['HCOOH', 'HCO2H'], basicity: 1, anion: 'formate', aliases: ['methanoic acid'], src: 'CRC' },
  { name: 'oxalic acid', forms: ['H2C2O4', '(COOH)2', 'HOOCCOOH', 'C2H2O4'], basicity: 2, anion: 'oxalate', aliases: ['ethanedioic acid'], src: 'CRC' },
  { name: 'citric acid', forms: ['C6H8O7', 'H3C6H5O7'], basicity: 3, anion: 'citrate', src: 'CRC' },
  { name: 'tartaric acid', forms: ['C4H6O6', 'H2C4H4O6'], basicity: 2, anion: 'tartrate', src: 'CRC' },
  { name: 'lactic acid', forms: ['C3H6O3', 'CH3CH(OH)COOH'], basicity: 1, anion: 'lactate', src: 'CRC' },
  { name: 'benzoic acid', forms: ['C6H5COOH', 'C7H6O2'], basicity: 1, anion: 'benzoate', src: 'CRC' },
  { name: 'glycolic acid', forms: ['HOCH2COOH', 'C2H4O3'], basicity: 1, anion: 'glycolate', src: 'CRC' },
  { name: 'gluconic acid', forms: ['C6H12O7', 'HOCH2(CHOH)4COOH'], basicity: 1, anion: 'gluconate', src: 'CRC' },
  { name: 'methanesulfonic acid', forms: ['CH3SO3H', 'CH4O3S'], basicity: 1, anion: 'methanesulfonate', src: 'CRC' },
];

const BY_FORM = new Map<string, AcidDef>();
for (const a of ACIDS) for (const f of a.forms) BY_FORM.set(f, a);

/** The acid written `ascii` (one of its forms, charge and state left off). */
export function acidByForm(ascii: string): AcidDef | undefined {
  return BY_FORM.get(ascii);
}
