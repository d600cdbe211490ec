/**
 * The usual cautions. Classes follow the GHS hazard classes as the suppliers' safety data sheets commonly
 * assign them (common practice, from memory): strong acids (HCl, HNO3, H2SO4…) fully dissociate; HF,
 * H3PO4 and acetic acid are weak acids that are still corrosive (Skin Corr. 1); HF is also acutely toxic,
 * with calcium gluconate as the standard first aid; NaNO2 is Ox. Sol. 3 and Acute Tox. 3; ethanol,
 * isopropanol, acetone and methanol are Flam. Liq. 2, methanol also Acute Tox. 3; cyanide salts and
 * cyanide complexes release HCN with acids.
 */
import { describe, expect, it } from 'vitest';
import { analyseFormula } from '../../server/src/chem/analyse';
import { CAUTION_FOOTNOTE, cautionsFor, type CautionClass } from '../../server/src/chem/cautions';

const classes = (f: string) => cautionsFor(analyseFormula(f)).map((c) => c.cls);
const texts = (f: string) =>
  cautionsFor(analyseFormula(f))
    .map((c) => c.text)
    .join(' | ');

describe('cyanide in any form', () => {
  for (const f of ['KCN', 'NaCN', 'CuCN', 'Hg(CN)2', 'HCN', 'K[Au(CN)2]', 'K3[Fe(CN)6]', 'K4[Fe(CN)6]·3H2O', 'Na2[Zn(CN)4]']) {
    it(f, () => {
      expect(classes(f)).toContain('toxic');
      expect(texts(f)).toMatch(/cyanide.*HCN/);
    });
  }
  it('thiocyanate and cyanate are not cyanide', () => {
    for (const f of ['KSCN', 'KOCN']) expect(texts(f), f).not.toMatch(/cyanide/);
  });
});

describe('acids', () => {
  it('the strong acids', () => {
    for (const f of ['HCl', 'HBr', 'HI', 'HNO3', 'H2SO4', 'HClO4']) expect(classes(f), f).toContain('strong acid');
  });
  it('HF, H3PO4 and acetic acid are corrosive, not strong acids', () => {
    for (const f of ['HF', 'H3PO4', 'CH3COOH', 'CH3CO2H']) {
      expect(classes(f), f).toContain('corrosive');
      expect(classes(f), f).not.toContain('strong acid');
    }
  });
  it('HF carries its own caution: penetrating burns, calcium gluconate first aid, the SDS', () => {
    const t = texts('HF');
    expect(t).toMatch(/penetrates the skin/);
    expect(t).toMatch(/calcium gluconate/);
    expect(t).toMatch(/SDS/);
    expect(classes('HF')).toContain('toxic');
  });
});

describe('oxidisers and solvents', () => {
  it('NaNO2 is an oxidiser and toxic', () => {
    expect(classes('NaNO2')).toEqual(expect.arrayContaining<CautionClass>(['oxidiser', 'toxic']));
    expect(classes('KNO2')).toContain('oxidiser');
  });
  it('ethanol, isopropanol, acetone and methanol are flammable; methanol is also toxic', () => {
    for (const f of ['C2H5OH', 'CH3CH2OH', 'EtOH', 'CH3CH(OH)CH3', '(CH3)2CHOH', 'CH3COCH3', '(CH3)2CO', 'CH3OH', 'MeOH'])
      expect(classes(f), f).toContain('flammable');
    expect(classes('CH3OH')).toContain('toxic');
    expect(classes('C2H5OH')).not.toContain('toxic');
  });
  it('water, glucose, sodium chloride and copper sulfate get none of these', () => {
    for (const f of ['H2O', 'C6H12O6', 'NaCl', 'CuSO4·5H2O']) expect(classes(f), f).toEqual([]);
  });
  it('the footnote defers to the SDS, local codes and licensed practice', () => {
    expect(CAUTION_FOOTNOTE).toMatch(/safety data sheet \(SDS\), local codes and licensed practice/);
  });
});

describe('bifluorides', () => {
  it('ammonium and potassium hydrogen difluoride carry the hydrofluoric acid caution (from memory: their SDS give HF first aid)', () => {
    for (const f of ['NH4HF2', '(NH4)HF2', 'KHF2']) {
      const c = cautionsFor(analyseFormula(f));
      expect(c.map((x) => x.text).join(' '), f).toMatch(/hydrofluoric acid.*calcium gluconate/);
    }
    // A plain fluoride keeps its own caution.
    expect(
      cautionsFor(analyseFormula('NaF'))
        .map((x) => x.text)
        .join(' '),
    ).toContain('soluble fluoride');
  });
});
