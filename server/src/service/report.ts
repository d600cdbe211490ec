/**
 * The HTML report of one notes file (`ionwright report <path> --html out.html`): one self-contained page,
 * with no scripts, fonts, images or links to fetch. It holds the formulas and the batches as tables, the
 * reactions with their balance, a chart of the estimated lattice energies of the salts the notes mention,
 * the findings, and for Markdown notes the notes themselves as the preview renders them.
 *
 * Pure: the caller hands in the analysed document, the markdown-it instance and the style sheet.
 */
import type { MarkdownIt } from 'markdown-it';
import type { FormulaAnalysis } from '../chem/analyse';
import { CAUTION_FOOTNOTE, cautionsFor } from '../chem/cautions';
import { TYPICAL_ERROR } from '../chem/lattice/lattice';
import { latticeChart, type LatticePoint } from './chart';
import { FINDING_COLUMNS, formulaColumns, htmlTable, SEVERITY_WORD } from './columns';
import { documentDiagnostics } from './diagnostics';
import type { AnalysedDocument } from './document';
import { formulaText } from './format';
import { Html, html, join, trusted } from './html';
import { batchHtml, ionwrightPreview, reactionBlockHtml, silentState, type PreviewOptions } from './preview';
import { speciesDistribution } from '../chem/solution/distribution';
import type { BatchOccurrence } from './document';
import { saturationChart, speciesChart } from './speciesChart';

export interface ReportOptions {
  /** Shown as the page title, usually the file's path. */
  title: string;
  /** The preview styles (media/preview.css), inlined. */
  css: string;
  /** A markdown-it instance (the plugin is added to a copy of its rules here); rendering of Markdown notes. */
  markdownIt: () => MarkdownIt;
  /** E.g. "Ionwright 0.1.0, 2026-12-02"; left out when absent, so that tests can compare pages. */
  generator?: string;
}

/** The page's own layout; colours come from the same variables as the preview. */
const PAGE_CSS = `
:root { color-scheme: light dark; }
body { margin: 0 auto; max-width: 1040px; padding: 24px 28px 48px; font: 15px/1.5 system-ui, -apple-system, "Segoe UI", Roboto, "Noto Sans", sans-serif;
  color: var(--iw-fg); background: var(--iw-page, #ffffff); }
@media (prefers-color-scheme: dark) { body { --iw-page: #17191c; } }
h1 { font-size: 1.6em; margin: 0 0 0.2em; }
h2 { font-size: 1.2em; margin: 1.8em 0 0.5em; padding-bottom: 0.2em; border-bottom: 1px solid var(--iw-border); }
.iw-sub { color: var(--iw-muted); margin: 0 0 1em; }
.iw-counts { display: flex; flex-wrap: wrap; gap: 0.6em; margin: 0.8em 0; padding: 0; list-style: none; }
.iw-counts li { border: 1px solid var(--iw-border); border-radius: 3px; padding: 0.25em 0.7em; background: var(--iw-surface); }
.iw-counts strong { font-size: 1.15em; }
.iw-caveat { border-left: 4px solid var(--iw-warning); padding: 0.4em 0.8em; background: var(--iw-surface); margin: 1em 0; }
figure.iw-chart, figure.iw-eqfigure { margin: 0.5em 0; color: var(--iw-fg); }
figure.iw-chart svg, figure.iw-eqfigure svg { max-width: 100%; height: auto; }
figure.iw-chart figcaption, figure.iw-eqfigure figcaption { color: var(--iw-muted); font-size: 0.9em; }
table.iw-findings-table td:first-child { white-space: nowrap; font-variant-numeric: tabular-nums; }
.iw-rendered { border: 1px solid var(--iw-border); border-radius: 3px; padding: 0 1em; }
footer { margin-top: 2.5em; color: var(--iw-muted); font-size: 0.88em; }
code { font-family: ui-monospace, "SFMono-Regular", Menlo, Consolas, monospace; font-size: 0.92em; }
.iw-toc { margin: 0.4em 0 0; font-size: 0.92em; }
.iw-toc a { color: var(--iw-info); }
section.iw-bench h2:first-child { margin-top: 1.2em; }
.iw-bench-note { font-size: 0.92em; }
/* Printed, the batches are the weighing sheet: they start the first page, each whole on a page; the rest follows on new pages. */
@media print {
  body { max-width: none; padding: 0; color: #000; background: #fff; font-size: 11pt; }
  .iw-counts, .iw-toc, .iw-rendered, #notes { display: none; }
  .iw-caveat { border-left: 2px solid #000; background: none; }
  h2 { break-after: avoid; }
  #findings { break-before: page; }
  figure.iw-chart, figure.iw-eqfigure { break-inside: avoid; }
  footer { color: #000; }
}
`;

/** Distinct readable formulas, in order of appearance. */
function distinctFormulas(doc: AnalysedDocument): FormulaAnalysis[] {
  const seen = new Set<string>();
  const out: FormulaAnalysis[] = [];
  const add = (a: FormulaAnalysis) => {
    if (!a.ok || !a.molarMass || seen.has(a.ascii)) return;
    seen.add(a.ascii);
    out.push(a);
  };
  for (const f of doc.formulas) add(f.analysis);
  for (const b of doc.batches) {
    for (const i of b.analysis.ingredients) add(i.analysis);
    // A batch line that is not counted still names its substance: its card and cautions belong in the report.
    for (const l of b.analysis.skipped) if (l.analysis) add(l.analysis);
  }
  return out;
}

/** The salts with a lattice energy, one point each (the anhydrous salt of a hydrate once). */
export function latticePoints(formulas: readonly FormulaAnalysis[]): LatticePoint[] {
  const seen = new Set<string>();
  const points: LatticePoint[] = [];
  for (const a of formulas) {
    const L = a.lattice;
    if (!L || seen.has(L.salt)) continue;
    seen.add(L.salt);
    points.push({
      label: formulaText(L.salt),
      kJPerMol: L.kJPerMol,
      method: L.method,
      estimate: L.estimate,
      inverseR0: L.radiusSum ? 1 / L.radiusSum : null,
      chargeProduct: L.chargeProduct,
      ...(L.meltingPointC !== undefined ? { meltingPointC: L.meltingPointC } : {}),
    });
  }
  return points;
}

/** A batch's species distribution over pH and its saturation indices, where it has an equilibrium. */
function equilibriumCharts(b: BatchOccurrence, k: number): Html[] {
  const s = b.analysis.solution;
  if (!s || !s.converged) return [];
  const name = b.analysis.name ?? `batch ${k + 1}`;
  const d = speciesDistribution(s.equilibrium);
  const out: Html[] = [];
  // The svgs are built by speciesChart.ts, which escapes its own text.
  out.push(
    html`<figure class="iw-eqfigure">${trusted(speciesChart(d, { id: `iw-species-${k}`, title: `${name}: species over pH` }))}<figcaption>Share of each component's total in each species between pH 0 and 14, the batch's totals and activity coefficients held (an estimate of the model; the dashed line is the batch's own pH).</figcaption></figure>`,
  );
  if (s.saturation.length)
    out.push(
      html`<figure class="iw-eqfigure">${trusted(saturationChart(s.saturation, { id: `iw-saturation-${k}`, title: `${name}: saturation indices` }))}<figcaption>log10(IAP/Ksp) of each solid the batch's components can form, as made up; above zero it would come out at equilibrium.</figcaption></figure>`,
    );
  return out;
}

/** The whole page: what goes to the bench first (batches and their cautions), then the findings, the reactions, the formulas with bonding and lattice energy, the chart, and the notes. */
export function reportHtml(doc: AnalysedDocument, options: ReportOptions): string {
  const o: PreviewOptions = { typesetFormulas: true, settings: doc.settings, weighedColumn: true };
  const formulas = distinctFormulas(doc);
  const diagnostics = documentDiagnostics(doc);
  const points = latticePoints(formulas);
  const lineOf = (offset: number) => doc.lines.positionAt(offset).line + 1;
  const lineText = (offset: number) => {
    const p = doc.lines.positionAt(offset);
    return doc.text.slice(doc.lines.offsetAt({ line: p.line, character: 0 }), doc.lines.offsetAt({ line: p.line + 1, character: 0 })).trim();
  };
  const count = (sev: number) => diagnostics.filter((d) => d.severity === sev).length;
  const plural = (n: number, word: string) => html`<strong>${n}</strong> ${n === 1 ? word : /(ch|sh|s|x)$/.test(word) ? `${word}es` : `${word}s`}`;
  // One line per caution, naming every substance it applies to (as the batches do).
  const byText = new Map<string, string[]>();
  for (const a of formulas) for (const c of cautionsFor(a)) (byText.get(c.text) ?? byText.set(c.text, []).get(c.text)!).push(a.display);
  const cautions = [...byText].map(([text, who]) => `${who.join(', ')}: ${text}`);
  const incomplete = doc.batches.filter((b) => b.analysis.skipped.length > 0).length;

  const parts: Html[] = [];
  parts.push(
    html`<header><h1>${options.title}</h1><p class="iw-sub">Ionwright report${options.generator ? ` · ${options.generator}` : ''}</p><ul class="iw-counts"><li>${plural(doc.batches.length, 'batch')}${incomplete ? html` <span class="iw-incomplete">(${incomplete} incomplete)</span>` : ''}</li><li>${plural(count(1), 'error')}</li><li>${plural(count(2), 'warning')}</li><li>${plural(doc.reactions.length, 'reaction')}</li><li>${plural(formulas.length, 'formula')}</li><li>${plural(points.length, 'salt')} charted</li></ul><nav class="iw-toc" aria-label="Sections"><a href="#batches">Batches</a> · <a href="#findings">Findings</a> · <a href="#reactions">Reactions</a> · <a href="#formulas">Formulas</a> · <a href="#lattice">Lattice energies</a>${doc.language === 'markdown' ? html` · <a href="#notes">Notes</a>` : ''}</nav></header>`,
  );

  // What goes to the bench: each batch's weighing and pouring, an incomplete one marked.
  parts.push(html`<section class="iw-bench" aria-labelledby="batches"><h2 id="batches">Batches: what to weigh and pour</h2>`);
  if (doc.batches.length) {
    parts.push(
      html`<p class="iw-caveat iw-bench-note" role="note">Masses and concentrations are arithmetic on the notes; the nominal ions assume full dissociation of strong electrolytes. The pH, species and saturation indices are estimates of an equilibrium model (Davies activities, closed to air, no redox): measure the pH of the made-up batch. Check each mass against the notes before weighing.</p>`,
    );
    for (const b of doc.batches) {
      const cls = b.analysis.skipped.length ? 'iw-batch iw-batch-incomplete' : 'iw-batch';
      parts.push(
        html`<figure class="${cls}">${batchHtml(
          b.analysis,
          o,
          silentState(),
          (d) => lineOf(d.start),
          (d) => lineText(d.start),
        )}<p class="iw-by">Block at line ${lineOf(b.ref.start)}.</p></figure>`,
      );
      parts.push(...equilibriumCharts(b, doc.batches.indexOf(b)));
    }
  } else parts.push(html`<p>No batch blocks in these notes.</p>`);
  if (cautions.length) {
    parts.push(
      html`<h2 id="cautions">Cautions</h2>`,
      html`<div class="iw-cautions" role="note"><ul>${cautions.map((c) => html`<li>${c}</li>`)}</ul><p>${CAUTION_FOOTNOTE}</p></div>`,
    );
  }
  parts.push(html`</section>`);

  parts.push(html`<h2 id="findings">Findings</h2>`);
  if (diagnostics.length) {
    parts.push(htmlTable(FINDING_COLUMNS, diagnostics, { cls: 'iw-findings-table', rowClass: (d) => `iw-${SEVERITY_WORD[d.severity]}` }));
  } else parts.push(html`<p>No findings.</p>`);

  parts.push(html`<h2 id="reactions">Reactions</h2>`);
  if (doc.reactions.length)
    parts.push(
      html`<figure class="iw-reactions">${join(
        doc.reactions.map((r) => reactionBlockHtml(r.analysis, silentState(), lineOf(r.ref.start))),
        '\n',
      )}</figure>`,
    );
  else parts.push(html`<p>No reactions in these notes.</p>`);

  parts.push(html`<h2 id="formulas">Formulas</h2>`);
  if (formulas.length) parts.push(htmlTable(formulaColumns(o.settings), formulas));
  else parts.push(html`<p>No formulas in these notes.</p>`);
  parts.push(
    html`<p class="iw-caveat" role="note">Lattice energies marked ≈ are model estimates, not measurements; molar masses use the CIAAW 2021 standard atomic weights.</p>`,
  );

  parts.push(html`<h2 id="lattice">Lattice energies</h2>`);
  // The chart's SVG is built by chart.ts, which escapes its own text.
  parts.push(
    html`<figure class="iw-chart">${trusted(latticeChart(points, { title: 'Lattice energy against 1/(r₊ + r₋)' }))}<figcaption>Lattice energy against 1/(r₊ + r₋) with six-coordinate Shannon radii (thermochemical radii for polyatomic ions); Coulomb's law makes it grow with z₊z₋/r₀. Typical errors: Kapustinskii ${TYPICAL_ERROR['Kapustinskii equation'] ?? ''}; Born–Mayer ${TYPICAL_ERROR['Born–Mayer equation'] ?? ''}.</figcaption></figure>`,
  );
  if (points.some((p) => p.inverseR0 === null)) {
    parts.push(
      html`<figure class="iw-chart">${trusted(latticeChart(points, { x: 'charge-product', title: 'Lattice energy against the charge product' }))}<figcaption>Against |z₊z₋|, for the salts whose radii are not all known.</figcaption></figure>`,
    );
  }

  if (doc.language === 'markdown') {
    const md = options.markdownIt().use(ionwrightPreview, { ...o, weighedColumn: false });
    // markdown-it renders the notes with its own escaping and the plugin's (html.ts); raw HTML in the notes is as markdown-it's options allow.
    parts.push(
      html`<h2 id="notes">The notes</h2>`,
      html`<details class="iw-rendered"><summary>As the preview shows them</summary>${trusted(md.render(doc.text))}</details>`,
    );
  }

  parts.push(
    html`<footer>Molar masses: IUPAC/CIAAW 2021 abridged standard atomic weights. Electronegativities: Pauling scale. Radii: Shannon (1976), six-coordinate unless a structure says otherwise; thermochemical radii of polyatomic ions after Jenkins and co-workers. Bond types by ΔEN thresholds ${o.settings.chem.nonpolarBelow} and ${o.settings.chem.ionicAbove} (common practice). ${CAUTION_FOOTNOTE}</footer>`,
  );

  return html`<!doctype html>
<html lang="en"><head><meta charset="utf-8"><meta name="viewport" content="width=device-width, initial-scale=1">
<title>${options.title} — Ionwright report</title>
<style>${trusted(options.css)}</style><style>${trusted(PAGE_CSS)}</style></head>
<body>
${join(parts, '\n')}
</body></html>
`.value;
}
