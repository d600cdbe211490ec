/**
 * Additions (chem/upkeep/additions.ts): the reagents and the water that bring a tank back to target,
 * checked by recomputing the tank from the amounts the plan gives (molar masses by hand from the CIAAW
 * abridged standard atomic weights), and the hand calculations written beside each case.
 *
 * The baths are invented: Kestrel Finishing's line 2, a Watts-type nickel in a 400 L tank (targets
 * NiSO₄·6H₂O 1.100 M, NiCl₂·6H₂O 0.200 M, H₃BO₃ 0.650 M @ 99.5 %), and line 4, an acid copper.
 */
import { describe, expect, it } from 'vitest';
import { analyseUpkeep, planAdditions, readTank, upkeepJson, type AdditionsPlan, type UpkeepTarget } from '../../server/src/chem/upkeep';

// CIAAW abridged standard atomic weights (IUPAC 2021 table).
const W = { H: 1.008, B: 10.81, O: 15.999, S: 32.06, Cl: 35.45, Ni: 58.693, Cu: 63.546 };
const WATER = 2 * W.H + W.O;
const MM: Record<string, number> = {
  'NiSO4·6H2O': W.Ni + W.S + 4 * W.O + 6 * WATER, // 262.839
  'NiSO4·7H2O': W.Ni + W.S + 4 * W.O + 7 * WATER, // 280.854
  'NiCl2·6H2O': W.Ni + 2 * W.Cl + 6 * WATER, // 237.683
  H3BO3: W.B + 3 * W.H + 3 * W.O, // 61.831
  H2SO4: 2 * W.H + W.S + 4 * W.O, // 98.072
  'CuSO4·5H2O': W.Cu + W.S + 4 * W.O + 5 * WATER, // 249.677
};

const LINE2: UpkeepTarget[] = [
  { formula: 'NiSO4·6H2O', targetM: 1.1, start: 10, end: 30 },
  { formula: 'NiCl2·6H2O', targetM: 0.2, start: 31, end: 50 },
  { formula: 'H3BO3', targetM: 0.65, assay: 0.995, start: 51, end: 70 },
];

/** The tank after the plan, recomputed from what it says to weigh and pour: mol/L of each target. */
function recompute(plan: AdditionsPlan, measured: Record<string, number>, targets: UpkeepTarget[]) {
  const kept = plan.tankL - plan.drawOffL;
  const final = kept + plan.waterL;
  return targets.map((t) => {
    const a = plan.additions.find((x) => x.formula === t.formula)!;
    const before = measured[t.formula] ?? t.targetM;
    const addedMol = (a.massG * a.reagent.assay) / MM[t.reagent?.formula ?? t.formula];
    return (before * kept + addedMol) / final;
  });
}

describe('a tank below target: additions only', () => {
  // Line 2 on Monday: NiSO₄·6H₂O 1.000 M, NiCl₂·6H₂O 0.180 M, H₃BO₃ 0.600 M in 400 L.
  // NiSO₄·6H₂O: (1.100 − 1.000) × 400 = 40.0 mol × 262.839 = 10 513.6 g
  // NiCl₂·6H₂O: (0.200 − 0.180) × 400 = 8.00 mol × 237.683 = 1 901.5 g
  // H₃BO₃: (0.650 − 0.600) × 400 = 20.0 mol × 61.831 ÷ 0.995 = 1 242.8 g
  const measured = { 'NiSO4·6H2O': 1.0, 'NiCl2·6H2O': 0.18, H3BO3: 0.6 };
  const plan = planAdditions({
    tankL: 400,
    targets: LINE2,
    measured: Object.entries(measured).map(([formula, concentrationM]) => ({ formula, concentrationM })),
  });

  it('weighs what the hand calculation gives', () => {
    expect(plan.waterL).toBe(0);
    expect(plan.drawOffL).toBe(0);
    expect(plan.dilutionFactor).toBe(1);
    const mass = Object.fromEntries(plan.additions.map((a) => [a.formula, a.massG]));
    expect(mass['NiSO4·6H2O']).toBeCloseTo(40 * MM['NiSO4·6H2O'], 6);
    expect(mass['NiSO4·6H2O']).toBeCloseTo(10513.6, 0);
    expect(mass['NiCl2·6H2O']).toBeCloseTo(1901.5, 0);
    expect(mass.H3BO3).toBeCloseTo((20 * MM.H3BO3) / 0.995, 6);
    expect(mass.H3BO3).toBeCloseTo(1242.8, 0);
    expect(plan.diagnostics).toEqual([]);
  });

  it('leaves the tank at target, recomputed from the masses', () => {
    const after = recompute(plan, measured, LINE2);
    after.forEach((c, k) => expect(c).toBeCloseTo(LINE2[k].targetM, 10));
    plan.additions.forEach((a) => expect(a.afterM).toBeCloseTo(a.targetM, 10));
  });

  it('writes its arithmetic in the basis', () => {
    const ni = plan.additions[0];
    expect(ni.basis).toMatch(/1\.1 mol\/L × 400 L − 1 mol\/L × 400 L = 40 mol/);
    expect(ni.basis).toMatch(/× 262\.8 g\/mol \(NiSO₄·6H₂O\) = 10\.51 kg$/);
    expect(plan.additions[2].basis).toMatch(/÷ 99\.5 % assay/);
    expect(plan.basis.join('\n')).toMatch(/nothing is over target/);
  });
});

describe('a tank over target: dilution to the most over-strength component, then the others', () => {
  // NiSO₄·6H₂O 1.210 M (110 %), NiCl₂·6H₂O 0.190 M (95 %), H₃BO₃ 0.700 M (107.7 %) in 400 L.
  // R = max(1.210 ÷ 1.100, 0.700 ÷ 0.650) = 1.100 (the nickel sulfate): 400 L × 1.1 = 440 L, add 40 L water
  // NiSO₄·6H₂O: 1.100 × 440 − 1.210 × 400 = 484 − 484 = 0
  // NiCl₂·6H₂O: 0.200 × 440 − 0.190 × 400 = 88 − 76 = 12.0 mol × 237.683 = 2 852.2 g
  // H₃BO₃: 0.650 × 440 − 0.700 × 400 = 286 − 280 = 6.00 mol × 61.831 ÷ 0.995 = 372.9 g
  const measured = { 'NiSO4·6H2O': 1.21, 'NiCl2·6H2O': 0.19, H3BO3: 0.7 };
  const list = Object.entries(measured).map(([formula, concentrationM]) => ({ formula, concentrationM }));

  it('adds the water and what the dilution brings below target', () => {
    const plan = planAdditions({ tankL: 400, targets: LINE2, measured: list });
    expect(plan.dilutionFactor).toBeCloseTo(1.1, 12);
    expect(plan.governing).toBe('NiSO₄·6H₂O');
    expect(plan.waterL).toBeCloseTo(40, 9);
    expect(plan.finalL).toBeCloseTo(440, 9);
    const mass = Object.fromEntries(plan.additions.map((a) => [a.formula, a.massG]));
    expect(mass['NiSO4·6H2O']).toBeCloseTo(0, 6);
    expect(mass['NiCl2·6H2O']).toBeCloseTo(12 * MM['NiCl2·6H2O'], 4);
    expect(mass.H3BO3).toBeCloseTo((6 * MM.H3BO3) / 0.995, 4);
    recompute(plan, measured, LINE2).forEach((c, k) => expect(c).toBeCloseTo(LINE2[k].targetM, 10));
    expect(plan.basis.join('\n')).toMatch(/R = 1\.21 ÷ 1\.1 = 1\.1/);
    expect(plan.basis.join('\n')).toMatch(/add 40 L of water/);
  });

  it('draws off first where the tank cannot hold the diluted bath', () => {
    // Capacity 420 L: keep 420 ÷ 1.1 = 381.82 L (draw off 18.18 L), add 38.18 L water to 420 L.
    // NiCl₂·6H₂O: 0.200 × 420 − 0.190 × 381.82 = 84 − 72.545 = 11.455 mol
    const plan = planAdditions({ tankL: 400, capacityL: 420, targets: LINE2, measured: list });
    expect(plan.drawOffL).toBeCloseTo(400 - 420 / 1.1, 9);
    expect(plan.waterL).toBeCloseTo(420 - 420 / 1.1, 9);
    expect(plan.finalL).toBeCloseTo(420, 9);
    expect(plan.additions[1].addMol).toBeCloseTo(84 - 0.19 * (420 / 1.1), 9);
    recompute(plan, measured, LINE2).forEach((c, k) => expect(c).toBeCloseTo(LINE2[k].targetM, 10));
    expect(plan.basis.join('\n')).toMatch(/draw off/);
  });

  it('tops up a component not analysed for the water only, and says so', () => {
    // Boric acid not titrated: taken as at 0.650 M; the 40 L of water take 0.650 × 40 = 26.0 mol away.
    const plan = planAdditions({ tankL: 400, targets: LINE2, measured: list.slice(0, 2) });
    const boric = plan.additions[2];
    expect(boric.assumed).toBe(true);
    expect(boric.measuredM).toBeNull();
    expect(boric.addMol).toBeCloseTo(26, 9);
    const d = plan.diagnostics.find((x) => x.code === 'upkeep-target');
    expect(d).toMatchObject({ severity: 'information', start: 51, end: 70 });
    expect(d!.message).toMatch(/not analysed/);
  });
});

describe('reagents as supplied, duplicates, and what has no target', () => {
  it('weighs another hydrate of the same salt by its own molar mass', () => {
    // 40.0 mol of NiSO₄ as the heptahydrate: 40.0 × 280.854 ÷ 0.98 = 11 463.4 g
    const targets: UpkeepTarget[] = [{ formula: 'NiSO4·6H2O', targetM: 1.1, reagent: { formula: 'NiSO4·7H2O', assay: 0.98 } }];
    const plan = planAdditions({ tankL: 400, targets, measured: [{ formula: 'NiSO4·6H2O', concentrationM: 1.0 }] });
    expect(plan.additions[0].massG).toBeCloseTo((40 * MM['NiSO4·7H2O']) / 0.98, 4);
    expect(plan.additions[0].reagent.display).toBe('NiSO₄·7H₂O');
    recompute(plan, { 'NiSO4·6H2O': 1.0 }, targets).forEach((c) => expect(c).toBeCloseTo(1.1, 10));
  });

  it('refuses a reagent that is not a form of the substance', () => {
    const plan = planAdditions({
      tankL: 400,
      targets: [{ formula: 'NiSO4·6H2O', targetM: 1.1, reagent: { formula: 'NiCl2·6H2O' }, start: 5, end: 9 }],
      measured: [{ formula: 'NiSO4·6H2O', concentrationM: 1.0 }],
    });
    expect(plan.additions).toEqual([]);
    expect(plan.diagnostics[0]).toMatchObject({ code: 'upkeep-reagent', severity: 'error', start: 5, end: 9 });
  });

  it('averages duplicate titrations and reports an analysis without a target', () => {
    // (0.98 + 1.02) ÷ 2 = 1.00 M: 40.0 mol to add.
    const plan = planAdditions({
      tankL: 400,
      targets: LINE2.slice(0, 1),
      measured: [
        { formula: 'NiSO4·6H2O', concentrationM: 0.98 },
        { formula: 'NiSO4', concentrationM: 1.02 },
        { formula: 'CuSO4·5H2O', concentrationM: 0.01, start: 80, end: 99 },
      ],
    });
    expect(plan.additions[0].measuredM).toBeCloseTo(1.0, 12);
    expect(plan.additions[0].analyses).toBe(2);
    expect(plan.additions[0].addMol).toBeCloseTo(40, 9);
    expect(plan.unmatched.map((u) => u.formula)).toEqual(['CuSO4·5H2O']);
    expect(plan.diagnostics).toContainEqual(expect.objectContaining({ code: 'upkeep-target', start: 80, end: 99 }));
  });

  it('gives a liquid acid as a volume to pour too', () => {
    // Line 4, 200 L of acid copper: H₂SO₄ 0.900 M against 1.000 M: 20.0 mol × 98.072 ÷ 0.96 = 2 043.2 g
    // at 1.8355 g/mL (96 %, 20 °C; the CRC Handbook's concentrative properties table, from memory):
    // 2 043.2 ÷ 1.8355 = 1 113.1 mL
    const plan = planAdditions({
      tankL: 200,
      targets: [
        { formula: 'CuSO4·5H2O', targetM: 0.8 },
        { formula: 'H2SO4', targetM: 1.0, assay: 0.96 },
      ],
      measured: [
        { formula: 'CuSO4·5H2O', concentrationM: 0.8 },
        { formula: 'H2SO4', concentrationM: 0.9 },
      ],
    });
    const acid = plan.additions[1];
    expect(acid.massG).toBeCloseTo((20 * MM.H2SO4) / 0.96, 4);
    expect(acid.volumeML).toBeCloseTo(2043.17 / 1.8355, 0);
    expect(plan.additions[0].massG).toBe(0);
    expect(plan.additions[0].volumeML).toBeUndefined();
    // Concentrated sulfuric acid carries its handling cautions; every plan carries the standing note.
    expect(acid.cautions?.join(' ')).toMatch(/water/i);
    expect(plan.notes.join(' ')).toMatch(/SDS/);
  });

  it('needs a tank volume', () => {
    const plan = planAdditions({ tankL: NaN, targets: LINE2, measured: [], at: { start: 3, end: 7 } });
    expect(plan.diagnostics[0]).toMatchObject({ code: 'upkeep-tank', severity: 'error', start: 3, end: 7 });
  });
});

describe('the tank header', () => {
  it.each([
    ['tank: 200 L', 200, null],
    ['Tank: 180 L of 220 L   # working level', 180, 220],
    ['tank: 0.4 m3', 400, null],
    ['tank: 100 gal', 378.5411784, null],
    ['tank: 500L', 500, null],
  ])('%s', (text, litres, capacity) => {
    const r = readTank(text, 40);
    expect(r.ok).toBe(true);
    if (r.ok) {
      expect(r.tank.litres).toBeCloseTo(litres, 9);
      expect(r.tank.capacityL).toBe(capacity);
    }
  });

  it.each([
    ['tank: 200', 'upkeep-tank', '200'],
    ['tank: two hundred L', 'upkeep-tank', 'two'],
    ['tank: 200 L of 150 L', 'upkeep-tank', 'of 150 L'],
    ['tank: 200 L full', 'upkeep-tank', 'full'],
  ])('%s → %s on %s', (text, code, covered) => {
    const r = readTank(text, 40);
    expect(r.ok).toBe(false);
    if (!r.ok) {
      expect(r.diagnostics[0].code).toBe(code);
      expect(text.slice(r.diagnostics[0].start - 40, r.diagnostics[0].end - 40)).toBe(covered);
    }
  });
});

describe('a batch with titres and a tank, all together', () => {
  // Line 2, Thursday: 400 L; nickel by EDTA, chloride by silver nitrate, boric acid by NaOH (with mannitol).
  // EDTA takes all the nickel, the chloride's too: 2.00 mL, 18.00 mL 0.1000 M → 1.800 mmol ÷ 2.00 mL
  //   = 0.900 M Ni²⁺ in all
  // NiCl₂·6H₂O: 2.00 mL, 7.20 mL 0.1000 M AgNO₃ → 0.720 mmol Cl⁻ = 0.360 mmol NiCl₂ ÷ 2.00 mL = 0.180 M
  // so NiSO₄·6H₂O = 0.900 − 0.180 × 1 Ni = 0.720 M (`less NiCl2·6H2O`)
  // H₃BO₃: 2.00 mL, 12.40 mL 0.1000 M NaOH → 1.240 mmol ÷ 2.00 mL = 0.620 M
  // additions: NiSO₄·6H₂O (1.100 − 0.720) × 400 = 152 mol; NiCl₂·6H₂O (0.200 − 0.180) × 400 = 8 mol;
  //   H₃BO₃ (0.650 − 0.620) × 400 = 12 mol
  const lines = [
    'titre NiSO4·6H2O: 2.00 mL sample, 18.00 mL 0.1000 M EDTA, less NiCl2·6H2O',
    'titre NiCl2·6H2O: 2.00 mL sample, 7.20 mL 0.1000 M AgNO3',
    'titre H3BO3: 2.00 mL sample, 12.40 mL 0.1000 M NaOH',
    'titre H3BO3: 2.00 mL sample, 12.40 mL 0.1000 parsecs NaOH',
  ];
  let pos = 200;
  const titreLines = lines.map((text) => {
    const l = { text, start: pos };
    pos += text.length + 1;
    return l;
  });
  const u = analyseUpkeep({ titreLines, tankLine: { text: 'tank: 400 L', start: 150 }, targets: LINE2, at: { start: 100, end: 110 } });

  it('computes each titre, plans the additions, and keeps every finding at its place', () => {
    expect(u.tank?.litres).toBe(400);
    const ok = u.titres.filter((t) => 'reading' in t);
    expect(ok.map((t) => ('reading' in t ? Number(t.concentrationM.toFixed(6)) : 0))).toEqual([0.72, 0.18, 0.62]);
    expect(ok[0]).toMatchObject({ totalM: expect.closeTo(0.9, 9) });
    expect((ok[0] as { basis: string[] }).basis.join('\n')).toMatch(/less NiCl₂·6H₂O: 0\.18 mol\/L × 1 Ni²⁺/);
    expect((ok[0] as { basis: string[] }).basis.join('\n')).toMatch(/= 0\.9 mol\/L\nNi²⁺ found: 0\.9 × 1 = 0\.9 mol\/L\nless/);
    const add = Object.fromEntries(u.additions!.additions.map((a) => [a.formula, a.addMol]));
    expect(add['NiSO4·6H2O']).toBeCloseTo(152, 9);
    expect(add['NiCl2·6H2O']).toBeCloseTo(8, 9);
    expect(add.H3BO3).toBeCloseTo(12, 9);
    // The bad line is a finding on its unit, not a silent gap.
    const bad = u.diagnostics.find((d) => d.code === 'titre-amount')!;
    expect(bad.start).toBe(titreLines[3].start + lines[3].indexOf('parsecs'));
    expect(u.titres[3]).toMatchObject({ ok: false });
  });

  it('gives plain JSON for the batch object', () => {
    const j = upkeepJson(u);
    expect(JSON.parse(JSON.stringify(j))).toEqual(j);
    expect(j.tank).toEqual({ litres: 400, capacityL: null });
    expect(j.titres).toHaveLength(4);
    expect(j.titres[0]).toMatchObject({ analyte: 'NiSO₄·6H₂O', as: 'Ni²⁺' });
    expect(j.titres[3]).toMatchObject({ error: expect.stringMatching(/parsecs/) });
    expect(j.additions.map((a) => a.formula)).toEqual(['NiSO₄·6H₂O', 'NiCl₂·6H₂O', 'H₃BO₃']);
    expect(j.water).toMatchObject({ waterL: 0, drawOffL: 0, finalL: 400 });
  });

  it('says where a `less` substance has no titre of its own', () => {
    const v = analyseUpkeep({ titreLines: titreLines.slice(0, 1), tankLine: { text: 'tank: 400 L', start: 150 }, targets: LINE2 });
    const d = v.diagnostics.find((x) => x.code === 'titre-analyte')!;
    expect(lines[0].slice(d.start - titreLines[0].start, d.end - titreLines[0].start)).toBe('NiCl2·6H2O');
    expect(d.message).toMatch(/No titre of NiCl₂·6H₂O/);
  });

  it('says why there are no additions without a tank', () => {
    const v = analyseUpkeep({ titreLines, targets: LINE2 });
    expect(v.additions).toBeNull();
    expect(v.notes.join(' ')).toMatch(/No 'tank:' header/);
  });
});

describe('a titre with an error', () => {
  it('is shown but makes no addition', () => {
    const u = analyseUpkeep({
      titreLines: [{ text: 'titre NiSO4·6H2O: 2.00 mL sample, 18.00 mL 0.1000 M EDTA, less NiCl2·6H2O', start: 0 }],
      tankLine: { text: 'tank: 400 L', start: 90 },
      targets: LINE2,
    });
    expect(u.titres[0]).toMatchObject({ concentrationM: expect.closeTo(0.9, 9) });
    expect(u.additions).toBeNull();
    expect(u.notes).toEqual(['No titre counts (each has an error): no additions are computed.']);
  });
});

describe('a titre and a target in two hydrates of one salt', () => {
  it('are one substance: compared and added by mol', () => {
    // 18.40 mL × 0.0500 M EDTA ÷ 2.00 mL = 0.460 M NiSO₄ (as the hexahydrate); the batch sets
    // NiSO₄·7H₂O 0.500 M: (0.500 − 0.460) × 100 L = 4.00 mol × 280.854 = 1 123.4 g of the heptahydrate.
    const u = analyseUpkeep({
      titreLines: [{ text: 'titre NiSO4·6H2O: 2.00 mL sample, 18.40 mL 0.0500 M EDTA', start: 0 }],
      tankLine: { text: 'tank: 100 L', start: 70 },
      targets: [{ formula: 'NiSO4·7H2O', targetM: 0.5 }],
    });
    expect(u.titres[0]).toMatchObject({ ofTarget: expect.closeTo(0.92, 9) });
    expect(u.additions!.additions[0].massG).toBeCloseTo(4 * MM['NiSO4·7H2O'], 6);
  });
});
