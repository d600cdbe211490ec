/**
 * The safety reading as the user sees it: the batch JSON's `hazards` and `heat` (the contract's shape),
 * the batch hover's Safety section, the tables, plain text and preview, the formula card's GHS statements
 * and enthalpy of solution, and the setting `ionwright.batch.heatThresholdK`. The notes are invented (a
 * fictional plating shop, "Kestrel Finishing").
 *
 * Reference figures: enthalpies of solution at infinite dilution from the CRC Handbook, "Enthalpy of
 * solution of electrolytes" (NaCl +3.88, NaOH −44.51 kJ/mol; from memory); GHS classifications of potassium
 * cyanide (H300, H310, H330, EUH032; skull and crossbones) and sodium hydroxide (H314; corrosion) as in CLP
 * Annex VI (from memory).
 */
import { load } from 'cheerio';
import MarkdownIt from 'markdown-it';
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { analyseDocument } from '../../server/src/service/document';
import { ionwrightPreview } from '../../server/src/service/preview';
import { reportHtml } from '../../server/src/service/report';
import { SAFETY_NOTICE, SDS_NOTE } from '../../server/src/chem/safety';
import { readSettings } from '../../server/src/service/config';
import { createLanguageService } from '../../server/src/service/languageService';

const NOTE = [
  '# Kestrel Finishing, tank room',
  '',
  '```batch',
  'name: Sanitiser (a mistake)',
  'volume: 10 L',
  'NaOCl 50 g @ 12.5%',
  'HCl 20 g @ 36%',
  '```',
  '',
  '```batch',
  'name: Rinse buffer',
  'volume: 2 L',
  'phosphate buffer 0.05 M to pH 7.2',
  '```',
  '',
  '```batch',
  'name: Soak caustic',
  'volume: 1 L',
  'NaOH 200 g',
  '```',
  '',
  'Bench stock: `KCN` and `NaCl`.',
  '',
].join('\n');
const line = (text: string) => NOTE.split('\n').indexOf(text);

const ls = createLanguageService();
const doc = ls.analyse(NOTE, 'markdown');
const json = ls.batchesJson(doc);

describe('batch --json: hazards and heat', () => {
  it('a dangerous batch: hazards [{kind, message, ingredients}] with the lines, heat as the contract has it or null', () => {
    const [sanitiser] = json;
    expect(sanitiser.hazards).toHaveLength(1);
    const h = sanitiser.hazards[0];
    expect(h.kind).toBe('chlorine');
    expect(h.ingredients).toEqual(['NaOCl', 'HCl']);
    expect(h.message).toMatch(/chlorine gas/);
    expect(h.lines).toEqual([line('NaOCl 50 g @ 12.5%'), line('HCl 20 g @ 36%')]);
    expect(sanitiser.heat === null || typeof sanitiser.heat.kJ === 'number').toBe(true);
  });

  it('an ordinary batch: no hazards, and a small heat estimate with its method', () => {
    const buffer = json[1];
    expect(buffer.hazards).toEqual([]);
    expect(buffer.heat).not.toBeNull();
    const heat = buffer.heat!;
    expect(Object.keys(heat)).toEqual(expect.arrayContaining(['kJ', 'temperatureRiseK', 'method']));
    expect(typeof heat.kJ).toBe('number');
    expect(Math.abs(heat.temperatureRiseK!)).toBeLessThan(1);
    expect(heat.method).toMatch(/estimate/);
    expect(heat.exceeds).toBe(false);
  });

  it('the caustic make-up: a rise of about 50 K (CRC: −44.51 kJ/mol × 5 mol ≈ −222 kJ at infinite dilution), its step on the NaOH line', () => {
    const caustic = json[2];
    expect(caustic.hazards).toEqual([]);
    expect(caustic.heat!.kJ).toBeLessThan(-190);
    expect(caustic.heat!.kJ).toBeGreaterThan(-230);
    expect(caustic.heat!.temperatureRiseK).toBeGreaterThan(40);
    expect(caustic.heat!.temperatureRiseK).toBeLessThan(65);
    expect(caustic.heat!.steps).toEqual([expect.objectContaining({ kind: 'solution', ingredient: 'NaOH', line: line('NaOH 200 g') })]);
    expect(caustic.heat!.advice.length).toBeGreaterThan(0);
    expect(caustic.diagnostics.map((d) => d.code)).toContain('batch-heat');
  });

  it('survives JSON: every text field (method, advice, notes) is a plain string', () => {
    const round = JSON.parse(JSON.stringify(json)) as typeof json;
    expect(round[2].heat!.method).toBe(json[2].heat!.method);
    expect(round[2].heat!.notes.length).toBeGreaterThan(0);
  });
});

describe('diagnostics', () => {
  it('batch-incompatible is a warning on the later line; batch-heat a warning on the NaOH line', () => {
    const diags = ls.diagnostics(doc);
    const inc = diags.filter((d) => d.code === 'batch-incompatible');
    expect(inc).toHaveLength(1);
    expect(inc[0].severity).toBe(2);
    expect(inc[0].range.start).toEqual({ line: line('HCl 20 g @ 36%'), character: 0 });
    expect(inc[0].range.end).toEqual({ line: line('HCl 20 g @ 36%'), character: 'HCl 20 g @ 36%'.length });
    const heat = diags.filter((d) => d.code === 'batch-heat');
    expect(heat).toHaveLength(1);
    expect(heat[0].severity).toBe(2);
    expect(heat[0].range.start.line).toBe(line('NaOH 200 g'));
  });
});

describe('the batch hover', () => {
  const hoverAt = (text: string) => ls.hover(doc, { line: line(text), character: 0 })?.markdown ?? '';

  it('has a Safety section: the hazard, the heat estimate with ΔT, its method labelled an estimate, the notice', () => {
    const md = hoverAt('name: Soak caustic');
    expect(md).toContain('**Safety**');
    expect(md).toMatch(/ΔT ≈ \+5\d K \(20 → 7\d(\.\d)? °C\)/);
    expect(md).toMatch(/— estimate, over the 15 K setting/);
    expect(md).toContain('cold water');
    expect(md).toContain(SAFETY_NOTICE);
    const sanitiser = hoverAt('name: Sanitiser (a mistake)');
    expect(sanitiser).toMatch(/⚠ \*\*chlorine\*\* from NaOCl \+ HCl \(toxic gas\)/);
    // The safety section says it once; the list of warnings does not repeat it.
    expect(sanitiser.match(/chlorine gas/g)).toHaveLength(1);
  });

  it('on a line not counted: the pair it is still in', () => {
    const text = ['```batch', 'volume: 10 L', 'NaOCl 50 g @ 12.5%', 'HCl 200 parsecs', '```', ''].join('\n');
    const d = ls.analyse(text, 'markdown');
    const md = ls.hover(d, { line: 3, character: 1 })?.markdown ?? '';
    expect(md).toContain('**not counted**');
    expect(md).toContain('**chlorine** from NaOCl + HCl');
    expect(md).toContain(SAFETY_NOTICE);
  });

  it('on the later line: the hazard it is in; on the caustic line: the heat of dissolving it', () => {
    expect(hoverAt('HCl 20 g @ 36%')).toContain('**chlorine** from NaOCl + HCl');
    expect(hoverAt('NaOH 200 g')).toMatch(/Heat of dissolution: ΔH ≈ −2\d\d\.\d kJ \(−4\d\.\d kJ\/mol\) — estimate/);
  });
});

describe('tables, plain text and preview', () => {
  it('the Markdown table and the plain text carry the safety section with the notice', () => {
    const tables = ls.batchTables(doc);
    expect(tables[0]).toContain('| Forms | From | Harm | What to know |');
    expect(tables[0]).toContain('| chlorine | NaOCl + HCl | toxic gas |');
    expect(tables[1]).toContain("No dangerous pair of ingredients in Ionwright's tables.");
    expect(tables[2]).toMatch(/Heat of making up: ΔH ≈ −2\d\d kJ, ΔT ≈ \+5\d K/);
    for (const t of tables) expect(t).toContain(SAFETY_NOTICE);
    const texts = ls.batchTexts(doc);
    expect(texts[0]).toMatch(/⚠ NaOCl \+ HCl → chlorine \(toxic gas\)/);
    expect(texts[2]).toContain('⚠ Dissolve the caustic in portions');
    // The warnings list leaves the safety findings to the section.
    expect(texts[0]).not.toMatch(/^warning: .*chlorine/m);
  });
});

describe('the formula card', () => {
  it('GHS statements and pictograms, with the note to check the SDS (KCN), in JSON, text and hover', () => {
    const card = ls.cardJson('KCN');
    expect(card.ghs).not.toBeNull();
    expect(card.ghs!.signalWord).toBe('Danger');
    expect(card.ghs!.statements.map((s) => s.code)).toEqual(expect.arrayContaining(['H300', 'H310', 'H330', 'EUH032']));
    expect(card.ghs!.pictograms.map((p) => p.name)).toContain('skull and crossbones');
    expect(card.ghs!.sds).toBe(SDS_NOTE);
    expect(ls.cardText('KCN')).toMatch(/GHS +Danger · pictograms .*skull and crossbones \(GHS06\)/);
    const md = ls.hover(doc, { line: line('Bench stock: `KCN` and `NaCl`.'), character: 'Bench stock: `K'.length })?.markdown ?? '';
    expect(md).toContain('GHS: **Danger');
    expect(md).toContain('H300 Fatal if swallowed.');
    expect(md).toContain("check the supplier's SDS");
    // The existing fields are unchanged (the contract's card).
    expect(card.formula).toBe('KCN');
    expect(card.molarMass).toBeCloseTo(39.098 + 12.011 + 14.007, 2);
  });

  it('the enthalpy of solution with why it warms or cools (NaCl +3.88 kJ/mol, CRC Handbook); no GHS where the table has none', () => {
    const card = ls.cardJson('NaCl');
    expect(card.ghs).toBeNull();
    expect(card.enthalpyOfSolution?.kJPerMol).toBeCloseTo(3.88, 2);
    expect(card.enthalpyOfSolution?.why).toMatch(/cools the water/);
    const md = ls.cardMarkdown('NaCl');
    expect(md).toMatch(/Enthalpy of solution \+3\.88 kJ\/mol at infinite dilution: dissolving it cools the water/);
    expect(ls.cardMarkdown('NaOH')).toMatch(/dissolving it warms the water/);
    expect(ls.cardJson('NaOH').ghs?.statements.map((s) => s.code)).toContain('H314');
  });
});

describe('the setting ionwright.batch.heatThresholdK', () => {
  it('is read and checked: 15 unless given, a value outside 1–100 falls back to it', () => {
    expect(readSettings(undefined).service.chem.heatThresholdK).toBe(15);
    expect(readSettings({ batch: { heatThresholdK: 60 } }).service.chem.heatThresholdK).toBe(60);
    expect(readSettings({ batch: { heatThresholdK: 500 } }).service.chem.heatThresholdK).toBe(15);
    expect(readSettings({ batch: { heatThresholdK: 'hot' } }).service.chem.heatThresholdK).toBe(15);
  });

  it('decides the batch-heat warning of the caustic make-up', () => {
    const codes = (raw: unknown) => {
      const s = createLanguageService(readSettings(raw).service);
      return s.diagnostics(s.analyse(NOTE, 'markdown')).map((d) => d.code);
    };
    expect(codes(undefined)).toContain('batch-heat');
    expect(codes({ batch: { heatThresholdK: 60 } })).not.toContain('batch-heat');
    expect(codes({ batch: { heatThresholdK: 60 } })).toContain('batch-incompatible');
  });
});

describe('the preview and the report', () => {
  const render = (src: string) => new MarkdownIt().use(ionwrightPreview).render(src);

  it('the preview: a safety box per batch with the hazards table, the heat line and the notice', () => {
    const $ = load(render(NOTE));
    const boxes = $('figure.iw-batch .iw-safety');
    expect(boxes.length).toBe(3);
    const first = boxes.eq(0);
    expect(first.find('table.iw-hazards tbody tr').length).toBe(1);
    expect(first.find('table.iw-hazards td').eq(0).text()).toBe('chlorine');
    expect(first.find('table.iw-hazards td').eq(1).text()).toBe('NaOCl + HCl');
    expect(boxes.eq(2).find('.iw-heat-over').text()).toMatch(/ΔT ≈ \+5\d K/);
    expect(boxes.eq(2).find('ul.iw-advice li').length).toBeGreaterThan(0);
    // No steps table in the preview (the report has it).
    expect($('table.iw-heat-steps').length).toBe(0);
    expect(first.text()).toContain(SAFETY_NOTICE);
  });

  it('the report: the steps of each heat estimate as a table, with the notes of the model', () => {
    const css = readFileSync(join(__dirname, '../../media/preview.css'), 'utf8');
    const $ = load(reportHtml(analyseDocument(NOTE, 'markdown'), { title: 'kestrel.md', css, markdownIt: () => new MarkdownIt() }));
    const steps = $('table.iw-heat-steps');
    expect(steps.length).toBe(3);
    const caustic = steps.last();
    expect(caustic.find('tbody tr').length).toBe(1);
    expect(caustic.find('tbody td').eq(0).text()).toBe('dissolution');
    expect(caustic.find('tbody td').eq(2).text()).toMatch(/^−2\d\d\.\d$/);
    expect($('.iw-safety').text()).toContain('No heat is lost to the vessel');
  });
});
