/**
 * Titre lines (chem/upkeep/titration.ts): the reading with its offsets, the arithmetic checked against a
 * hand calculation written beside each check, the g/L of the metal or ion against IUPAC/CIAAW standard
 * atomic weights, and the plausibility flags.
 *
 * The baths are invented: the lines of a fictional job shop, Kestrel Finishing (line 2: a Watts nickel;
 * line 4: an acid copper).
 *
 * Atomic weights (CIAAW, abridged standard atomic weights, IUPAC 2021 table, conventional values for
 * the interval elements): H 1.008, B 10.81, N 14.007, O 15.999, Na 22.990, S 32.06, Cl 35.45, Ni 58.693,
 * Cu 63.546, Ag 107.87.
 */
import { describe, expect, it } from 'vitest';
import { computeTitre, readTitre, TARGET_FACTOR, type TitreRead, type TitreReading } from '../../server/src/chem/upkeep';

const W = { H: 1.008, B: 10.81, N: 14.007, O: 15.999, Na: 22.99, S: 32.06, Cl: 35.45, Ni: 58.693, Cu: 63.546, Ag: 107.87 };
// Molar masses by hand from the weights above.
const M_NiSO4_6H2O = W.Ni + W.S + 4 * W.O + 6 * (2 * W.H + W.O); // 262.839
const M_NiCl2_6H2O = W.Ni + 2 * W.Cl + 6 * (2 * W.H + W.O); // 237.683
const M_H2SO4 = 2 * W.H + W.S + 4 * W.O; // 98.072
const M_CuSO4_5H2O = W.Cu + W.S + 4 * W.O + 5 * (2 * W.H + W.O); // 249.677

const OFFSET = 1000;

function read(text: string): TitreReading {
  const r = readTitre(text, OFFSET);
  if (!r.ok) throw new Error(`not read: ${text}\n${r.diagnostics.map((d) => d.message).join('\n')}`);
  return r;
}

function fails(text: string): Extract<TitreRead, { ok: false }> {
  const r = readTitre(text, OFFSET);
  expect(r.ok, text).toBe(false);
  return r as Extract<TitreRead, { ok: false }>;
}

/** The characters a finding or token covers, as written. */
const at = (text: string, x: { start: number; end: number }) => text.slice(x.start - OFFSET, x.end - OFFSET);

describe('a titre line read', () => {
  const line = 'titre NiSO4·6H2O: 2.00 mL sample, 18.40 mL 0.0500 M EDTA   # line 2, Monday';

  it('gives the analyte, titrant, volumes and concentration with their spans', () => {
    const r = read(line);
    expect(at(line, r.keyword)).toBe('titre');
    expect(at(line, r.analyte)).toBe('NiSO4·6H2O');
    expect(r.analyte.analysis.hill).toBe('H12NiO10S');
    expect(at(line, r.sample)).toBe('2.00 mL');
    expect(r.sample.litres).toBeCloseTo(0.002, 12);
    expect(at(line, r.titre)).toBe('18.40 mL');
    expect(at(line, r.titrantM)).toBe('0.0500 M');
    expect(r.titrantM.value).toBe(0.05);
    expect(at(line, r.titrant)).toBe('EDTA');
    expect(r.titrant.edta).toBe(true);
    expect(r.ratio).toMatchObject({ titrantPerAnalyte: 1, source: 'titrant' });
    expect(r.carrier).toMatchObject({ key: 'Ni^2+', perAnalyte: 1 });
    expect(at(line, r)).toBe('titre NiSO4·6H2O: 2.00 mL sample, 18.40 mL 0.0500 M EDTA');
  });

  it('has tokens in order, not overlapping, each the text it says', () => {
    const r = read(line);
    let last = OFFSET;
    for (const t of r.tokens) {
      expect(t.start).toBeGreaterThanOrEqual(last);
      expect(t.end).toBeGreaterThan(t.start);
      expect(at(line, t)).toBe(t.text);
      last = t.end;
    }
    const kinds = r.tokens.map((t) => `${t.kind}:${t.text}`);
    expect(kinds).toEqual([
      'keyword:titre',
      'analyte:NiSO4·6H2O',
      'colon::',
      'number:2.00',
      'unit:mL',
      'word:sample',
      'separator:,',
      'number:18.40',
      'unit:mL',
      'number:0.0500',
      'unit:M',
      'titrant:EDTA',
      'comment:# line 2, Monday',
    ]);
  });

  it('reads `titration`, `sample <V>`, glued units, `of`, a name and `as`', () => {
    const text = 'Titration nickel sulfate hexahydrate as Ni: sample 2.00mL, 18.40 mL of 0.0500 M EDTA';
    const r = read(text);
    expect(r.analyte.formula).toBe('NiSO4·6H2O');
    expect(r.analyte.named).toBe('nickel(II) sulfate hexahydrate');
    expect(at(text, r.analyte)).toBe('nickel sulfate hexahydrate');
    expect(at(text, r.as!)).toBe('Ni');
    expect(r.carrier).toMatchObject({ key: 'Ni', perAnalyte: 1 });
    expect(r.sample.litres).toBeCloseTo(0.002, 12);
  });
});

describe('the arithmetic, against the hand calculation', () => {
  it('nickel by EDTA, 1:1 (Kestrel line 2)', () => {
    // 18.40 mL × 0.0500 mol/L = 0.920 mmol EDTA = 0.920 mmol Ni²⁺ (1:1, common practice)
    // 0.920 mmol ÷ 2.00 mL = 0.460 mol/L NiSO₄·6H₂O
    // × 262.839 g/mol = 120.906 g/L of the hexahydrate; × 58.693 g/mol = 26.999 g/L of nickel
    const c = computeTitre(read('titre NiSO4·6H2O: 2.00 mL sample, 18.40 mL 0.0500 M EDTA'));
    expect(c.titrantMol).toBeCloseTo(0.00092, 12);
    expect(c.concentrationM).toBeCloseTo(0.46, 10);
    expect(c.saltGPerL).toBeCloseTo(0.46 * M_NiSO4_6H2O, 3);
    expect(c.saltGPerL).toBeCloseTo(120.906, 2);
    expect(c.carrierGPerL).toBeCloseTo(0.46 * W.Ni, 3);
    expect(c.carrierGPerL).toBeCloseTo(26.999, 2);
    expect(c.diagnostics).toEqual([]);
    expect(c.basis.join('\n')).toMatch(/18\.4 mL\) × 0\.05 mol\/L = 0\.92 mmol/);
  });

  it('chloride by silver nitrate on a diluted sample, with `as Cl-` and the reaction written', () => {
    // 4.00 mL × 0.1000 mol/L = 0.400 mmol Ag⁺ = 0.400 mmol Cl⁻ (Ag⁺ + Cl⁻ → AgCl) in the 10.00 mL taken
    // the 10.00 mL are a tenth of the 50.0 mL made from 5.00 mL of bath: bath × (50.0 ÷ 5.00) = × 10
    // Cl⁻ in the bath: 0.400 mmol ÷ 10.00 mL × 10 = 0.400 mol/L; NiCl₂·6H₂O: 2 Cl⁻ each → 0.200 mol/L
    // × 237.683 g/mol = 47.537 g/L of the hexahydrate; chloride 0.400 mol/L × 35.45 = 14.18 g/L
    const text = 'titre NiCl2·6H2O as Cl-: sample 5.00 mL diluted to 50.0 mL, 10.00 mL taken, 4.00 mL 0.1000 M AgNO3, Ag+ + Cl- -> AgCl';
    const r = read(text);
    expect(r.ratio).toMatchObject({ titrantPerAnalyte: 2, source: 'reaction' });
    expect(at(text, { start: r.ratio.start!, end: r.ratio.end! })).toBe('Ag+ + Cl- -> AgCl');
    const c = computeTitre(r);
    expect(c.dilutionFactor).toBeCloseTo(10, 12);
    expect(c.concentrationM).toBeCloseTo(0.2, 10);
    expect(c.saltGPerL).toBeCloseTo(0.2 * M_NiCl2_6H2O, 3);
    expect(c.saltGPerL).toBeCloseTo(47.537, 2);
    expect(c.carrierGPerL).toBeCloseTo(0.4 * W.Cl, 3);
    // The same without the reaction: the silver salt's usual ratio gives the same figure.
    const plain = computeTitre(read('titre NiCl2·6H2O: sample 5.00 mL diluted to 50.0 mL, 10.00 mL taken, 4.00 mL 0.1000 M AgNO3'));
    expect(plain.concentrationM).toBeCloseTo(0.2, 10);
    expect(plain.reading.carrier?.key).toBe('Cl^-');
  });

  it('free sulfuric acid by sodium hydroxide: two protons (Kestrel line 4)', () => {
    // 10.20 mL × 1.000 mol/L = 10.20 mmol OH⁻; H₂SO₄ + 2 OH⁻ → SO₄²⁻ + 2 H₂O: 5.10 mmol H₂SO₄
    // 5.10 mmol ÷ 5.00 mL = 1.020 mol/L × 98.072 g/mol = 100.03 g/L
    const c = computeTitre(read('titration H2SO4: 5.00 mL sample, 10.20 mL 1.000 M NaOH'));
    expect(c.reading.ratio.titrantPerAnalyte).toBe(2);
    expect(c.concentrationM).toBeCloseTo(1.02, 10);
    expect(c.saltGPerL).toBeCloseTo(1.02 * M_H2SO4, 3);
    expect(c.saltGPerL).toBeCloseTo(100.03, 1);
    // No ion carries it separately: said, not left out.
    expect(c.carrierGPerL).toBeNull();
    expect(c.basis.join('\n')).toMatch(/titrated as a whole/);
  });

  it('copper by EDTA with a blank taken off', () => {
    // (12.10 − 0.05) mL × 0.0500 mol/L = 0.6025 mmol Cu²⁺ in 2.00 mL: 0.30125 mol/L
    // × 249.677 g/mol = 75.215 g/L CuSO₄·5H₂O; × 63.546 = 19.143 g/L copper
    const c = computeTitre(read('titre CuSO4·5H2O: 2.00 mL sample, 12.10 mL 0.0500 M EDTA, blank 0.05 mL'));
    expect(c.concentrationM).toBeCloseTo(0.30125, 10);
    expect(c.saltGPerL).toBeCloseTo(0.30125 * M_CuSO4_5H2O, 3);
    expect(c.carrierGPerL).toBeCloseTo(0.30125 * W.Cu, 3);
  });

  it('a written ratio or `eq` counts as written; a reaction is balanced by chem/equation', () => {
    // 1:2 — one H₂SO₄ per two NaOH — is the usual ratio: the same 1.020 mol/L as above.
    expect(computeTitre(read('titre H2SO4: 5.00 mL sample, 10.20 mL 1.000 M NaOH, 1:2')).concentrationM).toBeCloseTo(1.02, 10);
    expect(computeTitre(read('titre H2SO4: 5.00 mL sample, 10.20 mL 1.000 M NaOH, 2 eq')).concentrationM).toBeCloseTo(1.02, 10);
    // A ratio written 1:1 where 1:2 is right gives twice the acid: the line says what it was told.
    expect(computeTitre(read('titre H2SO4: 5.00 mL sample, 10.20 mL 1.000 M NaOH, 1:1')).concentrationM).toBeCloseTo(2.04, 10);
    // Written without the 2 H⁺: balanced to Ni²⁺ + H₂(edta)²⁻ → Ni(edta)²⁻ + 2 H⁺, still 1:1.
    const r = read('titre NiSO4·6H2O: 2.00 mL sample, 18.40 mL 0.0500 M EDTA, Ni2+ + H2EDTA2- -> NiEDTA2- + H+');
    expect(r.ratio.titrantPerAnalyte).toBe(1);
    expect(r.ratio.reaction).toBe('Ni²⁺ + H₂(edta)²⁻ → Ni(edta)²⁻ + 2 H⁺');
  });

  it('hydroxide by acid: sodium hydroxide by sulfuric acid, half a mol of acid each', () => {
    // 8.00 mL × 0.500 mol/L H₂SO₄ = 4.00 mmol = 8.00 mmol H⁺ → 8.00 mmol NaOH in 10.0 mL: 0.800 mol/L
    // × (22.990 + 15.999 + 1.008) = 39.997 g/mol → 31.998 g/L; OH⁻: 0.800 × 17.007 = 13.606 g/L
    const c = computeTitre(read('titre NaOH: 10.0 mL sample, 8.00 mL 0.500 M H2SO4'));
    expect(c.concentrationM).toBeCloseTo(0.8, 10);
    expect(c.saltGPerL).toBeCloseTo(0.8 * (W.Na + W.O + W.H), 3);
    expect(c.carrierGPerL).toBeCloseTo(0.8 * (W.O + W.H), 3);
  });
});

describe('findings with exact offsets', () => {
  const cases: Array<[string, string, string]> = [
    ['titre NiSO4 2.00 mL sample', 'titre-syntax', 'titre NiSO4 2.00 mL sample'],
    ['titre NiSO4: 2.00 parsecs sample, 18.40 mL 0.0500 M EDTA', 'titre-amount', 'parsecs'],
    ['titre NiSO4: 2.00 mL sample, 18.40 mL 0.0500 N EDTA', 'titre-amount', 'N'],
    ['titre NiSO4: 0 mL sample, 18.40 mL 0.0500 M EDTA', 'titre-amount', '0 mL'],
    ['titre NiSO4: sample 10 mL diluted to 5 mL, 1 mL taken, 3 mL 0.05 M EDTA', 'titre-amount', '5 mL'],
    ['titre NiSO4: sample 10 mL diluted to 100 mL, 200 mL taken, 3 mL 0.05 M EDTA', 'titre-amount', '200 mL'],
    ['titre NiSO4: 2 mL sample, 3 mL 0.05 M EDTA, blank 3 mL', 'titre-amount', '3 mL'],
    ['titre NiSO4: 2 mL sample, 3 mL 0.05 M AgNO3', 'titre-ratio', 'AgNO3'],
    ['titre NiSO4: 2 mL sample, 3 mL 0.05 M EDTA, Cu2+ + EDTA4- -> CuEDTA2-', 'titre-ratio', 'Cu2+ + EDTA4- -> CuEDTA2-'],
    ['titre NiSO4 as Cu: 2 mL sample, 3 mL 0.05 M EDTA', 'titre-analyte', 'Cu'],
    ['titre NiXx4: 2 mL sample, 3 mL 0.05 M EDTA', 'unknown-element', 'Xx'],
    ['titre NiSO4: 2 mL sample, 3 mL 0.05 M EDTA, stirred well', 'titre-syntax', 'stirred well'],
    ['titre NiSO4: 2 mL sample', 'titre-syntax', 'e'],
    ['titre NiSO4: sample 10 mL diluted to 100 mL, 3 mL 0.05 M EDTA', 'titre-syntax', '100 mL'],
    ['titre NiSO4: 2 mL sample, 3 mL 0.05 M', 'titre-syntax', '0.05 M'],
    ['titre NiSO4: 2 mL sample, 3 mL 0.05 M EDTA, 1:1, 2 eq', 'titre-syntax', '2 eq'],
  ];
  it.each(cases)('%s → %s on %s', (text, code, covered) => {
    const r = fails(text);
    const d = r.diagnostics.find((x) => x.code === code);
    expect(d, JSON.stringify(r.diagnostics)).toBeDefined();
    expect(at(text, d!)).toBe(covered);
    expect(d!.message.length).toBeGreaterThan(10);
  });

  it('a long pasted line: one finding per repeated part, messages that quote a little of it', () => {
    const r = fails('titre NiSO4: ' + '2 mL sample, '.repeat(150) + '3 mL 0.1 M EDTA');
    expect(r.diagnostics.filter((d) => /more than once/.test(d.message))).toHaveLength(1);
    const n = fails('titre ' + 'nickel '.repeat(250) + ': 2 mL sample, 3 mL 0.1 M EDTA');
    expect(n.diagnostics[0].code).toBe('titre-analyte');
    expect(n.diagnostics[0].message.length).toBeLessThan(200);
    expect(fails('titre NiSO4: 2 mL sample, 3 mL 0.1 M EDTA, ' + 'x'.repeat(2000)).diagnostics[0].message).toMatch(/at most 2000/);
  });

  it('a line that is no titre line says so', () => {
    const r = fails('NiSO4 20 g');
    expect(r.diagnostics[0].code).toBe('titre-syntax');
  });
});

describe('the plausibility flags', () => {
  it('above the solubility of the anhydrous salt (an estimate)', () => {
    // 40.00 mL × 0.1000 M EDTA = 4.000 mmol Ni in 0.500 mL: 8.00 mol/L, i.e. 8.00 × 154.75 = 1238 g/L NiSO₄
    // (anhydrous: 58.693 + 32.06 + 4 × 15.999); no water is left at ≈ 1000 g/L: far above 40.4 g per
    // 100 g water (the table's value, from memory of the CRC Handbook). A slipped sample volume.
    const c = computeTitre(read('titre NiSO4·6H2O: 0.500 mL sample, 40.00 mL 0.1000 M EDTA'));
    expect(c.concentrationM).toBeCloseTo(8, 10);
    expect(c.solubility?.exceeds).toBe(true);
    const d = c.diagnostics.find((x) => x.code === 'titre-implausible');
    expect(d?.severity).toBe('warning');
    expect(d?.message).toMatch(/above its solubility/);
    // The bath of line 2 (0.46 mol/L: 71.2 g/L anhydrous, 7.7 g per 100 g water) is well inside it.
    expect(computeTitre(read('titre NiSO4·6H2O: 2.00 mL sample, 18.40 mL 0.0500 M EDTA')).solubility?.exceeds).toBe(false);
  });

  it(`more than ${TARGET_FACTOR}× or less than a third of the target (common practice)`, () => {
    const r = read('titre NiSO4·6H2O: 2.00 mL sample, 18.40 mL 0.0500 M EDTA'); // 0.460 mol/L
    const flag = (targetM: number) => computeTitre(r, { targetM }).diagnostics.filter((d) => d.code === 'titre-implausible').length;
    expect(flag(0.5)).toBe(0); // 92 % of target
    expect(flag(0.16)).toBe(0); // 2.9× the target: inside
    expect(flag(0.15)).toBe(1); // 3.07×: a dilution slip (a 10 mL sample written as 2 mL?)
    expect(flag(1.35)).toBe(0); // 34 % of 1.35: just inside
    expect(flag(1.5)).toBe(1); // 31 %: below a third
    const c = computeTitre(r, { targetM: 0.5 });
    expect(c.ofTarget).toBeCloseTo(0.92, 10);
    expect(c.diagnostics.every((d) => d.start >= r.start && d.end <= r.end)).toBe(true);
  });
});

describe('the examples of docs/upkeep.md', () => {
  it('read as the page says', async () => {
    const { readFileSync } = await import('node:fs');
    const { join } = await import('node:path');
    const page = readFileSync(join(__dirname, '../../docs/upkeep.md'), 'utf8');
    const block = /## A titre line\n\n```\n([\s\S]*?)```/.exec(page)![1];
    const lines = block.trim().split('\n');
    expect(lines.length).toBeGreaterThanOrEqual(6);
    for (const line of lines) expect(readTitre(line, 0).ok, line).toBe(true);
  });
});
