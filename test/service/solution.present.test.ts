/**
 * The equilibrium of a batch in every output: the contract's `solution` JSON, the batch hover (pH first,
 * species, buffer capacity, I, saturation, the limits in one line), the inserted tables, the plain text, the
 * preview and the report (the species distribution over pH and the saturation-index bars, read back as
 * strict XML). The notes are of an invented buffer prep room and plating line.
 */
import { load } from 'cheerio';
import MarkdownIt from 'markdown-it';
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { speciesDistribution } from '../../server/src/chem/solution/distribution';
import { readSettings } from '../../server/src/service/config';
import { createLanguageService } from '../../server/src/service/languageService';
import { ionwrightPreview } from '../../server/src/service/preview';
import { reportHtml } from '../../server/src/service/report';
import { saturationChart, speciesChart } from '../../server/src/service/speciesChart';
import { all, hasClass, parse } from './chart-svg';

const CSS = readFileSync(join(__dirname, '../../media/preview.css'), 'utf8');
const ls = createLanguageService();

const NOTE = [
  '# Prep room, week 12',
  '',
  '```batch',
  'name: Saline phosphate SP-4',
  'volume: 1 L',
  'pH: 7.4',
  'NaCl 150 mM',
  'phosphate buffer 20 mM to pH 7.40',
  '```',
  '',
  '```batch',
  'name: Scale trial H-2',
  'volume: 1 L',
  'CaCl2·2H2O 1.47 g',
  'Na2CO3 1.06 g',
  '```',
  '',
].join('\n');
const doc = ls.analyse(NOTE, 'markdown');

describe('the batch JSON (the contract: solution {temperatureC, pH, ionicStrengthM, activityModel, converged, species, saturation})', () => {
  const [saline, scale] = ls.batchesJson(doc);

  it('has the fields of the contract, with pH = −log a(H⁺) and I from the equilibrium species', () => {
    const s = saline.solution!;
    expect(s).toMatchObject({ temperatureC: 25, activityModel: 'Davies', converged: true });
    expect(s.pH).toBeCloseTo(7.4, 4);
    const h = s.species.find((x) => x.formula === 'H^+')!;
    expect(-Math.log10(h.activity)).toBeCloseTo(s.pH!, 3);
    const I = 0.5 * s.species.reduce((sum, x) => sum + x.concentrationM * x.charge * x.charge, 0);
    expect(s.ionicStrengthM).toBeCloseTo(I, 5);
    for (const x of s.species) expect(Object.keys(x)).toEqual(expect.arrayContaining(['formula', 'charge', 'concentrationM', 'activity']));
  });

  it('lists the saturation index of every solid the components can form; a buffer line appears as its two forms', () => {
    const sat = scale.solution!.saturation;
    expect(sat.map((x) => x.solid)).toEqual(expect.arrayContaining(['CaCO3', 'Ca(OH)2']));
    expect(sat[0]).toMatchObject({ solid: 'CaCO3' });
    expect(sat[0].saturationIndex).toBeGreaterThan(2);
    expect(scale.solution!.precipitates[0].solid).toBe('CaCO3');
    const forms = saline.ingredients.filter((i) => 'buffer' in i);
    expect(forms.map((i) => [i.formula, i.hill])).toEqual([
      ['NaH2PO4', 'H2NaO4P'],
      ['Na2HPO4', 'HNa2O4P'],
    ]);
    for (const f of forms) expect(f.massG).toBeGreaterThan(0);
    expect(saline.statedPH).toBe(7.4);
  });

  it('is null without a final volume', () => {
    const d = ls.analyse('```batch\nNaCl 5 g\n```\n', 'markdown');
    expect(ls.batchesJson(d)[0].solution).toBeNull();
  });
});

describe('the batch hover on the opening line', () => {
  const md = ls.hover(doc, { line: 10, character: 3 })!.markdown;
  const lines = md.split('\n').filter(Boolean);

  it('puts the pH first, then the species, the buffer capacity and I, then the saturation, then the limits in one line', () => {
    expect(lines[0]).toMatch(/^\*\*Scale trial H-2\*\*/);
    expect(lines[1]).toMatch(/^\*\*pH 10\.\d\d \(equilibrium estimate\)\*\* · buffer capacity [\d.]+ mmol\/\(L·pH\) · I = [\d.]+ M at equilibrium$/);
    expect(lines[2]).toMatch(/^Species: Na⁺ 20 mM · Cl⁻ 20 mM · CaCO₃\(aq\)/);
    expect(lines[3]).toMatch(/^Saturation: ⚠ CaCO₃ \(calcite\) SI \+3\.\d\d, about 98\d mg would come out \(pH then 9\.\d\d\)/);
    expect(lines[4]).toMatch(/^_An estimate: Davies activities \(to I ≈ 0\.5 M\), 25 °C, no gases exchanged with air, no redox; measure the pH\._$/);
  });

  it('on a buffer line: both forms to weigh, and how far the ideal ratio is', () => {
    const b = ls.hover(doc, { line: 7, character: 2 })!.markdown;
    expect(b).toMatch(/^\*\*phosphate buffer\*\* · 0\.02 M to pH 7\.40/);
    expect(b).toMatch(/Acid form \*\*NaH₂PO₄\*\*: weigh \*\*[\d.]+ mg\*\*/);
    expect(b).toMatch(/Base form \*\*Na₂HPO₄\*\*: weigh \*\*[\d.]+ g\*\*/);
    expect(b).toMatch(/Henderson–Hasselbalch at pKa 7\.20 \(I = 0\) would give 1\.59 : 1/);
  });
});

describe('the tables, the plain text and the preview', () => {
  it('inserted table and `ionwright table`: the solution with its species and saturation tables', () => {
    const t = ls.tables(doc);
    expect(t).toContain('**Solution at equilibrium**: pH 7.40 (equilibrium estimate; stated 7.40)');
    expect(t).toMatch(/\| Species \| Charge \| Concentration \(M\) \| Activity \|/);
    expect(t).toMatch(/\| CaCO₃ \(calcite\) \| \+3\.\d\d \| oversaturated \|/);
    expect(t).toMatch(/_CaCO₃ \(calcite\): about 98\d mg would come out \(pH then 9\.\d\d\)\._/);
  });

  it('plain text (`ionwright batch`): the same figures', () => {
    const text = ls.batchTexts(doc)[1];
    expect(text).toMatch(/Solution at equilibrium: pH 10\.\d\d/);
    expect(text).toMatch(/CaCO₃ \(calcite\)\s+\+3\.\d\d\s+oversaturated/);
  });

  it('the preview: the solution line, a species table and the saturation table with the oversaturated row marked', () => {
    const md = new MarkdownIt().use(ionwrightPreview);
    const $ = load(md.render(NOTE));
    expect($('p.iw-solution').first().text()).toMatch(/^Solution at equilibrium: pH 7\.40/);
    expect($('table.iw-species').length).toBe(2);
    // The formula typeset (CaCO<sub>3</sub>), then its name, the index and the state.
    expect($('table.iw-saturation tr.iw-over').first().text()).toMatch(/^CaCO3 calcite\+3\.\d\doversaturated$/);
  });
});

describe('the report charts', () => {
  const html = reportHtml(doc, { title: 'prep.md', css: CSS, markdownIt: () => new MarkdownIt() });
  const $ = load(html);

  it('one species chart per batch with an equilibrium and one saturation chart per batch with solids, self-contained', () => {
    const svgs = $('figure.iw-eqfigure svg.iw-eqchart');
    // Saline phosphate has no solid of the table (sodium, potassium and phosphate form none); the scale trial has two.
    expect(svgs.length).toBe(2 + 1);
    expect(html).not.toMatch(/<script|url\(/i);
  });

  it('the species distribution: the phosphate panel, its forms in turn, the batch pH marked (pKa 2.15, 7.20, 12.35, CRC)', () => {
    const s = doc.batches[0].analysis.solution!;
    const d = speciesDistribution(s.equilibrium);
    const phosphate = d.groups.find((g) => g.component === 'PO4^3-')!;
    const at = (pH: number) => d.pH.indexOf(pH);
    const major = (pH: number) => phosphate.series.reduce((m, x) => (x.fraction[at(pH)] > m.fraction[at(pH)] ? x : m)).label;
    expect([major(1), major(5), major(10), major(14)]).toEqual(['H3PO4', 'H2PO4^-', 'HPO4^2-', 'PO4^3-']);
    for (let k = 0; k < d.pH.length; k++) {
      const sum = phosphate.series.reduce((t, x) => t + (Number.isNaN(x.fraction[k]) ? 0 : x.fraction[k]), 0);
      // Shares of the total add up to 1 (the rest is in the "other" series or in complexes with Na⁺, none here).
      expect(sum).toBeCloseTo(1, 6);
    }
    const svg = parse(speciesChart(d, { id: 'c', title: 'species' }));
    expect(all(svg, (e) => e.name === 'polyline').length).toBeGreaterThanOrEqual(4);
    const texts = all(svg, (e) => e.name === 'text').map((e) => e.text);
    expect(texts).toEqual(expect.arrayContaining(['H₂PO₄⁻', 'HPO₄²⁻', 'batch pH 7.40']));
    // Same input, same svg.
    expect(speciesChart(d, { id: 'c', title: 'species' })).toBe(speciesChart(d, { id: 'c', title: 'species' }));
  });

  it('the saturation bars: each solid a bar from zero, oversaturated to the right, its value and state written', () => {
    const s = doc.batches[1].analysis.solution!;
    const svg = parse(saturationChart(s.saturation, { id: 's', title: 'SI' }));
    const over = all(svg, hasClass('iw-ec-over'));
    const under = all(svg, hasClass('iw-ec-under'));
    expect(over.length).toBe(1);
    expect(under.length).toBe(s.saturation.length - 1);
    const texts = all(svg, (e) => e.name === 'text').map((e) => e.text);
    expect(texts.some((t) => /^\+3\.\d\d over$/.test(t))).toBe(true);
    expect(texts.some((t) => /^−\d+\.\d\d under/.test(t))).toBe(true);
  });
});

describe('the setting ionwright.batch.phTolerance', () => {
  const note = '```batch\nvolume: 1 L\npH: 6.5\nKH2PO4 10 mM\nNa2HPO4 10 mM\n```\n';
  const codes = (settings: ReturnType<typeof readSettings>) => {
    const s = createLanguageService(settings.service);
    return s.diagnostics(s.analyse(note, 'markdown')).map((d) => d.code);
  };

  it('is read and checked: 0.3 unless given, a value outside 0.01–3 falls back to it', () => {
    expect(readSettings(undefined).service.chem.phTolerance).toBe(0.3);
    expect(readSettings({ batch: { phTolerance: 1 } }).service.chem.phTolerance).toBe(1);
    expect(readSettings({ batch: { phTolerance: 9 } }).service.chem.phTolerance).toBe(0.3);
  });

  it('decides the batch-ph warning: the 1:1 phosphate at about pH 6.9 is 0.4 above a stated 6.5', () => {
    expect(codes(readSettings(undefined))).toEqual(['batch-ph']);
    expect(codes(readSettings({ batch: { phTolerance: 1 } }))).toEqual([]);
  });
});
