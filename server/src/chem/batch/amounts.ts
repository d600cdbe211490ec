/**
 * Stage 2 of a batch: the amounts of each line read — moles, mass to weigh (assay included),
 * concentration in the final volume — and each counted line's two shares (of the weighed mass, of the
 * `total:`). A `to pH` line and a buffer line are counted as pending: their amounts come from the
 * solution stage (batch/solution.ts), and the shares are computed after it (`computeShares`).
 *
 * One rule for lines in error: a line with any error (its formula, amount, unit, assay, or a target the
 * batch cannot resolve) is not counted. It is listed in `skipped` with the reason, its findings stay on
 * its exact characters, and the cautions of its formula, where the formula is readable, still apply.
 */
import { cautionsFor } from '../cautions';
import type { ChemDiagnostic, DiagnosticCode } from '../diagnostic';
import type { BatchHeaders, BufferLine, IngredientLine, ReadBatch, SetAsideHeader } from './read';
import { finding, hasError, type Token } from './tokens';
import type { Ingredient, SkippedLine } from './types';
import type { BatchUnit } from './units';

/** A counted ingredient line with its amounts. */
export interface CountedLine {
  line: IngredientLine;
  /** The amount as written, with the offsets of its number and unit. */
  amount: Ingredient['amount'];
  molarMass: number;
  moles: number;
  /** Mass to weigh, g. */
  massG: number;
  concentrationM: number | null;
  massFraction: number | null;
  fractionOfTotal: number | null;
  /** A `to pH` line: moles and mass are solved by the solution stage. */
  pending?: boolean;
  /** A buffer's form (filled in by the solution stage). */
  buffer?: Ingredient['buffer'];
  /** A `to pH` line once solved. */
  solvedFor?: Ingredient['solvedFor'];
}

export interface BatchAmounts {
  counted: CountedLine[];
  /** Buffer lines to design (the solution stage turns each into two counted lines). */
  buffers: BufferLine[];
  /** Every line not counted (ingredients and headers), in the order written. */
  skipped: SkippedLine[];
  /** Grams weighed of the counted lines. */
  weighedG: number;
  /** The findings of the ingredient lines, in their order (including those of a target that cannot be met). */
  diagnostics: ChemDiagnostic[];
}

/** Compute the amounts of every line read (stage 2). */
export function computeAmounts(read: ReadBatch): BatchAmounts {
  const out: BatchAmounts = { counted: [], buffers: [], skipped: [], weighedG: 0, diagnostics: [] };
  for (const line of read.lines) {
    if (line.kind === 'header') {
      out.skipped.push(skippedHeader(line));
      continue;
    }
    if (line.kind === 'buffer') {
      countBuffer(line, read.headers, out);
      continue;
    }
    const r = countLine(line, read.headers);
    out.diagnostics.push(...r.diagnostics);
    if (r.counted) out.counted.push(r.counted);
    else out.skipped.push(r.skipped);
  }
  return out;
}

/** The weighed mass and each counted line's two shares, once every amount is known. */
export function computeShares(out: BatchAmounts, { totalMassG }: BatchHeaders): void {
  out.weighedG = out.counted.reduce((s, c) => s + c.massG, 0);
  for (const c of out.counted) {
    c.massFraction = out.weighedG > 0 ? c.massG / out.weighedG : null;
    c.fractionOfTotal = totalMassG !== null ? c.massG / totalMassG : null;
  }
}

/** A buffer line: pending where it can be designed, else not counted with its findings. */
function countBuffer(line: BufferLine, headers: BatchHeaders, out: BatchAmounts): void {
  let diagnostics = line.diagnostics;
  if (!hasError(diagnostics) && headers.volumeL === null)
    diagnostics = [
      ...diagnostics,
      finding('batch-no-volume', line.lineStart, line.lineEnd, `A buffer is made to a concentration in the batch's final volume: add a line 'volume: 500 mL'.`),
    ];
  out.diagnostics.push(...diagnostics);
  if (hasError(diagnostics)) out.skipped.push(skippedLine(line, reasonOf(diagnostics)));
  else out.buffers.push(line);
}

/** A line of the block not counted, from its source (a buffer line, or a `to pH` line the solution stage cannot solve). */
export function skippedLine(line: BufferLine | IngredientLine, { reason, code }: { reason: string; code: DiagnosticCode }): SkippedLine {
  if (line.kind === 'ingredient') return skippedIngredient(line, { reason, code });
  return { kind: 'ingredient', text: line.source.text, lineStart: line.source.start, lineEnd: line.source.end, reason, code, cautions: [] };
}

type LineResult = { diagnostics: ChemDiagnostic[] } & ({ counted: CountedLine; skipped?: undefined } | { counted?: undefined; skipped: SkippedLine });

/** One ingredient line counted with its amounts, or set aside with the reason. */
function countLine(line: IngredientLine, headers: BatchHeaders): LineResult {
  const a = line.analysis;
  const M = a.molarMass?.value;
  let diagnostics = line.diagnostics;
  if (line.solveFor && !hasError(diagnostics) && a.ok && M) {
    if (headers.volumeL === null) {
      const d = finding(
        'batch-no-volume',
        line.solveFor.start,
        line.solveFor.end,
        `A 'to pH' amount needs the batch's final volume: add a line 'volume: 500 mL'.`,
      );
      diagnostics = [...diagnostics, d];
      return { diagnostics, skipped: skippedIngredient(line, reasonOf(diagnostics)) };
    }
    const amount = line.amount as Token;
    const counted: CountedLine = {
      line,
      molarMass: M,
      moles: 0,
      massG: 0,
      amount: { value: line.solveFor.pH, unit: 'to pH', text: amount.text, start: amount.start, end: amount.end },
      concentrationM: 0,
      massFraction: null,
      fractionOfTotal: null,
      pending: true,
    };
    return { diagnostics, counted };
  }
  const target = line.unitInfo && !hasError(diagnostics) && a.ok && M ? amountsOf(line, line.unitInfo, M, headers) : null;
  if (target && 'error' in target) diagnostics = [...diagnostics, target.error];
  else if (target) {
    const amount = line.amount as Token;
    const unit = line.unit as Token;
    const counted: CountedLine = {
      line,
      molarMass: M as number,
      moles: target.moles,
      massG: target.massG,
      amount: { value: line.value, unit: unit.text as Ingredient['amount']['unit'], text: `${amount.text} ${unit.text}`, start: amount.start, end: unit.end },
      concentrationM: headers.volumeL ? target.moles / headers.volumeL : null,
      massFraction: null,
      fractionOfTotal: null,
    };
    return { diagnostics, counted };
  }
  if (hasError(diagnostics)) return { diagnostics, skipped: skippedIngredient(line, reasonOf(diagnostics)) };
  // Read without an error, yet no molar mass (a count that is a letter): not counted, and said so.
  const noMass = finding('malformed-formula', line.formula.start, line.formula.end, `'${line.formula.text}' has no molar mass.`);
  return { diagnostics: [...diagnostics, noMass], skipped: skippedIngredient(line, { reason: noMass.message, code: noMass.code }) };
}

/** Moles and mass to weigh of a line, once the volume and total are known; a target that cannot be met is an error on the line. */
function amountsOf(
  line: IngredientLine,
  unit: BatchUnit,
  M: number,
  { volumeL, totalMassG }: BatchHeaders,
): { moles: number; massG: number } | { error: ChemDiagnostic } {
  const amount = line.amount as Token;
  const unitEnd = (line.unit as Token).end;
  if (unit.kind === 'mass') {
    const massG = line.value * unit.factor;
    return { massG, moles: (massG * line.assay) / M };
  }
  if (unit.kind === 'amount') {
    const moles = line.value * unit.factor;
    return { moles, massG: (moles * M) / line.assay };
  }
  if (unit.kind === 'concentration') {
    if (volumeL === null)
      return {
        error: finding('batch-no-volume', amount.start, unitEnd, `A target concentration needs the batch's final volume: add a line 'volume: 500 mL'.`),
      };
    const moles = line.value * unit.factor * volumeL;
    return { moles, massG: (moles * M) / line.assay };
  }
  if (totalMassG === null)
    return { error: finding('batch-no-total', amount.start, unitEnd, `A wt% target needs the batch's total mass: add a line 'total: 250 g'.`) };
  if (line.value > 100) return { error: finding('batch-amount', amount.start, unitEnd, `${line.value} wt% is more than the whole batch.`) };
  const substance = (line.value / 100) * totalMassG;
  return { moles: substance / M, massG: substance / line.assay };
}

/** The reason a line is set aside: its error messages, in order. */
export function reasonOf(diagnostics: readonly ChemDiagnostic[]): { reason: string; code: DiagnosticCode } {
  const errors = diagnostics.filter((d) => d.severity === 'error').sort((a, b) => a.start - b.start);
  const list = errors.length ? errors : diagnostics;
  return { reason: [...new Set(list.map((d) => d.message))].join(' '), code: list[0]?.code ?? 'batch-syntax' };
}

function skippedIngredient(line: IngredientLine, { reason, code }: { reason: string; code: DiagnosticCode }): SkippedLine {
  const readable = line.analysis.ok && line.analysis.molarMass ? line.analysis : undefined;
  return {
    kind: 'ingredient',
    text: line.source.text,
    lineStart: line.source.start,
    lineEnd: line.source.end,
    reason,
    code,
    formulaText: line.formula.text,
    formulaStart: line.formula.start,
    formulaEnd: line.formula.end,
    ...(readable ? { analysis: readable } : {}),
    cautions: readable ? cautionsFor(readable) : [],
  };
}

function skippedHeader({ source, finding: d }: SetAsideHeader): SkippedLine {
  return { kind: 'header', text: source.text, lineStart: source.start, lineEnd: source.end, reason: d.message, code: d.code, cautions: [] };
}
