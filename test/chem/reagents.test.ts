/**
 * Reagents as supplied: densities and molarities of the concentrated reagents, amounts per volume,
 * normality, dilution, other forms, scaling.
 *
 * Sources: CRC Handbook of Chemistry and Physics, "Concentrative properties of aqueous solutions" and the
 * table of "Concentrated acids and bases" (molarity of the commercial reagents), from memory; arithmetic
 * by hand where the comment says so.
 */
import { describe, expect, it } from 'vitest';
import { analyseFormula } from '../../server/src/chem/analyse';
import {
  amountIn,
  AQUEOUS,
  densityAt,
  dilution,
  equivalentsOf,
  pour,
  reagentDensity,
  reagentMolarity,
  reagentUnit,
  roundMass,
  roundVolume,
  scaleBatch,
  substituteForm,
  volumeFor,
} from '../../server/src/chem/reagents';

const A = analyseFormula;
const molarityOf = (formula: string, assay: number) => {
  const a = A(formula);
  const d = reagentDensity(a, assay).density!;
  return reagentMolarity(d.gPerML, assay, a.molarMass!.value);
};

describe('densities and molarities of the concentrated reagents', () => {
  // CRC Handbook, "Concentrated acids and bases" (molarity of the commercial reagents), from memory.
  const HANDBOOK: Array<[string, number, number, number]> = [
    ['H2SO4', 96, 18.0, 0.2], // sulfuric acid 96 %: about 18 M
    ['HCl', 37, 12.0, 0.15], // hydrochloric acid 37 %: about 12 M
    ['HNO3', 70, 15.7, 0.2], // nitric acid 70 %: 15.7 M
    ['H3PO4', 85, 14.7, 0.2], // phosphoric acid 85 %: 14.7–14.8 M
    ['CH3COOH', 100, 17.4, 0.1], // glacial acetic acid: 17.4 M
    ['HF', 48, 27.6, 0.6], // hydrofluoric acid 48 %: about 27.6 M
    ['NH3', 28, 14.8, 0.2], // ammonia solution 28 %: 14.8 M
    ['NaOH', 50, 19.1, 0.2], // sodium hydroxide 50 %: 19.1 M
    ['KOH', 45, 11.7, 0.2], // potassium hydroxide 45 %: 11.7 M
    ['H2O2', 30, 9.8, 0.15], // hydrogen peroxide 30 %: 9.8 M
  ];
  for (const [f, w, m, tol] of HANDBOOK)
    it(`${f} ${w} % is about ${m} M (CRC Handbook, from memory)`, () => {
      expect(Math.abs(molarityOf(f, w) - m)).toBeLessThan(tol);
    });

  it('interpolates linearly between rows and says which rows and source it used', () => {
    const t = AQUEOUS.find((x) => x.id === 'hydrochloric')!;
    const d = densityAt(t, 37)!; // between 36 % (1.1789) and 38 % (1.1885): by hand 1.1837
    expect(d.basis).toBe('interpolated');
    expect(d.gPerML).toBeCloseTo(1.1837, 4);
    expect(d.between).toEqual([
      [36, 1.1789],
      [38, 1.1885],
    ]);
    expect(d.text).toMatch(/CRC Handbook.*from memory/);
    expect(densityAt(t, 36)!.basis).toBe('table');
    expect(densityAt(t, 45)).toBeUndefined();
  });

  it('every table starts at water and rises where the handbook rises (acetic acid peaks near 78 %)', () => {
    for (const t of AQUEOUS) {
      expect(t.rows[0].slice(0, 2)).toEqual([0, 0.99821]); // CRC Handbook, Section 6: water at 20 °C
      for (let i = 1; i < t.rows.length; i++) expect(t.rows[i][0]).toBeGreaterThan(t.rows[i - 1][0]);
    }
    const acetic = AQUEOUS.find((x) => x.id === 'acetic')!;
    expect(densityAt(acetic, 80)!.gPerML).toBeGreaterThan(densityAt(acetic, 100)!.gPerML); // CRC: 1.0700 vs 1.0498
  });

  it('reads ethanol and glycerol mixed with water from their tables (CRC Handbook, from memory)', () => {
    expect(reagentDensity(A('C2H5OH'), 95).density!.gPerML).toBeCloseTo(0.80424, 5); // alcoholometric table, 95 % w/w
    expect(reagentDensity(A('C2H5OH'), 45).density!.gPerML).toBeCloseTo((0.93518 + 0.91384) / 2, 5); // by hand, linear
    expect(reagentDensity(A('C3H5(OH)3'), 50).density!.gPerML).toBeCloseTo(1.1263, 4);
    const p = pour(A('C2H5OH'), 100, 96);
    expect('cautions' in p && p.cautions.join(' ')).toMatch(/Flammable/);
  });

  it('takes a liquid with no assay as the pure substance, and asks for the assay of a solution reagent', () => {
    const s = reagentDensity(A('H2SO4'));
    expect(s.density!.assayPercent).toBe(100);
    expect(s.findings[0].message).toMatch(/pure substance/);
    expect(reagentDensity(A('C2H5OH')).density!.gPerML).toBeCloseTo(0.7893, 4); // CRC: ethanol 0.7893 g/mL at 20 °C
    expect(reagentDensity(A('CH3COCH3')).density!.gPerML).toBeCloseTo(0.79, 2); // CRC: acetone 0.790 g/mL at 20 °C, from memory
    expect(reagentDensity(A('C3H5(OH)3')).density!.gPerML).toBeCloseTo(1.2613, 4); // CRC: glycerol 1.2613
    expect(reagentDensity(A('C3H8O')).findings[0].message).toMatch(/isopropanol.*isomers/);
    expect(reagentDensity(A('(CH3)2CHOH')).findings).toEqual([]);
    const hcl = reagentDensity(A('HCl'));
    expect(hcl.density).toBeUndefined();
    expect(hcl.findings[0].kind).toBe('assay-needed');
    expect(reagentDensity(A('NaCl')).findings[0].kind).toBe('unknown-liquid');
  });

  it("uses the label's density where given, and says when it differs from the table's", () => {
    const d = reagentDensity(A('H2SO4'), 96, 1.84);
    expect(d.density!.gPerML).toBe(1.84);
    expect(d.density!.basis).toBe('label');
    expect(d.findings).toEqual([]); // 1.84 vs 1.8355: within 1.5 %
    const far = reagentDensity(A('H2SO4'), 96, 1.7);
    expect(far.findings[0].kind).toBe('density-label');
  });
});

describe('liquids by volume and by target', () => {
  it('H2SO4 10 mL @ 96%: 10 mL × 1.8355 g/mL × 0.96 = 17.62 g, 0.1797 mol (by hand)', () => {
    const p = pour(A('H2SO4'), 10, 96);
    if (!('moles' in p)) throw new Error('not poured');
    expect(p.solutionMassG).toBeCloseTo(18.355, 3);
    expect(p.massG).toBeCloseTo(17.621, 3);
    expect(p.moles).toBeCloseTo(17.621 / 98.072, 4);
    expect(p.cautions.join(' ')).toMatch(/add the acid slowly to the water/);
    expect(p.cautions.join(' ')).toMatch(/SDS/);
  });

  it('HCl 0.5 M @ 37% in 1 L: 0.5 mol × 36.46 g/mol ÷ 0.37 ÷ 1.1837 g/mL = 41.6 mL (by hand)', () => {
    const v = volumeFor(A('HCl'), 0.5, 37);
    if (!('moles' in v)) throw new Error('no volume');
    expect(v.volumeML).toBeCloseTo((0.5 * 36.458) / 0.37 / 1.1837, 1);
    expect(v.cautions.join(' ')).toMatch(/fume hood/);
  });

  it('counts ammonia solution written NH4OH by its assay as NH3 (the trade gives it so)', () => {
    const p = pour(A('NH4OH'), 100, 28); // 100 mL × 0.8980 g/mL × 0.28 ÷ 17.031 g/mol = 1.476 mol (by hand)
    if (!('moles' in p)) throw new Error('not poured');
    expect(p.moles).toBeCloseTo(1.4764, 3);
    expect(p.findings.some((f) => /as NH₃/.test(f.message))).toBe(true);
    const q = pour(A('NH3'), 100, 28);
    expect('moles' in q && q.moles).toBeCloseTo(p.moles, 9);
  });

  it('gives no handling caution for a dilute reagent', () => {
    const p = pour(A('HCl'), 10, 2);
    expect('cautions' in p && p.cautions).toEqual([]);
  });
});

describe('amounts per volume and other units', () => {
  const nacl = A('NaCl');
  const batch = { volumeL: 0.5 };
  const mass = (value: number, unit: string, b: Parameters<typeof amountIn>[0]['batch'] = batch, analysis = nacl) => {
    const r = amountIn({ value, unit, analysis, batch: b });
    if (!('moles' in r)) throw new Error(r.findings[0].message);
    return r;
  };

  it('g/L, mg/L and %w/v against the final volume (by hand)', () => {
    expect(mass(25, 'g/L').massG).toBeCloseTo(12.5, 9);
    expect(mass(250, 'mg/L').massG).toBeCloseTo(0.125, 9);
    expect(mass(0.9, '%w/v').massG).toBeCloseTo(4.5, 9); // 0.9 g per 100 mL × 500 mL
    expect(reagentUnit('% w/v')?.unit).toBe('%w/v');
    expect(reagentUnit('MM')).toBeUndefined();
  });

  it('%v/v with the density of the pure liquid, and the contraction said', () => {
    const r = mass(70, '%v/v', { volumeL: 1 }, A('C2H5OH')); // 700 mL × 0.78934 g/mL = 552.54 g (by hand)
    expect(r.volumeML).toBeCloseTo(700, 9);
    expect(r.massG).toBeCloseTo(552.54, 2);
    expect(r.findings.map((f) => f.message).join(' ')).toMatch(/contract/);
  });

  it('ppm says whether it is mg/L or mg/kg, and warns where the two differ', () => {
    const aq = mass(50, 'ppm', { volumeL: 2 });
    expect(aq.massG).toBeCloseTo(0.1, 9); // 50 mg/L × 2 L
    expect(aq.findings.map((f) => f.kind)).toEqual(['ppm-basis']);
    expect(aq.findings[0].severity).toBe('information');
    const dense = mass(50, 'ppm', { volumeL: 1, totalMassG: 1200 });
    expect(dense.findings.some((f) => f.severity === 'warning' && /20 %/.test(f.message))).toBe(true);
    const ww = mass(50, 'ppm w/w', { totalMassG: 2000 });
    expect(ww.massG).toBeCloseTo(0.1, 9); // 50 mg/kg × 2 kg
    expect(mass(20, 'ppb', { volumeL: 1 }).massG).toBeCloseTo(20e-6, 12);
  });

  it('molality from the solvent mass, or estimated from the final volume with a note', () => {
    expect(mass(0.1, 'mol/kg', { solventMassG: 500 }).moles).toBeCloseTo(0.05, 12);
    const est = mass(0.1, 'mol/kg', { volumeL: 1 });
    expect(est.moles).toBeCloseTo(0.099821, 6);
    expect(est.findings[0].kind).toBe('approximation');
  });

  it('normality with the role it assumes (by hand: 0.2 N H2SO4 is 0.1 M; 0.1 N KMnO4 is 0.02 M)', () => {
    const s = mass(0.2, 'N', { volumeL: 1 }, A('H2SO4'));
    expect(s.moles).toBeCloseTo(0.1, 12);
    expect(s.findings[0].message).toMatch(/2 H⁺.*acid/);
    expect(mass(0.1, 'N', { volumeL: 1 }, A('KMnO4')).moles).toBeCloseTo(0.02, 12);
    expect(mass(0.1, 'N', { volumeL: 1 }, A('Ca(OH)2')).moles).toBeCloseTo(0.05, 12);
    expect(mass(0.1, 'N', { volumeL: 1 }, A('Na2CO3')).moles).toBeCloseTo(0.05, 12);
    expect(mass(0.1, 'N', { volumeL: 1 }, A('H3PO4')).moles).toBeCloseTo(0.1 / 3, 12);
  });

  it('needs the final volume for per-volume units, and says so', () => {
    const r = amountIn({ value: 1, unit: 'g/L', analysis: nacl, batch: {} });
    expect('moles' in r).toBe(false);
    expect(r.findings[0].message).toMatch(/final volume/);
  });

  it('mL of a liquid is a pour with the density and assay', () => {
    const r = amountIn({ value: 10, unit: 'mL', analysis: A('H2SO4'), batch: {}, assayPercent: 96 });
    if (!('moles' in r)) throw new Error('no amount');
    expect(r.massG).toBeCloseTo(17.621, 3);
  });
});

describe('equivalents by role', () => {
  it('acid, base, redox and ion roles (Vogel, from memory; basicities from IUPAC 2005 and the CRC Handbook)', () => {
    const n = (f: string, role?: Parameters<typeof equivalentsOf>[1]) => {
      const e = equivalentsOf(A(f), role);
      return 'perMole' in e ? [e.perMole, e.role] : e.error;
    };
    expect(n('H2SO4')).toEqual([2, 'acid']);
    expect(n('H3PO3')).toEqual([2, 'acid']); // phosphonic acid is dibasic
    expect(n('H3BO3')).toEqual([1, 'acid']); // boric acid: monobasic
    expect(n('CH3COOH')).toEqual([1, 'acid']);
    expect(n('KH2PO4')).toEqual([2, 'acid']);
    expect(n('NaOH')).toEqual([1, 'base']);
    expect(n('NaHCO3')).toEqual([1, 'base']);
    expect(n('KMnO4')).toEqual([5, 'redox']);
    expect(n('K2Cr2O7')).toEqual([6, 'redox']);
    expect(n('Na2S2O3·5H2O')).toEqual([1, 'redox']);
    expect(n('Al2(SO4)3')).toEqual([6, 'ion']);
    expect(n('H2C2O4', 'redox')).toEqual([2, 'redox']);
    expect(n('NaCl', 'redox')).toMatch(/no redox equivalents/);
  });
});

describe('dilution from a stock', () => {
  it('NiSO4 0.1 M from 1.5 M in 1 L: 66.67 mL of stock (by hand: c₁V₁ = c₂V₂)', () => {
    const d = dilution({ value: 0.1, unit: 'M' }, { value: 1.5, unit: 'M' }, 1);
    if (!('stockVolumeML' in d)) throw new Error('no dilution');
    expect(d.stockVolumeML).toBeCloseTo(66.667, 3);
    expect(d.factor).toBeCloseTo(15, 9);
    expect(d.moles).toBeCloseTo(0.1, 12);
    expect(d.solventVolumeML).toBeCloseTo(933.33, 2);
  });

  it('converts M against g/L with the molar mass, and mM against M', () => {
    const d = dilution({ value: 5.844, unit: 'g/L' }, { value: 1, unit: 'M' }, 0.5, 58.44);
    expect('stockVolumeML' in d && d.stockVolumeML).toBeCloseTo(50, 6); // 0.1 M × 500 mL ÷ 1 M
    const e = dilution({ value: 10, unit: 'mM' }, { value: 1, unit: 'M' }, 0.25);
    expect('stockVolumeML' in e && e.stockVolumeML).toBeCloseTo(2.5, 9);
  });

  it('refuses a target stronger than the stock and units that do not convert', () => {
    const r = dilution({ value: 2, unit: 'M' }, { value: 1.5, unit: 'M' }, 1);
    expect('findings' in r && r.findings[0].message).toMatch(/stronger than the stock/);
    expect('findings' in dilution({ value: 1, unit: 'g/L' }, { value: 1, unit: 'M' }, 1)).toBe(true);
  });
});

describe('another form of an ingredient', () => {
  it('the hexahydrate for the anhydrous salt: 15.48 g NiSO4 → 26.28 g NiSO4·6H2O (by hand, 0.1 mol)', () => {
    const r = substituteForm(A('NiSO4'), A('NiSO4·6H2O'), 15.476);
    if (!('massG' in r)) throw new Error('no change');
    expect(r.moles).toBeCloseTo(0.1, 3);
    expect(r.massG).toBeCloseTo(26.284, 2);
    expect(r.kept).toBe('the same NiO4S');
    expect(r.findings).toEqual([]);
  });

  it('another assay: 10 g at 100 % is 10.10 g at 99 %', () => {
    const r = substituteForm(A('NaCl'), A('NaCl'), 10, { toAssayPercent: 99 });
    expect('massG' in r && r.massG).toBeCloseTo(10.101, 3);
  });

  it('another salt of the same metal keeps the metal and warns', () => {
    const r = substituteForm(A('NiSO4·6H2O'), A('NiCl2·6H2O'), 26.28);
    if (!('massG' in r)) throw new Error('no change');
    expect(r.kept).toBe('the same Ni');
    expect(r.massG).toBeCloseTo((26.28 / 262.85) * 237.69, 1);
    expect(r.findings[0].severity).toBe('warning');
    expect('findings' in substituteForm(A('NaCl'), A('KBr'), 1) && !('massG' in substituteForm(A('NaCl'), A('KBr'), 1))).toBe(true);
  });
});

describe('scaling a batch', () => {
  it('scales amounts from 1 L to 200 L, keeps concentrations, and rounds for the bench (common practice)', () => {
    const r = scaleBatch(
      [
        { key: 'a', value: 12.3456, unit: 'g' },
        { key: 'b', value: 0.25, unit: 'M', computedMassG: 65.7 },
        { key: 'c', value: 41.6, unit: 'mL' },
        { key: 'd', value: 2, unit: 'mmol' },
        { key: 'e', value: 5, unit: '%w/v' },
      ],
      { volumeL: 1 },
      { volumeL: 200 },
    );
    if (!('factor' in r)) throw new Error('no scale');
    expect(r.factor).toBe(200);
    const [a, b, c, d, e] = r.lines;
    expect([a.how, a.rounded!.text]).toEqual(['scaled', '2.469 kg']); // 2469.12 g → 4 s.f., precision balance
    expect([b.how, b.value, b.unit, b.rounded!.text]).toEqual(['kept', 0.25, 'M', '13.14 kg']);
    expect([c.how, c.rounded!.text]).toEqual(['scaled', '8.30 L']); // 8320 mL in 50 mL steps
    expect([d.how, d.value]).toEqual(['scaled', 400]);
    expect([e.how, e.value, e.rounded]).toEqual(['kept', 5, undefined]);
  });

  it('rounds masses to 4 significant figures and the balance readability, and flags too-small amounts', () => {
    expect(roundMass(0.012345).text).toBe('12.3 mg'); // analytical balance, 0.1 mg
    expect(roundMass(1.23456).text).toBe('1.235 g');
    expect(roundMass(523.456).text).toBe('523.5 g'); // precision balance, 0.01 g; 4 s.f. is coarser
    expect(roundMass(0.0005).findings[0].kind).toBe('measuring-precision');
    expect(roundMass(10).findings).toEqual([]);
    expect(roundVolume(0.1234).text).toBe('123 µL');
    expect(roundVolume(66.667).text).toBe('66.5 mL');
  });

  it('needs both sizes of one kind', () => {
    expect('findings' in scaleBatch([], { volumeL: 1 }, { totalMassG: 5 })).toBe(true);
  });
});
