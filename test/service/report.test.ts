/**
 * The HTML report (service/report.ts) on the demo notes, read back with cheerio: self-contained, tables
 * with the same numbers as the cards and batch tables, a chart point per salt, every finding listed.
 * Reference values: IUPAC/CIAAW 2021 abridged atomic weights (Na 22.990, Cl 35.45).
 */
import { load } from 'cheerio';
import MarkdownIt from 'markdown-it';
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { analyseFormula } from '../../server/src/chem/analyse';
import { analyseDocument } from '../../server/src/service/document';
import { documentDiagnostics } from '../../server/src/service/diagnostics';
import { latticePoints, reportHtml } from '../../server/src/service/report';

const CSS = readFileSync(join(__dirname, '../../media/preview.css'), 'utf8');
const NOTE_PATH = join(__dirname, '../../examples/rinse-trials.md');
const NOTE = readFileSync(NOTE_PATH, 'utf8');
const doc = analyseDocument(NOTE, 'markdown');
const html = reportHtml(doc, { title: 'rinse-trials.md', css: CSS, markdownIt: () => new MarkdownIt() });
const $ = load(html);

describe('the HTML report', () => {
  it('is self-contained: no scripts, no links to fetch, no external styles, fonts or images', () => {
    expect($('script, link, img, iframe, object, embed').length).toBe(0);
    expect(html).not.toMatch(/\bsrc\s*=/i);
    expect(html).not.toMatch(/url\(|@import|@font-face/i);
    // The only links are anchors within the page.
    $('a[href]').each((_, a) => expect($(a).attr('href')).toMatch(/^#/));
  });

  it('lists each distinct readable formula once, with its molar mass', () => {
    const rows = $('#formulas + table tbody tr');
    const names = rows.map((_, r) => $(r).find('td').first().find('.iw-formula').text()).get();
    expect(new Set(names).size).toBe(names.length);
    expect(names).toEqual(expect.arrayContaining(['NaCl', 'CuSO4·5H2O', 'KH2PO4', 'SO42−']));
    const nacl = rows.filter((_, r) => $(r).find('.iw-formula').first().text() === 'NaCl');
    expect(Number(nacl.find('td').eq(1).text())).toBeCloseTo(22.99 + 35.45, 2);
    // The flagged Al(OH)2 is in the table, marked not balanced.
    const aloh = rows.filter((_, r) => $(r).find('.iw-formula').first().text() === 'Al(OH)2');
    expect(aloh.find('td').last().text()).toMatch(/^not balanced/);
  });

  it('charts one point per salt with a lattice energy, labelled with its formula', () => {
    const points = latticePoints([...new Map(doc.formulas.map((f) => [f.analysis.ascii, f.analysis])).values()].filter((a) => a.ok));
    expect(points.length).toBeGreaterThanOrEqual(3);
    const svg = $('figure.iw-chart svg.iw-lattice').first();
    expect(svg.length).toBe(1);
    const text = svg.text();
    for (const p of points.filter((p) => p.inverseR0 !== null)) expect(text).toContain(p.label);
    // The value charted for NaCl is the card's best value.
    const nacl = points.find((p) => p.label === 'NaCl')!;
    expect(nacl.kJPerMol).toBe(analyseFormula('NaCl').lattice!.kJPerMol);
    expect(nacl.inverseR0).toBeCloseTo(1 / (1.02 + 1.81), 3); // Shannon 1976: Na⁺ 1.02 Å, Cl⁻ 1.81 Å (CN 6)
  });

  it('has the batches as computed tables and the reactions with their balance', () => {
    expect($('#batches ~ figure.iw-batch').length).toBe(doc.batches.length);
    expect($('figure.iw-batch figcaption').first().text()).toContain('Rinse buffer R-7');
    expect($('#reactions + figure.iw-reactions .iw-reaction').length).toBe(doc.reactions.length);
    expect($('figure.iw-reactions .iw-mark.iw-unbalanced').length).toBeGreaterThan(0);
  });

  it('shows a batch with lines in error as incomplete, with every line, and keeps the caution of an acid not counted', () => {
    const text = '# Desmut line\n\n```batch\nname: Desmut D-4\nvolume: 2 L\nHNO3 120 gal @ 68%\n(NH4)HF2 30 g\nFe2(SO4)3 33 g\n```\n';
    const page = load(reportHtml(analyseDocument(text, 'markdown'), { title: 'desmut.md', css: CSS, markdownIt: () => new MarkdownIt() }));
    const fig = page('#batches ~ figure.iw-batch').first();
    expect(fig.find('figcaption').text()).toContain('incomplete: 1 line not counted');
    expect(fig.find('tr.iw-skipped td.iw-reason').text()).toMatch(/^not counted: Unknown unit 'gal'/);
    expect(page('#cautions + .iw-cautions').text()).toContain('strong acid');
    const formulas = page('#formulas + table tbody tr .iw-formula')
      .map((_, e) => page(e).text())
      .get();
    expect(formulas).toContain('HNO3');
  });

  it('lists every finding of `check` with its line and column', () => {
    const diags = documentDiagnostics(doc);
    const rows = $('table.iw-findings-table tbody tr');
    expect(rows.length).toBe(diags.length);
    expect(rows.first().find('td').first().text()).toBe(`${diags[0].range.start.line + 1}:${diags[0].range.start.character + 1}`);
  });

  it('says that estimates are estimates and carries the cautions with the SDS note', () => {
    expect($('.iw-caveat').text()).toMatch(/estimates, not measurements/);
    expect($('#cautions + .iw-cautions').text()).toMatch(/safety data sheet/);
  });

  it('includes the notes as the preview renders them, with the list of problems', () => {
    expect($('details.iw-rendered h1').text()).toContain('Tarnlow');
    expect($('details.iw-rendered section.iw-problems li').length).toBe(documentDiagnostics(doc).filter((d) => d.severity !== 4).length);
  });

  it('is the same page for the same notes (nothing but the generator line varies)', () => {
    expect(reportHtml(doc, { title: 'rinse-trials.md', css: CSS, markdownIt: () => new MarkdownIt() })).toBe(html);
  });

  it('an empty file and a file of plain text give a page that says there is nothing, not a crash', () => {
    for (const text of ['', 'Only words here.\n']) {
      const page = load(reportHtml(analyseDocument(text, 'markdown'), { title: 'x.md', css: CSS, markdownIt: () => new MarkdownIt() }));
      expect(page('#formulas + p').text()).toBe('No formulas in these notes.');
      expect(page('figure.iw-chart svg').length).toBe(1);
    }
  });

  it('a .fnote file gets the tables but no rendered Markdown', () => {
    const fnote = analyseDocument(readFileSync(join(__dirname, '../../examples/plating-bath.fnote'), 'utf8'), 'fnote');
    const page = load(reportHtml(fnote, { title: 'plating-bath.fnote', css: CSS, markdownIt: () => new MarkdownIt() }));
    expect(page('#batches ~ figure.iw-batch').length).toBe(fnote.batches.length);
    expect(page('details.iw-rendered').length).toBe(0);
  });
});
