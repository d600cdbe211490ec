/**
 * A markdown-it plugin that shows the chemistry in rendered Markdown: VS Code's preview (through the
 * extension's `extendMarkdownIt`), the HTML report of the command line, and tests.
 *
 * - Inline code that reads as a formula is typeset (<sub>, <sup>, hydrate dots) with the molar mass in a
 *   tooltip; an equation in inline code is typeset with a balanced / not balanced mark.
 * - A fenced `batch` block becomes its computed tables; a fenced `reaction` block its typeset equations,
 *   each marked balanced or not, with the balanced form.
 * - Every problem the editor would flag there gets a visible numbered marker, and the list of problems is
 *   rendered at the end of the page, so nothing is dropped silently.
 *
 * The plugin never imports markdown-it at run time: the host hands it its instance. Fenced blocks are
 * analysed through the same document analysis the editor uses (the block on its own), inline code through
 * the same formula and equation analysis, so the findings are the editor's.
 */
import type { MarkdownIt, Token } from 'markdown-it';
import { analyseFormula, type FormulaAnalysis } from '../chem/analyse';
import type { BatchAnalysis, Ingredient } from '../chem/batch';
import { CAUTION_FOOTNOTE } from '../chem/cautions';
import type { ChemDiagnostic } from '../chem/diagnostic';
import { analyseReaction, findArrow, type ReactionAnalysis } from '../chem/equation';
import type { FormulaRef } from '../notes/types';
import { scanProse } from '../notes/prose';
import {
  batchColumns,
  batchRows,
  HAZARD_COLUMNS,
  HEAT_STEP_COLUMNS,
  htmlTable,
  ION_COLUMNS,
  SATURATION_COLUMNS,
  SPECIES_COLUMNS,
  type BatchRow,
} from './columns';
import { hasSafety, heatAdvice, heatSummary, NO_HEAT, SAFETY_NOTICE } from './safety';
import { ADDITIONS_NOTE } from '../chem/upkeep';
import { additionLines, titreLine } from './upkeep';
import { analyseDocument, type BlockResult } from './document';
import { plural, sig, volumeText } from './format';
import { Html, html, join, toHtml, trusted, type HtmlValue } from './html';
import { DEFAULT_SETTINGS, type ServiceSettings } from './settings';
import { notCountedText, solutionNotes, solutionSummary, tabledSpecies, undissociatedOf } from './tables';
import { formulaSpan, formulaTitle, typesetDisplay, typesetEquation } from './typeset';
import { CachesBySettings, detach } from '../chem/cache';

export { formulaSpan, formulaTitle };

export interface PreviewOptions {
  /** Typeset formulas and equations in inline code; when false they stay code (problems are still marked). */
  typesetFormulas: boolean;
  settings: ServiceSettings;
  /** A last, empty "Weighed" column in batch tables, for a printed weighing sheet (the report). */
  weighedColumn?: boolean;
}

export const DEFAULT_PREVIEW_OPTIONS: PreviewOptions = Object.freeze({ typesetFormulas: true, settings: DEFAULT_SETTINGS });

/** A problem found while rendering, numbered in order of appearance. */
export interface PreviewProblem {
  n: number;
  severity: ChemDiagnostic['severity'];
  code: ChemDiagnostic['code'];
  message: string;
  /** What it is about, as written (a formula, an equation or a batch line). */
  subject: string;
  /** 1-based source line, where known. */
  line?: number;
}

export interface RenderState {
  problems: PreviewProblem[];
  /** Render without markers (a page that lists its findings in its own way). */
  silent?: boolean;
  /** The options of this render, read once when the note is parsed. */
  options?: PreviewOptions;
}

export const silentState = (): RenderState => ({ problems: [], silent: true });

const ENV_KEY = '__ionwright';
const SEVERITY_WORD = { error: 'error', warning: 'warning', information: 'note', hint: 'hint' } as const;
const SEVERITY_RANK = { error: 0, warning: 1, information: 2, hint: 3 } as const;

function stateOf(env: Record<string, unknown> | undefined): RenderState {
  if (!env) return { problems: [] };
  let s = env[ENV_KEY] as RenderState | undefined;
  if (!s) env[ENV_KEY] = s = { problems: [] };
  return s;
}

/** Record problems and return their markers (one marker per problem, linked to the list at the end). */
const NO_MARKS = new Html('');

function mark(state: RenderState, diagnostics: readonly ChemDiagnostic[], subject: string, lineOf?: (d: ChemDiagnostic) => number | undefined): Html {
  if (state.silent || diagnostics.length === 0) return NO_MARKS;
  const out: Html[] = [];
  for (const d of diagnostics) {
    if (d.severity === 'hint') continue;
    const n = state.problems.length + 1;
    const line = lineOf?.(d);
    state.problems.push({ n, severity: d.severity, code: d.code, message: d.message, subject, ...(line !== undefined ? { line } : {}) });
    const word = SEVERITY_WORD[d.severity];
    out.push(
      html`<a class="iw-flag iw-${d.severity}" href="#iw-problem-${n}" id="iw-flag-${n}" title="${`${word}: ${d.message}`}" aria-label="${`Ionwright ${word} ${n}: ${d.message}`}">${d.severity === 'error' ? '✖' : d.severity === 'warning' ? '⚠' : 'ℹ'}<sup>${n}</sup></a>`,
    );
  }
  return out.length ? join(out) : NO_MARKS;
}

function worst(diagnostics: readonly ChemDiagnostic[]): ChemDiagnostic['severity'] | undefined {
  let w: ChemDiagnostic['severity'] | undefined;
  for (const d of diagnostics) if (d.severity !== 'hint' && (w === undefined || SEVERITY_RANK[d.severity] < SEVERITY_RANK[w])) w = d.severity;
  return w;
}

export function reactionMark(r: ReactionAnalysis): Html {
  const st = r.balance.status;
  if (!r.ok) return html``;
  if (st === 'already-balanced') return html`<span class="iw-mark iw-balanced" title="Atoms and charge balance as written">✓ balanced</span>`;
  return html`<span class="iw-mark iw-unbalanced" title="${r.balance.message}">✗ not balanced</span>`;
}

/** The typeset balanced form of an equation that was balanced, or undefined. */
function balancedForm(r: ReactionAnalysis): Html | undefined {
  return r.balance.status === 'balanced' && r.balance.coefficients ? typesetEquation(r.parsed, r.balance.coefficients) : undefined;
}

function inlineReaction(r: ReactionAnalysis, o: PreviewOptions, state: RenderState, fallback: string): string {
  const flags = mark(state, r.diagnostics, r.text);
  if (!o.typesetFormulas || !r.ok) return html`<span class="iw-code-flagged">${trusted(fallback)}</span>${flags}`.value;
  const form = balancedForm(r);
  const balanced = form ? html` <span class="iw-balanced-form">(balanced: ${form})</span>` : '';
  return html`<span class="iw-equation" title="${r.balance.message}">${typesetEquation(r.parsed)}</span> ${reactionMark(r)}${balanced}${flags}`.value;
}

function inlineFormula(a: FormulaAnalysis, o: PreviewOptions, state: RenderState, fallback: string): string {
  const flags = mark(state, a.diagnostics, a.input);
  const w = worst(a.diagnostics);
  if (!o.typesetFormulas || !a.ok || !a.molarMass) return w ? html`<span class="iw-code-flagged iw-${w}">${trusted(fallback)}</span>${flags}`.value : fallback;
  const cls = w ? ` iw-${w}` : '';
  return formulaSpan(a, o.settings, cls).value + flags.value;
}

/**
 * Rendered prose that needed no marker, memoised per settings content and typeset flag (the preview
 * re-renders the whole note on every change). The host's tokens are slices of the whole note, and so is
 * HTML built from them: keys and values are kept as flat copies, so that the cache never holds a note.
 */
const proseCaches = [new CachesBySettings<string | null>(25_000, 16 * 1024 * 1024), new CachesBySettings<string | null>(25_000, 16 * 1024 * 1024)];

function proseHtml(text: string, o: PreviewOptions, state: RenderState): string | undefined {
  const cache = proseCaches[o.typesetFormulas ? 1 : 0].for(o.settings);
  const hit = cache.get(text);
  if (hit !== undefined) return hit ?? undefined;
  const before = state.problems.length;
  const rendered = proseHtmlUncached(text, o, state);
  if (state.problems.length === before && !state.silent) {
    const value = rendered === undefined ? null : detach(rendered);
    cache.set(detach(text), value, value === null ? 0 : 2 * value.length);
  }
  return rendered;
}

/** Forget the memoised prose (benchmarks of a cold render). */
export function clearPreviewCache() {
  for (const c of proseCaches) c.clear();
  fenceCaches.clear();
}

/**
 * Bare formulas in prose, read by the editor's own prose rule (setting `prose`): typeset, and their problems
 * marked (information findings are not shown for prose, as in the editor).
 */
function proseHtmlUncached(text: string, o: PreviewOptions, state: RenderState): string | undefined {
  const found: FormulaRef[] = [];
  scanProse(text, 0, text.length, o.settings.prose, found);
  if (found.length === 0) return undefined;
  const out: Html[] = [];
  let at = 0;
  for (const f of found) {
    const a = analyseFormula(f.text, o.settings.chem);
    const shown = a.diagnostics.filter((d) => d.severity !== 'information');
    const flags = mark(state, shown, f.text);
    const w = worst(shown);
    const body =
      o.typesetFormulas && a.ok && a.molarMass
        ? formulaSpan(a, o.settings, ` iw-prose${w ? ` iw-${w}` : ''}`)
        : w
          ? html`<span class="iw-code-flagged iw-${w}">${f.text}</span>`
          : f.text;
    out.push(html`${text.slice(at, f.start)}${body}${flags}`);
    at = f.end;
  }
  return html`${out}${text.slice(at)}`.value;
}

// ── fenced blocks ─────────────────────────────────────────────────────────

/** Fenced blocks analysed in earlier renders, by settings content (bounded; see document.ts). */
const fenceCaches = new CachesBySettings<{ kind: string; rel: BlockResult }>(4096, 16 * 1024 * 1024);

/** Analyse a fenced block on its own, through the editor's document analysis. */
function analyseFence(info: 'batch' | 'reaction', content: string, settings: ServiceSettings) {
  const head = '```' + info + '\n';
  const body = content.endsWith('\n') ? content : content + '\n';
  const text = head + body + '```\n';
  const doc = analyseDocument(text, 'markdown', settings, fenceCaches.for(settings));
  /** 0-based line of a finding within the fence's content. */
  const contentLine = (offset: number) => doc.lines.positionAt(offset).line - 1;
  return { doc, contentLine };
}

/**
 * A batch's safety reading as HTML: the dangerous pairs as a table, the heat of making up with its ΔT (an
 * estimate, its method; on the report its steps too), the advice where it is over the setting, the notice.
 */
export function safetyHtml(b: BatchAnalysis, steps: boolean): Html | null {
  if (!hasSafety(b)) return null;
  const parts: HtmlValue[] = [html`<strong>Safety</strong> <span class="iw-by">an aid, not a safety assessment</span>`];
  if (b.hazards.length) parts.push(htmlTable(HAZARD_COLUMNS, b.hazards, { cls: 'iw-hazards' }));
  else parts.push(html`<p>No dangerous pair of ingredients in Ionwright's tables.</p>`);
  const h = b.heat;
  if (h) {
    parts.push(html`<p class="iw-summary${h.exceeds ? ' iw-heat-over' : ''}">${h.exceeds ? '⚠ ' : ''}${heatSummary(h)}.</p>`);
    const advice = heatAdvice(h);
    if (advice.length) parts.push(html`<ul class="iw-advice">${advice.map((a) => html`<li>${a}</li>`)}</ul>`);
    if (steps) parts.push(htmlTable(HEAT_STEP_COLUMNS, h.steps, { cls: 'iw-heat-steps' }));
    parts.push(html`<p class="iw-note">${h.method}.</p>`);
    if (steps) for (const n of h.notes) parts.push(html`<p class="iw-note">${n}</p>`);
  } else parts.push(html`<p class="iw-note">${NO_HEAT}</p>`);
  parts.push(html`<p>${SAFETY_NOTICE}</p>`);
  return html`<div class="iw-safety" role="note">${parts}</div>`;
}

/** A batch without findings renders the same every time: memoised per analysis and settings object. */
const batches = new WeakMap<BatchAnalysis, { settings: ServiceSettings; weighed: boolean; html: Html }>();

export function batchHtml(
  b: BatchAnalysis,
  o: PreviewOptions,
  state: RenderState,
  lineOf: (d: ChemDiagnostic) => number | undefined,
  subjectOf: (d: ChemDiagnostic) => string,
): Html {
  if (b.diagnostics.length) return batchHtmlUncached(b, o, state, lineOf, subjectOf);
  const hit = batches.get(b);
  if (hit && hit.settings === o.settings && hit.weighed === !!o.weighedColumn) return hit.html;
  const out = batchHtmlUncached(b, o, state, lineOf, subjectOf);
  batches.set(b, { settings: o.settings, weighed: !!o.weighedColumn, html: out });
  return out;
}

function batchHtmlUncached(
  b: BatchAnalysis,
  o: PreviewOptions,
  state: RenderState,
  lineOf: (d: ChemDiagnostic) => number | undefined,
  subjectOf: (d: ChemDiagnostic) => string,
): Html {
  const s = o.settings;
  const inRow = new Set<ChemDiagnostic>();
  const flagsOf = (start: number, end: number): Html | '' => {
    const own = b.diagnostics.filter((d) => d.severity !== 'hint' && !inRow.has(d) && d.start >= start && d.start <= end);
    for (const d of own) inRow.add(d);
    return own.length ? mark(state, own, subjectOf(own[0]), lineOf) : '';
  };
  // Every line in the order written: counted ingredients with their figures, the others with why they are not counted.
  const cols = batchColumns(b, s, (i: Ingredient) => flagsOf(i.lineStart, i.lineEnd));
  if (o.weighedColumn)
    cols.push({
      key: 'weighed',
      head: 'Weighed',
      align: 'left',
      cls: 'iw-weighed',
      text: () => '',
      html: () => html`<span class="iw-tick" aria-hidden="true"></span>`,
    });
  const table = htmlTable(cols, batchRows(b), {
    rowClass: (r: BatchRow) => (r.skipped ? 'iw-skipped' : undefined),
    wide: (r: BatchRow) =>
      r.skipped
        ? {
            first: html`<code>${r.skipped.text}</code>${flagsOf(r.skipped.lineStart, r.skipped.lineEnd)}`,
            rest: html`<strong>not counted</strong>: ${r.skipped.reason}`,
            restClass: 'iw-reason',
          }
        : undefined,
  });
  const head = [
    html`<strong class="iw-batch-name">${b.name ?? 'Batch'}</strong>`,
    b.volumeL !== null ? `final volume ${volumeText(b.volumeL)}` : 'no final volume given',
    b.totalMassG !== null ? `total ${sig(b.totalMassG)} g` : null,
  ].filter((x): x is Html | string => x !== null);
  const incomplete = b.skipped.length ? html` · <strong class="iw-incomplete">incomplete: ${notCountedText(b)}</strong>` : '';
  const parts: Html[] = [html`<figcaption>${join(head, ' · ')}${incomplete} <span class="iw-by">computed by Ionwright</span></figcaption>`, table];
  if (b.ions.length) parts.push(htmlTable(ION_COLUMNS, b.ions, { cls: 'iw-ions' }));
  if (b.ionicStrengthM !== null) {
    parts.push(
      html`<p class="iw-summary">Ionic strength <var>I</var> = ½ Σ <var>c</var><sub><var>i</var></sub><var>z</var><sub><var>i</var></sub><sup>2</sup> = <strong>${sig(b.ionicStrengthM)} M</strong>; net charge ${sig(b.netChargeEqPerL ?? 0, 2)} eq/L.</p>`,
    );
  }
  const sol = b.solution;
  if (sol && sol.converged) {
    const { listed, rest } = tabledSpecies(sol);
    parts.push(html`<p class="iw-summary iw-solution"><strong>Solution at equilibrium</strong>: ${solutionSummary(b, sol)}</p>`);
    parts.push(htmlTable(SPECIES_COLUMNS, listed, { cls: 'iw-species' }));
    if (rest) parts.push(html`<p class="iw-note">${rest} more species below 1 µM.</p>`);
    if (sol.saturation.length)
      parts.push(htmlTable(SATURATION_COLUMNS, sol.saturation, { cls: 'iw-saturation', rowClass: (x) => (x.saturationIndex > 0 ? 'iw-over' : undefined) }));
    for (const n of solutionNotes(b, sol)) parts.push(html`<p class="iw-note">${n}</p>`);
  } else if (sol) parts.push(html`<p class="iw-note">The equilibrium did not converge: no pH is given.</p>`);
  if (b.upkeep) {
    const items = [...b.upkeep.titres.map((t) => html`<li>Titre: ${titreLine(t)}</li>`), ...additionLines(b.upkeep).map((a) => html`<li>${a}</li>`)];
    parts.push(
      html`<div class="iw-upkeep" role="note"><strong>Upkeep</strong> <span class="iw-by">an estimate</span><ul>${items}</ul>${b.upkeep.additions ? html`<p class="iw-note">${ADDITIONS_NOTE}</p>` : ''}</div>`,
    );
  }
  const undissociated = undissociatedOf(b).map((i) => typesetDisplay(i.formula));
  if (undissociated.length) parts.push(html`<p class="iw-note">Not split into ions: ${join(undissociated, ', ')}.</p>`);
  for (const n of b.notes) parts.push(html`<p class="iw-note">${n}</p>`);
  const safety = safetyHtml(b, !!o.weighedColumn);
  if (safety) parts.push(safety);
  if (b.cautions.length) {
    parts.push(
      html`<div class="iw-cautions" role="note"><strong>Cautions</strong><ul>${b.cautions.map((c) => html`<li>${c.text}</li>`)}</ul><p>${CAUTION_FOOTNOTE}</p></div>`,
    );
  }
  if (b.diagnostics.length) {
    const items = b.diagnostics
      .filter((d) => d.severity !== 'hint' && !inRow.has(d))
      .map((d) => {
        const line = lineOf(d);
        return html`<li class="iw-${d.severity}">${mark(state, [d], subjectOf(d), lineOf)} ${line !== undefined ? `line ${line}: ` : ''}${d.message}</li>`;
      });
    if (items.length) parts.push(html`<ul class="iw-findings">${items}</ul>`);
  }
  return join(parts, '\n');
}

export function reactionBlockHtml(r: ReactionAnalysis, state: RenderState, line: number | undefined): Html {
  const flags = mark(state, r.diagnostics, r.text, () => line);
  if (!r.ok) return html`<div class="iw-reaction iw-unreadable"><code>${r.text}</code>${flags}</div>`;
  const form = balancedForm(r);
  const balanced = form
    ? html`<div class="iw-balanced-form">Balanced: ${form}</div>`
    : r.balance.status !== 'already-balanced'
      ? html`<div class="iw-balanced-form">${r.balance.message}</div>`
      : '';
  return html`<div class="iw-reaction"><span class="iw-equation">${typesetEquation(r.parsed)}</span> ${reactionMark(r)}${flags}${balanced}</div>`;
}

// ── the plugin ────────────────────────────────────────────────────────────

type OptionsSource = Partial<PreviewOptions> | (() => Partial<PreviewOptions>) | undefined;

/**
 * Install the plugin: `md.use(ionwrightPreview, options)`. `options` may be a function, read at every render
 * (the editor's settings can change while the preview is open).
 */
export function ionwrightPreview(md: MarkdownIt, options?: OptionsSource): void {
  const read = (): PreviewOptions => {
    const o = typeof options === 'function' ? options() : options;
    return { ...DEFAULT_PREVIEW_OPTIONS, ...(o ?? {}) };
  };
  const current = (env: Record<string, unknown> | undefined): PreviewOptions => {
    const s = env?.[ENV_KEY] as RenderState | undefined;
    return s ? (s.options ??= read()) : read();
  };
  const rules = md.renderer.rules;
  const baseCode = rules.code_inline ?? ((tokens: Token[], idx: number) => html`<code>${tokens[idx].content}</code>`.value);
  const baseFence = rules.fence ?? ((tokens: Token[], idx: number) => html`<pre><code>${tokens[idx].content}</code></pre>\n`.value);

  // A fresh list of problems per parse, and a place at the end of the page to list them.
  md.core.ruler.push('ionwright_problems', (state) => {
    state.env[ENV_KEY] = { problems: [], options: read() } satisfies RenderState;
    state.tokens.push(new state.Token('ionwright_problems', '', 0));
    return true;
  });

  rules.code_inline = (tokens, idx, opts, env, self) => {
    const fallback = baseCode(tokens, idx, opts, env, self);
    const content = tokens[idx].content.trim();
    if (!content) return fallback;
    const o = current(env);
    const state = stateOf(env);
    try {
      if (findArrow(content)) return inlineReaction(analyseReaction(content), o, state, fallback);
      return inlineFormula(analyseFormula(content, o.settings.chem), o, state, fallback);
    } catch {
      return fallback;
    }
  };

  const baseText = rules.text ?? ((tokens: Token[], idx: number) => toHtml(tokens[idx].content));
  rules.text = (tokens, idx, opts, env, self) => {
    const o = current(env);
    if (o.settings.prose === 'off') return baseText(tokens, idx, opts, env, self);
    try {
      return proseHtml(tokens[idx].content, o, stateOf(env)) ?? baseText(tokens, idx, opts, env, self);
    } catch {
      return baseText(tokens, idx, opts, env, self);
    }
  };

  rules.fence = (tokens, idx, opts, env, self) => {
    const t = tokens[idx];
    const info = t.info.trim().split(/\s+/)[0]?.toLowerCase();
    if (info !== 'batch' && info !== 'reaction') return baseFence(tokens, idx, opts, env, self);
    const o = current(env);
    const state = stateOf(env);
    try {
      const { doc, contentLine } = analyseFence(info, t.content, o.settings);
      // 1-based line in the rendered source: the fence opens on map[0], its content starts on the next line.
      const sourceLine = (offset: number) => (t.map ? t.map[0] + 1 + contentLine(offset) + 1 : undefined);
      const contentLines = t.content.split('\n');
      const lineText = (offset: number) => contentLines[contentLine(offset)]?.trim() ?? '';
      // The host's own attributes (source lines for scroll sync), rendered by the host.
      const attrs = trusted(self.renderAttrs(t));
      const source = html`<details class="iw-source"><summary>As written</summary><pre><code>${t.content}</code></pre></details>`;
      if (info === 'batch') {
        const bodies = doc.batches.map((b) =>
          batchHtml(
            b.analysis,
            o,
            state,
            (d) => sourceLine(d.start),
            (d) => lineText(d.start),
          ),
        );
        const unclosed = doc.diagnostics.filter((d) => d.code === 'batch-unclosed');
        const incomplete = doc.batches.some((b) => b.analysis.skipped.length > 0);
        return html`<figure class="iw-batch${incomplete ? ' iw-batch-incomplete' : ''}"${attrs}>\n${bodies.length ? join(bodies, '\n') : html`<p>An empty batch block.</p>`}${unclosed.length ? mark(state, unclosed, 'batch') : ''}\n${source}</figure>\n`
          .value;
      }
      const lines = doc.reactions.map((r) => reactionBlockHtml(r.analysis, state, sourceLine(r.ref.start)));
      return html`<figure class="iw-reactions"${attrs}>\n${lines.length ? join(lines, '\n') : html`<p>No equations in this block.</p>`}\n${source}</figure>\n`
        .value;
    } catch {
      return baseFence(tokens, idx, opts, env, self);
    }
  };

  rules.ionwright_problems = (_tokens, _idx, _opts, env) => {
    const problems = stateOf(env).problems;
    if (problems.length === 0) return '';
    const items = problems.map(
      (p) =>
        html`<li id="iw-problem-${p.n}" class="iw-${p.severity}"><a href="#iw-flag-${p.n}" title="Back to the text">${p.n}</a> <span class="iw-sev">${SEVERITY_WORD[p.severity]}</span> <code>${p.subject}</code>${p.line !== undefined ? ` (line ${p.line})` : ''}: ${p.message} <span class="iw-code">${p.code}</span></li>`,
    );
    const n = problems.length;
    return html`<section class="iw-problems" aria-label="Ionwright findings"><p><strong>Ionwright: ${plural(n, 'finding')} in these notes</strong></p><ol>${items}</ol></section>\n`
      .value;
  };
}
