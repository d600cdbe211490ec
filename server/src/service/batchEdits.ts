/**
 * Edits of a batch the user asks for: another form of an ingredient weighed by mass (the hydrate for the
 * anhydrous salt and back, another assay), and the whole batch scaled to a new size. Each returns edits
 * only; nothing changes the file unless the user picks it. A form edit touches only the formula, the
 * amount and (for an assay) the assay characters of its line; scaling touches only amounts and the
 * size line.
 */
import { analyseFormula } from '../chem/analyse';
import { anhydrousOf, type BatchAnalysis, type Ingredient } from '../chem/batch';
import { COMMON_HYDRATES, hydrateWord } from '../chem/data/hydrates';
import { roundMass, scaleBatch, substituteForm, type ScaleLine } from '../chem/reagents';
import type { CodeAction, TextEdit } from './actions';
import type { AnalysedDocument, BatchOccurrence } from './document';
import { formulaText } from './format';

const MASS_UNITS: Record<string, number> = { kg: 1000, g: 1, mg: 1e-3, µg: 1e-6 };

/** Common grades a jar is labelled with (common practice: reagent, technical and purified grades). */
const ASSAYS = [100, 99.5, 99, 98, 97, 95, 90];

/** The water of crystallisation written in a formula (`·6H2O`, `.6H2O`, `*6H2O`), and where it starts. */
function waterSuffix(text: string): { at: number; n: number } | undefined {
  const m = /[·.*•](\d*(?:\.\d+)?)\s*H2O$/.exec(text);
  if (!m) return undefined;
  return { at: m.index, n: m[1] === '' ? 1 : Number(m[1]) };
}

/** The formula as the user writes it, with `n` waters (0: anhydrous), in the dot the user used. */
function withWater(text: string, n: number): string {
  const w = waterSuffix(text);
  const base = w ? text.slice(0, w.at) : text;
  const dot = w ? text[w.at] : '·';
  return n === 0 ? base : `${base}${dot}${n === 1 ? '' : n}H2O`;
}

const inRange = (a: { start: number; end: number }, s: number, e: number) => a.start <= e && a.end >= s;

/** The assay written after the amount (`@ 98%`): its value and offsets, where the line has one. */
function assayOn(doc: AnalysedDocument, i: Ingredient): { percent: number; start: number; end: number } | undefined {
  const rest = doc.text.slice(i.amount.end, i.lineEnd);
  const m = /@\s*((?:\d+(?:\.\d*)?|\.\d+))\s*%/.exec(rest);
  if (!m) return undefined;
  return { percent: Number(m[1]), start: i.amount.end + m.index, end: i.amount.end + m.index + m[0].length };
}

/** The "another form" actions for the mass lines of batches within [start, end]. */
export function formActions(doc: AnalysedDocument, start: number, end: number): CodeAction[] {
  const out: CodeAction[] = [];
  for (const b of doc.batches) {
    if (!inRange(b.ref, start, end)) continue;
    for (const i of b.analysis.ingredients) {
      if (!inRange({ start: i.lineStart, end: i.lineEnd }, start, end)) continue;
      const f = MASS_UNITS[i.amount.unit];
      if (f === undefined || !(i.amount.value > 0)) continue;
      const massG = i.amount.value * f;
      const assay = assayOn(doc, i);
      const anhydrous = anhydrousOf(i.analysis);
      if (anhydrous) {
        const hasWater = anhydrous.water;
        const forms = [0, ...(COMMON_HYDRATES[anhydrous.hill] ?? [])].filter((n) => n !== hasWater);
        for (const n of forms) {
          const text = withWater(i.formulaText, n);
          const to = analyseFormula(text, doc.settings.chem);
          const a = assay?.percent;
          const r = substituteForm(i.analysis, to, massG, { fromAssayPercent: a, toAssayPercent: a });
          if (!('massG' in r)) continue;
          const rounded = roundMass(r.massG);
          const what = n === 0 ? 'the anhydrous salt' : `the ${hydrateWord(n)}`;
          out.push({
            title: `I have ${what}: weigh ${rounded.text} ${formulaText(text)}`,
            kind: 'quickfix',
            edits: [
              { range: doc.lines.range(i.formulaStart, i.formulaEnd), newText: text },
              { range: doc.lines.range(i.amount.start, i.amount.end), newText: rounded.text },
            ],
          });
        }
      }
      if (assay) {
        for (const pct of ASSAYS) {
          if (pct === assay.percent) continue;
          const r = substituteForm(i.analysis, i.analysis, massG, { fromAssayPercent: assay.percent, toAssayPercent: pct });
          if (!('massG' in r)) continue;
          const rounded = roundMass(r.massG);
          out.push({
            title: `The jar is ${pct} %: weigh ${rounded.text} ${formulaText(i.formulaText)}`,
            kind: 'quickfix',
            edits: [
              { range: doc.lines.range(i.amount.start, i.amount.end), newText: rounded.text },
              { range: doc.lines.range(assay.start, assay.end), newText: `@ ${pct}%` },
            ],
          });
        }
      }
    }
  }
  return out;
}

// ── scaling ───────────────────────────────────────────────────────────────

/** A size line of the batch: `volume: 500 mL`, `total: 2 kg`, `water to 1 L`, with the value's offsets. */
interface SizeLine {
  kind: 'volume' | 'total';
  /** The size as written, in L or g. */
  base: number;
  /** The whole line, and where its value and unit are. */
  lineStart: number;
  lineEnd: number;
  start: number;
  end: number;
}

const SIZE_UNITS: Record<string, number> = { ml: 1e-3, l: 1, µl: 1e-6, ul: 1e-6, kg: 1000, g: 1, mg: 1e-3 };

const SIZE_LINE = /^(\s*)(?:(volume|total)\s*:\s*|(water\s+to)\s+)((?:\d+(?:\.\d*)?|\.\d+)(?:[eE][+-]?\d+)?\s*(?:mL|ml|L|l|µL|uL|kg|g|mg))\s*(?:#.*)?$/i;

function sizeLines(b: BatchOccurrence): SizeLine[] {
  const out: SizeLine[] = [];
  for (const l of b.ref.lines) {
    const m = SIZE_LINE.exec(l.text);
    if (!m) continue;
    const at = l.text.indexOf(m[4], m[1].length);
    const [, num, unit] = /^(\S+?)\s*([a-zA-Zµ]+)$/.exec(m[4]) as RegExpExecArray;
    const kind = /^[mµu]?[lL]$/.test(unit) ? 'volume' : 'total';
    if (m[2] && m[2].toLowerCase() === 'volume' && kind !== 'volume') continue;
    if (m[2] && m[2].toLowerCase() === 'total' && kind !== 'total') continue;
    out.push({
      kind,
      base: Number(num) * SIZE_UNITS[unit.toLowerCase()],
      lineStart: l.start,
      lineEnd: l.end,
      start: l.start + at,
      end: l.start + at + m[4].length,
    });
  }
  return out;
}

/** A size for a size line: the volume in mL or L, the mass in g or kg. */
function sizeText(kind: 'volume' | 'total', base: number): string {
  const n = (x: number) => String(Number(x.toPrecision(6)));
  if (kind === 'volume') return base >= 1 ? `${n(base)} L` : `${n(base * 1000)} mL`;
  return base >= 1000 ? `${n(base / 1000)} kg` : `${n(base)} g`;
}

export type ScaleTarget = { factor: number } | { volumeL: number } | { totalMassG: number };

export type ScaleOutcome = { edits: TextEdit[]; title: string } | { reason: string };

/** Read what the user typed as a target: `×3`, `x0.5`, `3`, `2 L`, `500 mL`, `5 kg`, `250 g`. */
export function parseScaleTarget(text: string): ScaleTarget | { reason: string } {
  const t = text.trim().replace(/,/g, '.');
  let m = /^(?:[×x*]\s*)?((?:\d+(?:\.\d*)?|\.\d+)(?:[eE][+-]?\d+)?)\s*(?:[×x])?$/.exec(t);
  if (m) {
    const factor = Number(m[1]);
    return factor > 0 ? { factor } : { reason: 'the factor must be above zero' };
  }
  m = /^((?:\d+(?:\.\d*)?|\.\d+)(?:[eE][+-]?\d+)?)\s*(µL|uL|mL|ml|L|l|mg|g|kg)$/.exec(t);
  if (!m) return { reason: `'${text.trim()}' is no size: write a factor (×2, 0.5) or a final volume or total mass (2 L, 500 mL, 5 kg)` };
  const v = Number(m[1]);
  if (!(v > 0)) return { reason: 'the new size must be above zero' };
  const unit = m[2];
  const vol: Record<string, number> = { µL: 1e-6, uL: 1e-6, mL: 1e-3, ml: 1e-3, L: 1, l: 1 };
  if (unit in vol) return { volumeL: v * vol[unit] };
  return { totalMassG: v * (MASS_UNITS[unit] ?? 1) };
}

/** The edits that scale batch `b` to `target`, or why it cannot be scaled. */
export function scaleEdits(doc: AnalysedDocument, b: BatchOccurrence, target: ScaleTarget): ScaleOutcome {
  const a: BatchAnalysis = b.analysis;
  const sizes = sizeLines(b);
  // A size line (`water to 1 L`) is rewritten below, whether or not the reading counted it.
  const unread = a.skipped.filter((s) => s.kind === 'ingredient' && !sizes.some((z) => z.lineStart <= s.lineStart && s.lineEnd <= z.lineEnd));
  if (unread.length)
    return {
      reason: `${unread.length === 1 ? 'a line' : `${unread.length} lines`} of this batch could not be read (${unread[0].text}); fix ${unread.length === 1 ? 'it' : 'them'} first, so that nothing is left at the old size`,
    };
  const from = { volumeL: a.volumeL ?? undefined, totalMassG: a.totalMassG ?? undefined };
  let to: { volumeL?: number; totalMassG?: number };
  if ('factor' in target) to = { volumeL: from.volumeL && from.volumeL * target.factor, totalMassG: from.totalMassG && from.totalMassG * target.factor };
  else to = target;
  if ('factor' in target && !from.volumeL && !from.totalMassG) {
    // A batch of amounts only: the factor alone scales it.
    from.totalMassG = 1;
    to = { totalMassG: target.factor };
  }
  const lines: ScaleLine[] = a.ingredients.map((i, k) => {
    const l: ScaleLine = { key: k, value: i.amount.value, unit: i.amount.unit };
    if (i.massG !== null) l.computedMassG = i.massG;
    return l;
  });
  const scaled = scaleBatch(lines, from, to);
  if (!('lines' in scaled))
    return {
      reason:
        'volumeL' in target
          ? 'this batch has no final volume (volume: …) to scale from; scale it by a factor or to a total mass'
          : 'totalMassG' in target
            ? 'this batch has no total mass (total: …) to scale from; scale it by a factor or to a final volume'
            : (scaled.findings[0]?.message ?? 'this batch cannot be scaled'),
    };
  const edits: TextEdit[] = [];
  scaled.lines.forEach((s, k) => {
    if (s.how !== 'scaled') return;
    const i = a.ingredients[k];
    const text = s.rounded ? s.rounded.text : `${s.value} ${s.unit}`;
    if (text !== i.amount.text) edits.push({ range: doc.lines.range(i.amount.start, i.amount.end), newText: text });
  });
  for (const sl of sizes) edits.push({ range: doc.lines.range(sl.start, sl.end), newText: sizeText(sl.kind, sl.base * scaled.factor) });
  edits.sort((x, y) => x.range.start.line - y.range.start.line || x.range.start.character - y.range.start.character);
  const size = to.volumeL && from.volumeL ? sizeText('volume', to.volumeL) : to.totalMassG && a.totalMassG ? sizeText('total', to.totalMassG) : undefined;
  const name = a.name ? `'${a.name}'` : 'the batch';
  const title = size ? `Scale ${name} to ${size} (×${Number(scaled.factor.toPrecision(4))})` : `Scale ${name} ×${Number(scaled.factor.toPrecision(4))}`;
  return { edits, title };
}

/** The batch whose block holds `offset`. */
export function batchAt(doc: AnalysedDocument, offset: number): BatchOccurrence | undefined {
  return doc.batches.find((b) => b.ref.start <= offset && offset <= b.ref.end);
}

/** The "Scale batch…" actions on a batch block: the usual factors, and the usual volumes where it has one. */
export function scaleActions(doc: AnalysedDocument, start: number): CodeAction[] {
  const b = batchAt(doc, start);
  if (!b || b.analysis.ingredients.length === 0) return [];
  const targets: ScaleTarget[] = [{ factor: 2 }, { factor: 5 }, { factor: 10 }, { factor: 0.5 }];
  const v = b.analysis.volumeL;
  if (v) for (const L of [1, 10, 100]) if (Math.abs(L - v) > 1e-9 && ![2, 5, 10, 0.5].some((f) => Math.abs(f * v - L) < 1e-9)) targets.push({ volumeL: L });
  const out: CodeAction[] = [];
  for (const t of targets) {
    const r = scaleEdits(doc, b, t);
    if ('edits' in r && r.edits.length) out.push({ title: r.title, kind: 'refactor.rewrite', edits: r.edits });
  }
  return out;
}
