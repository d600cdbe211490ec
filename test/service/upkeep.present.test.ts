/**
 * Bath upkeep in the batch pipeline and its outputs: titre lines and `tank:` in a batch block are neither
 * ingredients nor errors; the titres are computed against the block's own targets and the additions bring
 * the tank back to them. Arithmetic by hand (c = V·c_titrant / V_sample; EDTA 1:1 with Ni²⁺, common
 * practice); atomic weights IUPAC/CIAAW 2021 (Ni 58.693). An invented shop (Ferncliff Platers).
 */
import { describe, expect, it } from 'vitest';
import { analyseBatch } from '../../server/src/chem/batch';
import { createLanguageService } from '../../server/src/service/languageService';
import MarkdownIt from 'markdown-it';
import { batchJson } from '../../server/src/service/batchJson';
import { reportHtml } from '../../server/src/service/report';
import { batchLines } from '../fixtures/batch';

const BLOCK = [
  'name: Watts W-2',
  'volume: 1 L',
  'NiSO4·6H2O 280 g',
  'H3BO3 40 g',
  'tank: 400 L',
  'titre NiSO4·6H2O: 2.00 mL sample, 18.40 mL 0.0500 M EDTA',
].join('\n');

describe('bath upkeep in a batch', () => {
  const b = analyseBatch(batchLines(BLOCK));

  it('reads the titre and tank lines as neither ingredients nor errors', () => {
    expect(b.ingredients.map((i) => i.analysis.hill)).toEqual(['H12NiO10S', 'BH3O3']);
    expect(b.skipped).toEqual([]);
    expect(b.diagnostics.filter((d) => d.severity === 'error')).toEqual([]);
  });

  it('computes the titre against the batch target and the additions for the tank', () => {
    const u = b.upkeep!;
    const [t] = u.titres;
    // 18.40 mL × 0.0500 M ÷ 2.00 mL = 0.460 M; × 58.693 g/mol = 27.00 g/L Ni.
    expect('reading' in t && t.concentrationM).toBeCloseTo(0.46, 9);
    expect('reading' in t && t.carrierGPerL).toBeCloseTo(0.46 * 58.693, 2);
    const target = 280 / b.ingredients[0].molarMass;
    expect('reading' in t && t.ofTarget).toBeCloseTo(0.46 / target, 9);
    // Below target: (target − 0.460) M × 400 L of the hexahydrate; boric acid not analysed, taken as at target.
    const ni = u.additions!.additions.find((a) => a.formula.startsWith('NiSO4'))!;
    expect(ni.addMol).toBeCloseTo((target - 0.46) * 400, 6);
    expect(ni.afterM).toBeCloseTo(target, 9);
    expect(u.additions!.additions.find((a) => a.formula === 'H3BO3')?.assumed).toBe(true);
  });

  it('is in the JSON, the hover of the batch and of the titre line, and the tables', () => {
    const ls = createLanguageService();
    const text = '```batch\n' + BLOCK + '\n```\n';
    const doc = ls.analyse(text, 'markdown');
    const json = batchJson(doc, doc.batches[0]);
    expect(json.upkeep?.tank).toEqual({ litres: 400, capacityL: null });
    expect(json.upkeep?.titres[0]).toMatchObject({ analyte: 'NiSO₄·6H₂O' });
    const at = text.indexOf('18.40');
    const h = ls.hover(doc, doc.lines.positionAt(at))!;
    expect(h.markdown).toMatch(/^\*\*Titre\*\* · NiSO₄·6H₂O 0\.46 M/);
    expect(h.markdown).toContain('18.4 mL');
    const summary = ls.hover(doc, doc.lines.positionAt(text.indexOf('Watts')))!.markdown;
    expect(summary).toContain('**Upkeep** (estimate)');
    expect(summary).toMatch(/Add .* NiSO₄·6H₂O/);
    expect(ls.tables(doc)).toContain('**Upkeep** (estimate)');
    const page = reportHtml(doc, { title: 'w2.md', css: '', markdownIt: () => new MarkdownIt() });
    expect(page).toContain('class="iw-upkeep"');
    expect(page).toMatch(/Titre: NiSO₄·6H₂O 0\.46 M/);
  });
});
