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
import { amountIn, dilution, handlingCautions, liquidOf, volumeFor, type ReagentFinding } from '../reagents';
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
  /** How it is measured out: weighed, poured (a liquid by volume), or taken from a stock. */
  measure: 'weigh' | 'pour' | 'stock';
  /** Volume of the reagent as supplied to pour, mL (a liquid), or of the stock to take. */
  volumeML: number | null;
  /** The density used for a liquid, and its source, in one line. */
  density?: string;
  /** How the amount was worked out, in one line (`25 g/L × 0.5 L = 12.5 g`). */
  basis?: string;
  /** What the amount rests on and the reading assumed, for the hover. */
  notes: string[];
  /** Handling cautions of a concentrated acid, base or solvent poured. */
  handling: string[];
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
  // A stock taken by volume is not weighed: its substance is no share of the weighed mass.
  out.weighedG = out.counted.reduce((s, c) => s + (c.measure === 'stock' ? 0 : c.massG), 0);
  for (const c of out.counted) {
    c.massFraction = out.weighedG > 0 && c.measure !== 'stock' ? c.massG / out.weighedG : null;
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
      measure: 'weigh',
      volumeML: null,
      notes: [...line.notes],
      handling: [],
    };
    return { diagnostics, counted };
  }
  const readable = !hasError(diagnostics) && a.ok && M;
  let target: Measured | { error: ChemDiagnostic } | null = null;
  if (readable && line.stock) target = fromStock(line, M, headers);
  else if (readable && line.unitInfo) target = amountsOf(line, line.unitInfo, M, headers);
  else if (readable && line.reagentUnit) target = reagentAmount(line, headers);
  if (target && 'error' in target) diagnostics = [...diagnostics, target.error];
  else if (target) {
    const amount = line.amount as Token;
    const unit = line.unit as Token;
    const extra = target.findings ?? [];
    if (extra.length) diagnostics = [...diagnostics, ...extra];
    if (hasError(extra)) return { diagnostics, skipped: skippedIngredient(line, reasonOf(diagnostics)) };
    const counted: CountedLine = {
      line,
      molarMass: M as number,
      moles: target.moles,
      massG: target.massG,
      amount: { value: line.value, unit: unit.text as Ingredient['amount']['unit'], text: `${amount.text} ${unit.text}`, start: amount.start, end: unit.end },
      concentrationM: headers.volumeL ? target.moles / headers.volumeL : null,
      massFraction: null,
      fractionOfTotal: null,
      measure: target.measure ?? 'weigh',
      volumeML: target.volumeML ?? null,
      notes: [...line.notes, ...(target.notes ?? [])],
      handling: target.handling ?? [],
    };
    if (target.density) counted.density = target.density;
    if (target.basis) counted.basis = target.basis;
    if (counted.measure === 'weigh') {
      const more = liquidVolume(counted);
      if (more.length) diagnostics = [...diagnostics, ...more];
    }
    return { diagnostics, counted };
  }
  if (hasError(diagnostics)) return { diagnostics, skipped: skippedIngredient(line, reasonOf(diagnostics)) };
  // Read without an error, yet no molar mass (a count that is a letter): not counted, and said so.
  const noMass = finding('malformed-formula', line.formula.start, line.formula.end, `'${line.formula.text}' has no molar mass.`);
  return { diagnostics: [...diagnostics, noMass], skipped: skippedIngredient(line, { reason: noMass.message, code: noMass.code }) };
}

/** Moles and mass to weigh of a line, once the volume and total are known; a target that cannot be met is an error on the line. */
function amountsOf(line: IngredientLine, unit: BatchUnit, M: number, { volumeL, totalMassG }: BatchHeaders): Measured | { error: ChemDiagnostic } {
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

/** A line's amounts as measured out, with what they rest on. */
interface Measured {
  moles: number;
  /** Mass of the reagent as supplied (the assay's share is the substance). */
  massG: number;
  measure?: CountedLine['measure'];
  volumeML?: number;
  density?: string;
  basis?: string;
  notes?: string[];
  handling?: string[];
  /** Findings on the line (warnings count it; an error sets it aside). */
  findings?: ChemDiagnostic[];
}

/** The catalogue code of a reagent finding. */
function codeOf(f: ReagentFinding): DiagnosticCode {
  switch (f.kind) {
    case 'unknown-liquid':
      return 'reagent-density';
    case 'assay-needed':
      return f.severity === 'error' ? 'reagent-no-assay' : 'reagent-assay';
    case 'assay-range':
    case 'measuring-precision':
      return 'batch-amount';
    case 'ppm-basis':
      return 'reagent-basis';
    case 'basis-missing':
      return /total mass/.test(f.message) && !/final volume/.test(f.message) ? 'batch-no-total' : 'batch-no-volume';
    case 'dilution-impossible':
      return 'batch-stock';
    case 'normality-role':
      return 'batch-unit';
    default:
      return 'batch-amount';
  }
}

/**
 * The reagent findings as the line's findings (on `start`–`end`) and notes (the information ones). The
 * handling cautions are left out: they are taken line by line from chem/reagents (`handlingCautions`).
 */
function mapFindings(findings: readonly ReagentFinding[], start: number, end: number): { diagnostics: ChemDiagnostic[]; notes: string[] } {
  const out = { diagnostics: [] as ChemDiagnostic[], notes: [] as string[] };
  for (const f of findings) {
    if (f.kind === 'handling') continue;
    if (f.severity === 'information') out.notes.push(f.message);
    else out.diagnostics.push(finding(codeOf(f), start, end, f.message, f.severity));
  }
  return out;
}

/** An amount in a unit of chem/reagents (g/L, %w/v, %v/v, ppm, mol/kg, N, mL …). */
function reagentAmount(line: IngredientLine, { volumeL, totalMassG }: BatchHeaders): Measured | { error: ChemDiagnostic } {
  const amount = line.amount as Token;
  const unit = line.unit as Token;
  const u = line.reagentUnit as NonNullable<IngredientLine['reagentUnit']>;
  const r = amountIn({
    value: line.value,
    unit: u.unit,
    analysis: line.analysis,
    batch: { volumeL, totalMassG, aqueous: true },
    ...(line.role ? { role: line.role } : {}),
    ...(line.assayPercent !== undefined ? { assayPercent: line.assayPercent } : {}),
    ...(line.densityGPerML !== undefined ? { densityGPerML: line.densityGPerML } : {}),
  });
  const mapped = mapFindings(r.findings, amount.start, unit.end);
  if (!('moles' in r)) {
    const error =
      mapped.diagnostics.find((d) => d.severity === 'error') ?? finding('batch-unit', amount.start, unit.end, `${u.unit} cannot be read for this line.`);
    return { error };
  }
  // Poured: the mass of the reagent as supplied is its volume × density; weighed: the substance ÷ assay.
  const density = r.volumeML !== undefined ? r.density : undefined;
  const out: Measured = {
    moles: r.moles,
    massG: density ? (r.volumeML as number) * density.gPerML : r.massG / line.assay,
    basis: r.basis,
    notes: mapped.notes,
    handling: density ? handlingCautions(line.analysis, density.assayPercent) : [],
    findings: mapped.diagnostics,
  };
  if (density) {
    out.measure = 'pour';
    out.volumeML = r.volumeML as number;
    out.density = density.text;
  }
  return out;
}

/** `from 1.5 M` / `from batch "…"`: the stock volume to take for the line's target. */
function fromStock(line: IngredientLine, M: number, { volumeL }: BatchHeaders): Measured | { error: ChemDiagnostic } {
  const stock = line.stock as NonNullable<IngredientLine['stock']>;
  const unit = line.unit as Token;
  const amount = line.amount as Token;
  if (stock.kind === 'batch' && (stock.error || stock.value === null))
    return { error: finding('batch-stock', stock.start, stock.end, stock.error ?? `The stock batch '${stock.batch}' gives no concentration.`) };
  if (volumeL === null)
    return {
      error: finding(
        'batch-no-volume',
        amount.start,
        stock.end,
        `A dilution is made to the batch's final volume: add a line 'volume: 500 mL' or 'water to 500 mL'.`,
      ),
    };
  const kind = line.unitInfo?.kind ?? line.reagentUnit?.kind;
  if (kind !== 'concentration' && kind !== 'massPerVolume' && kind !== 'weightPerVolumePercent' && kind !== 'normality' && kind !== 'volumePercent')
    return {
      error: finding('batch-stock', amount.start, stock.end, `A dilution is made to a concentration (M, mM, g/L, %w/v, N); '${unit.text}' is not one.`),
    };
  const from = stock.kind === 'batch' ? { value: stock.value as number, unit: 'M' } : { value: stock.value, unit: stock.unit };
  const r = dilution({ value: line.value, unit: unit.text }, from, volumeL, M);
  const mapped = mapFindings(r.findings, stock.start, stock.end);
  if (!('stockVolumeML' in r)) return { error: mapped.diagnostics[0] ?? finding('batch-stock', stock.start, stock.end, 'This dilution cannot be made.') };
  const moles = r.moles ?? 0;
  const notes = [...mapped.notes];
  if (stock.kind === 'batch') notes.push(`Stock: batch '${stock.batch}' at ${Number(from.value.toPrecision(4))} M (its computed concentration).`);
  return {
    moles,
    // The substance's mass in the stock taken: nothing is weighed.
    massG: moles * M,
    measure: 'stock',
    volumeML: r.stockVolumeML,
    basis: r.basis,
    notes,
    handling: [],
    findings: mapped.diagnostics,
  };
}

/**
 * A line weighed, or a target, of a liquid reagent (an acid or base solution with its assay, a pure
 * liquid): the volume to pour as well, with the density used, into `c`. A reagent sold only as a solution
 * and given without its assay gets a warning (its volume cannot be given), which is returned; a solid
 * (NaOH pellets) gets nothing.
 */
export function liquidVolume(c: CountedLine): ChemDiagnostic[] {
  const { line } = c;
  const m = liquidOf(line.analysis);
  if (!m) return [];
  const given = line.assayPercent;
  const solutionOnly = m.kind === 'aqueous' && !m.table.pureLiquid;
  if (given === undefined && solutionOnly) {
    if (!line.solutionName && !GAS_SOLUTIONS.has(m.table.id)) return [];
    return [
      finding(
        'reagent-assay',
        line.formula.start,
        (line.unit ?? line.formula).end,
        `${line.name ?? line.analysis.display} is supplied as a solution in water: give its assay from the label (e.g. '@ ${TYPICAL[m.table.id] ?? '10'}%') to get the volume to pour; the amount is counted as the pure substance.`,
        'warning',
      ),
    ];
  }
  const v = volumeFor(line.analysis, c.moles, given, line.densityGPerML);
  if (!('volumeML' in v)) return [];
  c.volumeML = v.volumeML;
  c.density = v.density.text;
  c.massG = v.solutionMassG;
  c.measure = 'pour';
  c.handling = [...new Set([...c.handling, ...v.cautions])];
  c.notes.push(...mapFindings(v.findings, line.formula.start, line.formula.end).notes);
  return [];
}

/** Reagents that are gases or unstable as pure substances: sold only as solutions (their assay matters). */
const GAS_SOLUTIONS = new Set(['hydrochloric', 'ammonia', 'hydrofluoric', 'hydrogen-peroxide']);
/** The usual assay of the concentrated reagent, for a message's example (common practice). */
const TYPICAL: Record<string, string> = { hydrochloric: '37', ammonia: '25', hydrofluoric: '48', 'hydrogen-peroxide': '30' };
