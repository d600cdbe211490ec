/**
 * The Markdown preview plugin, rendered with markdown-it (the same engine VS Code's preview uses) and read
 * back with cheerio. Numbers are checked against hand calculations from IUPAC/CIAAW 2021 abridged atomic
 * weights (Na 22.990, Cl 35.45, Cu 63.546, S 32.06, O 15.999, H 1.0080), the same worked examples as
 * test/batch.test.ts.
 */
import { load, type CheerioAPI } from 'cheerio';
import fc from 'fast-check';
import MarkdownIt from 'markdown-it';
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { analyseDocument } from '../../server/src/service/document';
import { documentDiagnostics } from '../../server/src/service/diagnostics';
import { ionwrightPreview, type PreviewOptions } from '../../server/src/service/preview';
import { DEFAULT_SETTINGS } from '../../server/src/service/settings';

const NOTE = readFileSync(join(__dirname, '../fixtures/preview-note.md'), 'utf8');
const render = (src: string, options?: Partial<PreviewOptions>) => new MarkdownIt().use(ionwrightPreview, options).render(src);
const dom = (src: string, options?: Partial<PreviewOptions>): CheerioAPI => load(render(src, options));

const NaCl = 22.99 + 35.45;
const CuSO4_5H2O = 63.546 + 32.06 + 4 * 15.999 + 5 * (2 * 1.008 + 15.999);

describe('formulas in inline code', () => {
  const $ = dom(NOTE);
  const formula = (text: string) =>
    $('.iw-formula')
      .filter((_, e) => $(e).text() === text)
      .first();

  it('are typeset: counts in <sub>, charges in <sup>, the hydrate dot kept', () => {
    expect(formula('CuSO4·5H2O').html()).toBe('CuSO<sub>4</sub><span class="iw-dot">·</span>5H<sub>2</sub>O');
    expect(formula('SO42−').html()).toBe('SO<sub>4</sub><sup>2−</sup>');
    // A decimal count stays one subscript.
    expect(formula('Fe0.95O').html()).toBe('Fe<sub>0.95</sub>O');
  });

  it('carry the molar mass in a tooltip (CIAAW 2021 weights)', () => {
    expect(formula('NaCl').attr('title')).toContain(`${NaCl.toFixed(2)} g/mol`);
    expect(formula('CuSO4·5H2O').attr('title')).toContain(`${CuSO4_5H2O.toFixed(2)} g/mol`);
  });

  it('stay code when typesetting is off, and problems are still marked', () => {
    const $off = dom(NOTE, { typesetFormulas: false });
    expect($off('p .iw-formula').length).toBe(0);
    expect($off('p code').filter((_, e) => $off(e).text() === 'NaCl').length).toBe(1);
    expect($off('a.iw-flag').length).toBe($('a.iw-flag').length);
  });

  it('an unreadable formula stays code, underlined, with a marker', () => {
    const bad = $('.iw-code-flagged.iw-error').filter((_, e) => $(e).text() === 'NaXx');
    expect(bad.length).toBe(1);
    expect(bad.next().is('a.iw-flag.iw-error')).toBe(true);
  });

  it('a charge-imbalanced formula is typeset with a warning marker', () => {
    const w = formula('CaNO3');
    expect(w.hasClass('iw-warning')).toBe(true);
    expect(w.next().attr('title')).toMatch(/^warning: /);
  });
});

describe('equations in inline code', () => {
  const $ = dom(NOTE);
  it('a balanced one is marked balanced', () => {
    const eq = $('.iw-equation').filter((_, e) => $(e).text().startsWith('2 NaOH'));
    expect(eq.text()).toBe('2 NaOH + H2SO4 → Na2SO4 + 2 H2O');
    expect(eq.next().is('.iw-mark.iw-balanced')).toBe(true);
  });
  it('an unbalanced one is marked, with the balanced form (4 Al + 3 O2 → 2 Al2O3, common practice)', () => {
    const eq = $('.iw-equation').filter((_, e) => $(e).text().startsWith('Al +'));
    expect(eq.next().is('.iw-mark.iw-unbalanced')).toBe(true);
    expect(eq.nextAll('.iw-balanced-form').first().text()).toBe('(balanced: 4 Al + 3 O2 → 2 Al2O3)');
  });
});

describe('bare formulas in prose', () => {
  const $ = dom(NOTE);
  it("are read by the editor's prose rule: KH2PO4 is typeset, the label S-2 is not", () => {
    expect(
      $('.iw-formula.iw-prose')
        .map((_, e) => $(e).text())
        .get(),
    ).toEqual(['KH2PO4']);
    expect($('p').text()).toContain('sample S-2 is only a label');
  });
  it('are left alone when prose detection is off', () => {
    const $off = dom(NOTE, { settings: { ...DEFAULT_SETTINGS, prose: 'off' } });
    expect($off('.iw-prose').length).toBe(0);
  });
});

describe('a batch block', () => {
  const $ = dom(NOTE);
  const fig = $('figure.iw-batch');
  const rows = fig.find('table.iw-table').first().find('tbody tr');
  const cells = (k: number) =>
    rows
      .eq(k)
      .find('td')
      .map((_, e) => $(e).text())
      .get();

  it('renders as its computed table, with the name and the final volume', () => {
    expect(fig.length).toBe(1);
    expect(fig.find('figcaption').text()).toContain('Rinse K-1');
    expect(fig.find('figcaption').text()).toContain('final volume 500 mL');
    expect(
      fig
        .find('table.iw-table')
        .first()
        .find('thead th')
        .map((_, e) => $(e).text())
        .get(),
    ).toEqual(['Ingredient', 'Amount', 'Molar mass (g/mol)', 'To weigh (g)', 'Moles (mol)', 'Concentration (M)', 'Share of weighed mass']);
  });

  it('0.1000 M NaCl in 500 mL: 0.05 mol, 2.922 g (common textbook example, as in test/batch.test.ts)', () => {
    const [ing, amount, mm, weigh, moles, conc] = cells(0);
    expect(ing).toBe('NaCl');
    expect(amount).toBe('0.1000 M');
    expect(Number(mm)).toBeCloseTo(NaCl, 2);
    expect(Number(weigh)).toBeCloseTo(0.05 * NaCl, 3);
    expect(Number(moles)).toBeCloseTo(0.05, 6);
    expect(Number(conc)).toBeCloseTo(0.1, 6);
  });

  it('1.2484 g of CuSO4·5H2O is 5.000 mmol, 0.01000 M in 500 mL (hydrate water in the molar mass)', () => {
    const [, , , , moles, conc, fraction] = cells(1);
    expect(Number(moles)).toBeCloseTo(1.2484 / CuSO4_5H2O, 6);
    expect(Number(conc)).toBeCloseTo(1.2484 / CuSO4_5H2O / 0.5, 6);
    // Mass fractions of what is weighed: 1.2484 / (2.9220 + 1.2484).
    expect(parseFloat(fraction)).toBeCloseTo((1.2484 / (0.05 * NaCl + 1.2484)) * 100, 1);
  });

  it('lists the ions and the ionic strength I = ½ Σ cᵢzᵢ² below (0.1 M NaCl + 0.01 M CuSO4: I = 0.1 + 0.04 = 0.14 M)', () => {
    const ions = fig
      .find('table.iw-ions tbody tr')
      .map((_, e) => $(e).find('td').first().text())
      .get();
    expect(ions).toEqual(expect.arrayContaining(['Na+', 'Cl−', 'Cu2+', 'SO42−']));
    const I = Number(/= ([0-9.]+) M/.exec(fig.find('.iw-summary').text())?.[1]);
    const expected = 0.5 * (0.1 + 0.1 + (1.2484 / CuSO4_5H2O / 0.5) * 4 * 2);
    expect(I).toBeCloseTo(expected, 3);
  });

  it('marks the bad line where it is, with the source line, and keeps the recipe as written', () => {
    const findings = fig.find('a.iw-flag.iw-error');
    expect(findings.length).toBe(1);
    const badLine = NOTE.split('\n').findIndex((l) => l.includes('furlongs')) + 1;
    const problem = $(`#${findings.attr('href')!.slice(1)}`);
    expect(problem.text()).toContain(`(line ${badLine})`);
    expect(fig.find('details.iw-source pre').text()).toContain('KCl 3 furlongs');
  });

  it("carries the model's notes (weak electrolytes undissociated, no activities)", () => {
    expect(fig.find('.iw-note').text()).toMatch(/undissociated/);
  });

  it('shows the cautions for hazardous ingredients with the SDS note', () => {
    const $c = dom('```batch\nvolume: 1 L\nH2SO4 0.5 M\n```\n');
    expect($c('.iw-cautions').text()).toMatch(/strong acid/);
    expect($c('.iw-cautions').text()).toMatch(/safety data sheet/);
  });
});

describe('a batch with lines in error (an invented desmut bath whose acids are written by volume)', () => {
  const src = '```batch\nname: Desmut D-4\nvolume: 2 L\nHNO3 120 gal @ 68%\n(NH4)HF2 30 g\nH2SO4 80 gal\nFe2(SO4)3 33 g\n```\n';
  const $ = dom(src);
  const fig = $('figure.iw-batch');
  const rows = fig.find('table.iw-table').first().find('tbody tr');

  it('shows every line in the order written: the two counted with figures, the two not counted with the reason', () => {
    expect(fig.find('figcaption').text()).toContain('incomplete: 2 lines not counted');
    expect(rows.length).toBe(4);
    expect(rows.map((_, r) => $(r).hasClass('iw-skipped')).get()).toEqual([true, false, true, false]);
    expect(rows.eq(0).find('td').first().text()).toMatch(/^HNO3 120 gal @ 68%/);
    expect(rows.eq(0).find('td.iw-reason').text()).toMatch(/^not counted: Unknown unit 'gal'/);
    expect(rows.eq(1).find('td').first().text()).toBe('(NH4)HF2');
    // 30 g of 63 g weighed.
    expect(parseFloat(rows.eq(1).find('td').last().text())).toBeCloseTo((30 / 63) * 100, 1);
  });

  it("puts each line's marker in its own row and keeps the acid caution", () => {
    expect(rows.eq(0).find('a.iw-flag.iw-error').length).toBe(1);
    expect(rows.eq(2).find('a.iw-flag.iw-error').length).toBe(1);
    expect(fig.find('ul.iw-findings').length).toBe(0);
    expect(fig.find('.iw-cautions').text()).toContain('HNO₃ (line not counted), H₂SO₄ (line not counted): strong acid');
  });

  it('names the two shares: of the weighed mass always, of the total where one is given', () => {
    const $t = dom('```batch\ntotal: 250 g\nNaCl 2 wt%\nKCl 0.5 wt%\n```\n');
    const heads = $t('figure.iw-batch table.iw-table')
      .first()
      .find('thead th')
      .map((_, e) => $t(e).text())
      .get();
    expect(heads.slice(-2)).toEqual(['Share of weighed mass', 'Share of total']);
    const cells = $t('figure.iw-batch table.iw-table')
      .first()
      .find('tbody tr')
      .first()
      .find('td')
      .map((_, e) => $t(e).text())
      .get();
    expect(cells.slice(-2)).toEqual(['80.0 %', '2.0 %']);
  });

  it("marks a solubility warning on the amount's row", () => {
    const $s = dom('```batch\nvolume: 100 mL\nNaCl 500 g\n```\n');
    expect($s('figure.iw-batch tbody tr').first().find('a.iw-flag.iw-warning').attr('title')).toMatch(/^warning: NaCl: the dissolved mass \(500 g\)/);
    expect($s('section.iw-problems .iw-code').text()).toBe('batch-solubility');
  });
});

describe('a reaction block', () => {
  const $ = dom(NOTE);
  const lines = $('figure.iw-reactions .iw-reaction');
  it('typesets each equation and marks it', () => {
    expect(lines.length).toBe(2);
    expect(lines.eq(0).find('.iw-equation').text()).toBe('Zn + 2 HCl → ZnCl2 + H2');
    expect(lines.eq(0).find('.iw-mark').hasClass('iw-balanced')).toBe(true);
  });
  it('gives the balanced form of an unbalanced one: 3 Cu + 8 HNO3 → 3 Cu(NO3)2 + 2 NO + 4 H2O (common practice, dilute nitric acid)', () => {
    expect(lines.eq(1).find('.iw-mark').hasClass('iw-unbalanced')).toBe(true);
    expect(lines.eq(1).find('.iw-balanced-form').text()).toBe('Balanced: 3 Cu + 8 HNO3 → 3 Cu(NO3)2 + 2 NO + 4 H2O');
  });
});

describe('problems are never dropped', () => {
  it('every finding the editor reports on the note has one marker and one entry in the list at the end', () => {
    const $ = dom(NOTE);
    const editor = documentDiagnostics(analyseDocument(NOTE, 'markdown')).filter((d) => d.severity !== 4);
    const flags = $('a.iw-flag');
    const listed = $('section.iw-problems li');
    expect(flags.length).toBe(editor.length);
    expect(listed.length).toBe(editor.length);
    expect(
      listed
        .map((_, e) => $(e).find('.iw-code').text())
        .get()
        .sort(),
    ).toEqual(editor.map((d) => d.code).sort());
    // Each marker links to its entry and back.
    flags.each((_, f) => {
      const target = $(`#${$(f).attr('href')!.slice(1)}`);
      expect(target.is('li')).toBe(true);
      expect(target.find('a').attr('href')).toBe(`#${$(f).attr('id')}`);
    });
  });
  it('a clean note gets no list', () => {
    expect(render('Weighed `NaCl` and `KCl`.\n')).not.toContain('iw-problems');
  });
});

describe('everything else is left as markdown-it renders it', () => {
  it('other fences, text and code are untouched', () => {
    const plain = new MarkdownIt();
    const src = '# Title\n\nSome *words* and a [link](https://example.org).\n\n```js\nconst x = `NaCl`;\n```\n\n    indented `code`\n';
    expect(render(src)).toBe(plain.render(src));
  });
  it('escapes what it writes: no markup gets through from a code span, a batch or an equation', () => {
    const src = '`<img src=x onerror=alert(1)>` and `Na<b>Cl` and `A<script> -> B`\n\n```batch\nname: <script>alert(1)</script>\nNaCl 1 g\n```\n';
    const $ = dom(src);
    expect($('img, script, b').length).toBe(0);
    expect($('figcaption strong').text()).toBe('<script>alert(1)</script>');
  });
  it("keeps the host's source-line attributes on a computed block (scroll sync in the preview)", () => {
    const md = new MarkdownIt().use(ionwrightPreview);
    md.core.ruler.push('lines', (state) => {
      for (const t of state.tokens) if (t.map && t.type === 'fence') t.attrSet('data-line', String(t.map[0]));
      return true;
    });
    const $ = load(md.render('text\n\n```batch\nNaCl 1 g\n```\n'));
    expect($('figure.iw-batch').attr('data-line')).toBe('2');
  });
});

describe('robustness (fast-check)', () => {
  const pieces = [
    '`',
    '```batch\n',
    '```reaction\n',
    '```\n',
    'NaCl ',
    'H2O',
    ' 1 g\n',
    'volume: 1 L\n',
    '-> ',
    '+ ',
    'Fe3+ ',
    '<',
    '&',
    '\n',
    '\n\n',
    '# ',
    '(',
    '[',
    'Xx',
    '·',
    '^2-',
    ' M\n',
  ];
  it('never throws, and markers and list entries always agree', () => {
    fc.assert(
      fc.property(fc.array(fc.constantFrom(...pieces), { maxLength: 60 }), (parts) => {
        const html = render(parts.join(''));
        const $ = load(html);
        const n = $('a.iw-flag').length;
        expect($('section.iw-problems li').length).toBe(n);
      }),
      { numRuns: 300 },
    );
  });
});
