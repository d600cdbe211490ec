/**
 * The safety stage of a batch (chem/batch/safety.ts): `batch-incompatible` on the later of the two lines,
 * on that line's characters; `batch-heat` where the estimated temperature change of making up is over the
 * setting; the analysis's `hazards` and `heat`. Batches are invented (a fictional plating shop's tank room).
 *
 * Reference figures: enthalpies of solution at infinite dilution, 25 °C, from the CRC Handbook of Chemistry
 * and Physics, "Enthalpy of solution of electrolytes" (NaOH −44.51, NH4NO3 +25.69, KCl +17.22 kJ/mol; from
 * memory); water's specific heat 4.18 J/(g·K) (CRC Handbook, from memory); molar masses from the IUPAC/CIAAW
 * 2021 abridged atomic weights (Na 22.990, O 15.999, H 1.008, N 14.007).
 */
import { describe, expect, it } from 'vitest';
import { analyseBatch } from '../../server/src/chem/batch';
import { setSafetyStage } from '../../server/src/chem/batch/safety';
import { DEFAULT_HEAT_THRESHOLD_K as SAFETY_DEFAULT, HAZARD_CAUTION } from '../../server/src/chem/safety';
import { DEFAULT_CHEM_SETTINGS, DEFAULT_HEAT_THRESHOLD_K, type ChemSettings } from '../../server/src/chem/settings';
import { batchLines } from '../fixtures/batch';

const batch = (text: string, settings: ChemSettings = DEFAULT_CHEM_SETTINGS) => analyseBatch(batchLines(text), null, settings);
const of = (b: ReturnType<typeof batch>, code: string) => b.diagnostics.filter((d) => d.code === code);
/** The characters of a finding, as written. */
const at = (text: string, d: { start: number; end: number }) => text.slice(d.start, d.end);

const NA_OH = 22.99 + 15.999 + 1.008;
const NH4NO3 = 2 * 14.007 + 4 * 1.008 + 3 * 15.999;

const BLEACH_ACID = ['name: Rinse sanitiser (a mistake)', 'volume: 10 L', 'NaOCl 50 g @ 12.5%', 'HCl 20 g @ 36%'].join('\n');
const ACID_BLEACH = ['volume: 10 L', 'HCl 20 g @ 36%', 'NaCl 10 g', 'NaOCl 50 g @ 12.5%'].join('\n');
const PHOSPHATE = ['name: Rinse buffer', 'volume: 2 L', 'phosphate buffer 0.05 M to pH 7.2'].join('\n');
const CAUSTIC = ['name: Soak cleaner caustic', 'volume: 1 L', 'NaOH 200 g'].join('\n');

describe('batch-incompatible', () => {
  it('lands on the later of the two lines, on its characters, as a warning naming both, the product, the harm and the caution', () => {
    const b = batch(BLEACH_ACID);
    const found = of(b, 'batch-incompatible');
    expect(found).toHaveLength(1);
    const d = found[0];
    expect(d.severity).toBe('warning');
    expect(at(BLEACH_ACID, d)).toBe('HCl 20 g @ 36%');
    expect(d.message).toMatch(/hypochlorite \(NaOCl\)/);
    expect(d.message).toMatch(/hydrochloric acid \(HCl\)/);
    expect(d.message).toMatch(/chlorine gas/);
    expect(d.message).toMatch(/toxic gas/);
    expect(d.message.endsWith(HAZARD_CAUTION)).toBe(true);
  });

  it('goes on the later line whichever comes first', () => {
    const d = of(batch(ACID_BLEACH), 'batch-incompatible');
    expect(d.map((x) => at(ACID_BLEACH, x))).toEqual(['NaOCl 50 g @ 12.5%']);
  });

  it('is raised for a line that is not counted where its formula is readable (an acid poured by a unit not known)', () => {
    const text = ['volume: 10 L', 'NaOCl 50 g @ 12.5%', 'HCl 200 parsecs'].join('\n');
    const b = batch(text);
    expect(b.skipped.map((s) => s.text)).toEqual(['HCl 200 parsecs']);
    expect(of(b, 'batch-incompatible').map((d) => at(text, d))).toEqual(['HCl 200 parsecs']);
    expect(b.hazards[0]).toMatchObject({ kind: 'chlorine', ingredients: ['NaOCl', 'HCl'] });
  });

  it('fills `hazards` in the contract shape: kind, message, ingredients (typeset, in line order), and the lines', () => {
    const b = batch(BLEACH_ACID);
    expect(b.hazards).toHaveLength(1);
    const h = b.hazards[0];
    expect(h).toMatchObject({ kind: 'chlorine', harm: 'toxic gas', ingredients: ['NaOCl', 'HCl'] });
    expect(typeof h.message).toBe('string');
    expect(h.lines.map((x) => BLEACH_ACID.slice(x, BLEACH_ACID.indexOf('\n', x) < 0 ? undefined : BLEACH_ACID.indexOf('\n', x)))).toEqual([
      'NaOCl 50 g @ 12.5%',
      'HCl 20 g @ 36%',
    ]);
  });

  it('takes the pH of the equilibrium where it speaks for the whole batch, and not where it counts an ion it does not know', () => {
    // Cyanide with sulfuric acid: every ion is in the equilibrium's tables, so its pH is the one the rule uses.
    const cyanide = batch(['volume: 20 L', 'NaCN 600 g', 'H2SO4 100 g'].join('\n'));
    expect(cyanide.hazards.map((h) => h.kind)).toEqual(['hydrogen-cyanide']);
    expect(cyanide.hazards[0].pH?.from).toBe('solution');
    expect(cyanide.hazards[0].pH?.value).toBeCloseTo(cyanide.solution?.pH ?? NaN, 6);
    // Hypochlorite is not in the equilibrium's tables (it counts OCl⁻ as forming nothing, at pH 7): the reading
    // makes its own estimate rather than take that pH.
    const bleach = batch(BLEACH_ACID);
    expect(bleach.solution?.inert).toContain('OCl^-');
    expect(bleach.hazards[0].pH?.from ?? 'estimate').toBe('estimate');
  });

  it('is not raised for an ordinary batch: a phosphate buffer, a brine', () => {
    for (const text of [PHOSPHATE, ['volume: 1 L', 'NaCl 5.84 g', 'KCl 0.75 g'].join('\n')]) {
      const b = batch(text);
      expect(b.hazards).toEqual([]);
      expect(of(b, 'batch-incompatible')).toEqual([]);
      expect(of(b, 'batch-heat')).toEqual([]);
    }
  });
});

describe('batch-heat and `heat`', () => {
  it('200 g NaOH made up to 1 L warms by about 50 K: a warning at the default 15 K, on the NaOH line', () => {
    const b = batch(CAUSTIC);
    const h = b.heat;
    expect(h).not.toBeNull();
    // CRC Handbook: ΔsolH°(NaOH) = −44.51 kJ/mol at infinite dilution (from memory); at about 10 mol H2O per
    // mol the integral heat is a little less (NBS tables, from memory): 5 mol give about −210 to −223 kJ.
    const mol = 200 / NA_OH;
    expect(mol).toBeCloseTo(5.0, 2);
    expect(h!.kJ).toBeLessThan(-0.85 * 44.51 * mol);
    expect(h!.kJ).toBeGreaterThan(-1.02 * 44.51 * mol);
    // ΔT = −ΔH/(m·cp): about 1.1 kg of solution at 3.5–4.2 J/(g·K) (water 4.18, CRC Handbook, from memory).
    expect(h!.temperatureRiseK).toBeGreaterThan(-h!.kJ / (1.2 * 4.18));
    expect(h!.temperatureRiseK).toBeLessThan(-h!.kJ / (1.0 * 3.4));
    expect(typeof h!.method).toBe('string');
    expect(h!.method).toMatch(/estimate/);
    const d = of(b, 'batch-heat');
    expect(d).toHaveLength(1);
    expect(d[0].severity).toBe('warning');
    expect(at(CAUSTIC, d[0])).toBe('NaOH 200 g');
    expect(d[0].message).toMatch(/warms it by about 5\d K/);
    expect(d[0].message).toMatch(/more than 15 K/);
    expect(d[0].message).toMatch(/cold water/);
    expect(d[0].message).toMatch(/SDS/);
  });

  it('follows the setting: no warning with the threshold at 60 K, a warning at 40 K', () => {
    expect(of(batch(CAUSTIC, { ...DEFAULT_CHEM_SETTINGS, heatThresholdK: 60 }), 'batch-heat')).toEqual([]);
    expect(of(batch(CAUSTIC, { ...DEFAULT_CHEM_SETTINGS, heatThresholdK: 40 }), 'batch-heat')).toHaveLength(1);
    const b = batch(CAUSTIC, { ...DEFAULT_CHEM_SETTINGS, heatThresholdK: 60 });
    expect(b.heat?.thresholdK).toBe(60);
    expect(b.heat?.exceeds).toBe(false);
  });

  it('a cooling batch has a negative rise: 400 g NH4NO3 to 1 L cools by about 30 K', () => {
    const text = ['volume: 1 L', 'NH4NO3 400 g'].join('\n');
    const b = batch(text);
    // CRC Handbook: ΔsolH°(NH4NO3) = +25.69 kJ/mol (from memory); 400 g is 5.0 mol, +128 kJ at infinite dilution.
    const kJ = (400 / NH4NO3) * 25.69;
    expect(b.heat!.kJ).toBeGreaterThan(0.7 * kJ);
    expect(b.heat!.kJ).toBeLessThan(1.15 * kJ);
    expect(b.heat!.temperatureRiseK).toBeLessThan(-15);
    expect(b.heat!.temperatureRiseK).toBeGreaterThan(-kJ / (1.0 * 3.0));
    const d = of(b, 'batch-heat');
    expect(d).toHaveLength(1);
    expect(d[0].message).toMatch(/cools it by about/);
  });

  it('an ordinary batch gets a small figure and no warning: 0.75 g KCl in 1 L takes up about 0.17 kJ', () => {
    const b = batch(['volume: 1 L', 'KCl 0.75 g'].join('\n'));
    // CRC Handbook: ΔsolH°(KCl) = +17.22 kJ/mol (from memory); 0.75 g is 0.01006 mol (74.55 g/mol).
    expect(b.heat!.kJ).toBeCloseTo((0.75 / 74.548) * 17.22, 2);
    expect(b.heat!.temperatureRiseK).toBeLessThan(0);
    expect(b.heat!.temperatureRiseK).toBeGreaterThan(-0.1);
    expect(of(b, 'batch-heat')).toEqual([]);
  });

  it('is null where no ingredient has a known heat, and the stage can be switched off for the benchmark', () => {
    expect(batch(['volume: 1 L', 'NaXx 1 g'].join('\n')).heat).toBeNull();
    setSafetyStage(false);
    try {
      const b = batch(CAUSTIC);
      expect(b.heat).toBeNull();
      expect(b.hazards).toEqual([]);
      expect(of(b, 'batch-heat')).toEqual([]);
    } finally {
      setSafetyStage(true);
    }
    expect(of(batch(CAUSTIC), 'batch-heat')).toHaveLength(1);
  });
});

describe('the heat threshold setting', () => {
  it('defaults to 15 K, the same figure as the safety reading uses when none is given', () => {
    expect(DEFAULT_CHEM_SETTINGS.heatThresholdK).toBe(15);
    expect(DEFAULT_HEAT_THRESHOLD_K).toBe(SAFETY_DEFAULT);
  });
});
