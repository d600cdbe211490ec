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
import { subscriptDigits } from '../chem/formula/compute';
import { TYPICAL_ERROR } from '../chem/lattice/lattice';
import { oxidationText } from './card';
import { latticeChart, type LatticePoint } from './chart';
import { documentDiagnostics } from './diagnostics';
import type { AnalysedDocument } from './document';
import { batchHtml, formulaSpan, ionwrightPreview, reactionBlockHtml, silentState, type PreviewOptions } from './preview';
import { shortMethod } from './tables';
import { escapeHtml } from './typeset';

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

const SEVERITY = { 1: 'error', 2: 'warning', 3: 'information', 4: 'hint' } as const;

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
figure.iw-chart { margin: 0.5em 0; color: var(--iw-fg); }
figure.iw-chart svg { max-width: 100%; height: auto; }
figure.iw-chart figcaption { color: var(--iw-muted); font-size: 0.9em; }
table.iw-findings-table td:first-child { white-space: nowrap; font-variant-numeric: tabular-nums; }
.iw-rendered { border: 1px solid var(--iw-border); border-radius: 3px; padding: 0 1em; }
footer { margin-top: 2.5em; color: var(--iw-muted); font-size: 0.88em; }
code { font-family: ui-monospace, "SFMono-Regular", Menlo, Consolas, monospace; font-size: 0.92em; }
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
      label: subscriptDigits(L.salt),
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

function formulaRows(list: readonly FormulaAnalysis[], o: PreviewOptions): string {
  const s = o.settings;
  return list.map((a) => {
    const L = a.lattice;
    const lattice = L ? `${L.estimate ? '≈ ' : ''}${Math.round(L.kJPerMol)} <span class="iw-by">${escapeHtml(shortMethod(L.method))}${L.estimate ? ', estimate' : ''}</span>` : '—';
    const balance = a.charges ? (a.charges.balanced ? 'balanced' : `<span class="iw-formula iw-warning">not balanced</span>: ${escapeHtml(a.charges.message)}`) : '—';
    const cautions = cautionsFor(a);
    return `<tr><td>${formulaSpan(a, s, '')}${cautions.length ? ` <span title="${escapeHtml(cautions.map((c) => c.text).join('; '))}">⚠</span>` : ''}</td>` +
      `<td class="iw-n">${(a.molarMass as { value: number }).value.toFixed(s.decimals)}</td>` +
      `<td>${a.bond ? escapeHtml(a.bond.type) : '—'}</td>` +
      `<td>${a.bond ? `${a.bond.deltaEN.toFixed(2)} (${escapeHtml(a.bond.pair.join('–'))})` : '—'}</td>` +
      `<td class="iw-n">${a.bond ? `${a.bond.percentIonic.toFixed(0)} %` : '—'}</td>` +
      `<td>${lattice}</td>` +
      `<td>${a.charges?.oxidationStates ? escapeHtml(oxidationText(a.charges.oxidationStates)) : '—'}</td>` +
      `<td>${balance}</td></tr>`;
  }).join('\n');
}

/** The whole page. */
export function reportHtml(doc: AnalysedDocument, options: ReportOptions): string {
  const o: PreviewOptions = { typesetFormulas: true, settings: doc.settings };
  const formulas = distinctFormulas(doc);
  const diagnostics = documentDiagnostics(doc);
  const points = latticePoints(formulas);
  const lineOf = (offset: number) => doc.lines.positionAt(offset).line + 1;
  const lineText = (offset: number) => {
    const p = doc.lines.positionAt(offset);
    return doc.text.slice(doc.lines.offsetAt({ line: p.line, character: 0 }), doc.lines.offsetAt({ line: p.line + 1, character: 0 })).trim();
  };
  const count = (sev: number) => diagnostics.filter((d) => d.severity === sev).length;
  const plural = (n: number, word: string) => `<strong>${n}</strong> ${n === 1 ? word : /(ch|sh|s|x)$/.test(word) ? `${word}es` : `${word}s`}`;
  const cautions = [...new Set(formulas.flatMap((a) => cautionsFor(a).map((c) => c.text)))];

  const parts: string[] = [];
  parts.push(`<header><h1>${escapeHtml(options.title)}</h1><p class="iw-sub">Ionwright report${options.generator ? ` · ${escapeHtml(options.generator)}` : ''}</p>`);
  parts.push(`<ul class="iw-counts"><li>${plural(formulas.length, 'formula')}</li><li>${plural(doc.batches.length, 'batch')}</li><li>${plural(doc.reactions.length, 'reaction')}</li>` +
    `<li>${plural(count(1), 'error')}</li><li>${plural(count(2), 'warning')}</li><li>${plural(points.length, 'salt')} charted</li></ul></header>`);
  parts.push('<p class="iw-caveat" role="note">Lattice energies marked ≈ are model estimates, not measurements; molar masses use the CIAAW 2021 standard atomic weights. ' +
    'Batch figures assume full dissociation of strong electrolytes; weak acids and bases stay undissociated, and activities and non-ideal mixing are not modelled.</p>');

  parts.push('<h2 id="formulas">Formulas</h2>');
  if (formulas.length) {
    parts.push('<table class="iw-table"><thead><tr><th>Formula</th><th>Molar mass (g/mol)</th><th>Bond type</th><th>ΔEN (pair)</th><th>Ionic character</th><th>Lattice energy (kJ/mol)</th><th>Oxidation states</th><th>Charge balance</th></tr></thead><tbody>');
    parts.push(formulaRows(formulas, o), '</tbody></table>');
  } else parts.push('<p>No formulas in these notes.</p>');

  parts.push('<h2 id="lattice">Lattice energies</h2>');
  parts.push(`<figure class="iw-chart">${latticeChart(points, { title: 'Lattice energy against 1/(r₊ + r₋)' })}` +
    `<figcaption>Lattice energy against 1/(r₊ + r₋) with six-coordinate Shannon radii (thermochemical radii for polyatomic ions); Coulomb's law makes it grow with z₊z₋/r₀. ` +
    `Typical errors: Kapustinskii ${escapeHtml(TYPICAL_ERROR['Kapustinskii equation'] ?? '')}; Born–Mayer ${escapeHtml(TYPICAL_ERROR['Born–Mayer equation'] ?? '')}.</figcaption></figure>`);
  if (points.some((p) => p.inverseR0 === null)) {
    parts.push(`<figure class="iw-chart">${latticeChart(points, { x: 'charge-product', title: 'Lattice energy against the charge product' })}<figcaption>Against |z₊z₋|, for the salts whose radii are not all known.</figcaption></figure>`);
  }

  parts.push('<h2 id="batches">Batches</h2>');
  if (doc.batches.length) {
    for (const b of doc.batches) {
      parts.push(`<figure class="iw-batch">${batchHtml(b.analysis, o, silentState(), (d) => lineOf(d.start), (d) => lineText(d.start))}<p class="iw-by">Block at line ${lineOf(b.ref.start)}.</p></figure>`);
    }
  } else parts.push('<p>No batch blocks in these notes.</p>');

  parts.push('<h2 id="reactions">Reactions</h2>');
  if (doc.reactions.length) parts.push(`<figure class="iw-reactions">${doc.reactions.map((r) => reactionBlockHtml(r.analysis, silentState(), lineOf(r.ref.start))).join('\n')}</figure>`);
  else parts.push('<p>No reactions in these notes.</p>');

  parts.push('<h2 id="findings">Findings</h2>');
  if (diagnostics.length) {
    parts.push('<table class="iw-table iw-findings-table"><thead><tr><th>Line:col</th><th>Severity</th><th>Code</th><th>Message</th></tr></thead><tbody>' +
      diagnostics.map((d) => `<tr class="iw-${SEVERITY[d.severity]}"><td>${d.range.start.line + 1}:${d.range.start.character + 1}</td><td>${SEVERITY[d.severity]}</td><td><code>${escapeHtml(d.code)}</code></td><td>${escapeHtml(d.message)}</td></tr>`).join('') +
      '</tbody></table>');
  } else parts.push('<p>No findings.</p>');

  if (cautions.length) {
    parts.push('<h2 id="cautions">Cautions</h2>', `<div class="iw-cautions" role="note"><ul>${cautions.map((c) => `<li>${escapeHtml(c)}</li>`).join('')}</ul><p>${escapeHtml(CAUTION_FOOTNOTE)}</p></div>`);
  }

  if (doc.language === 'markdown') {
    const md = options.markdownIt().use(ionwrightPreview, o);
    parts.push('<h2 id="notes">The notes</h2>', `<details class="iw-rendered"><summary>As the preview shows them</summary>${md.render(doc.text)}</details>`);
  }

  parts.push('<footer>Molar masses: IUPAC/CIAAW 2021 abridged standard atomic weights. Electronegativities: Pauling scale. Radii: Shannon (1976), six-coordinate unless a structure says otherwise; thermochemical radii of polyatomic ions after Jenkins and co-workers. ' +
    `Bond types by ΔEN thresholds ${o.settings.chem.nonpolarBelow} and ${o.settings.chem.ionicAbove} (common practice). ${escapeHtml(CAUTION_FOOTNOTE)}</footer>`);

  return `<!doctype html>
<html lang="en"><head><meta charset="utf-8"><meta name="viewport" content="width=device-width, initial-scale=1">
<title>${escapeHtml(options.title)} — Ionwright report</title>
<style>${options.css}</style><style>${PAGE_CSS}</style></head>
<body>
${parts.join('\n')}
</body></html>
`;
}
