/**
 * Stage 3 of a batch (between the amounts and the ions): the equilibrium of the made-up solution
 * (chem/solution/) — pH, species, saturation indices — where the batch has a final volume. A `to pH` line's
 * amount and a buffer line's two forms are solved here first (one such line per batch: a second one is not
 * counted), then the batch as a whole.
 *
 * Findings: `batch-ph-target` and `batch-buffer` on a line that cannot be solved (not counted),
 * `batch-buffer-range` on a buffer far from its pKa, `batch-ph` on a `pH:` header the computed pH misses by
 * more than the setting, `batch-precipitation` (each oversaturated solid, with the mass that would come
 * out) and `batch-equilibrium` (no convergence) on the batch's opening line.
 */
import { analyseFormula } from '../analyse';
import type { ChemDiagnostic } from '../diagnostic';
import { DEFAULT_PH_TOLERANCE, type ChemSettings } from '../settings';
import { batchSolution, componentsOf, designBuffer, oversaturated, solveForPH, type SolutionIngredient } from '../solution/batch';
import { formsASolid } from '../solution/system';
import type { BatchSolution } from '../solution/types';
import { liquidVolume, reasonOf, skippedLine, type BatchAmounts, type CountedLine } from './amounts';
import type { BatchHeaders, BufferLine, IngredientLine } from './read';
import { finding } from './tokens';

export interface SolutionStage {
  /** The solution, or where it cannot lead to a finding, how to make it when it is first read. */
  solution: BatchSolution | null | (() => BatchSolution);
  noSolution?: string;
  diagnostics: ChemDiagnostic[];
}

const signedText = (x: number, d = 2) => `${x >= 0 ? '+' : '−'}${Math.abs(x).toFixed(d)}`;
const pHText = (x: number) => x.toFixed(2);

function massWords(g: number): string {
  if (g >= 1) return `${g.toPrecision(3)} g`;
  if (g >= 1e-3) return `${(g * 1e3).toPrecision(3)} mg`;
  return `${(g * 1e6).toPrecision(2)} µg`;
}

let enabled = true;

/**
 * Switch the equilibrium off or on (the benchmark measures `check` with and without it in the same run;
 * off, a batch has no solution, and `to pH` and buffer lines are not counted).
 */
export function setSolutionStage(on: boolean): void {
  enabled = on;
}

/** The solution stage: fills in the pending lines of `amounts` (or moves them to `skipped`), then solves the batch. */
export function solutionStage(amounts: BatchAmounts, headers: BatchHeaders, settings: ChemSettings, openLine: { start: number; end: number }): SolutionStage {
  const diagnostics: ChemDiagnostic[] = [];
  const V = headers.volumeL;
  if (!enabled) {
    for (const c of [...amounts.counted.filter((x) => x.pending)]) amounts.counted.splice(amounts.counted.indexOf(c), 1);
    return { solution: null, noSolution: 'the equilibrium is switched off', diagnostics };
  }
  if (V === null) {
    if (headers.pH)
      diagnostics.push(
        finding(
          'batch-ph',
          headers.pH.start,
          headers.pH.end,
          `The pH cannot be computed without the batch's final volume: add a line 'volume: 500 mL'.`,
          'warning',
        ),
      );
    return { solution: null, noSolution: 'no final volume', diagnostics };
  }
  const T = headers.temperatureC;
  const fixed: SolutionIngredient[] = amounts.counted.filter((c) => !c.pending).map((c) => ({ analysis: c.line.analysis, moles: c.moles }));
  // One line solved for the pH: the first `to pH` or buffer line; a later one is not counted.
  const solvable: Array<{ at: number; pending?: CountedLine; buffer?: BufferLine }> = [
    ...amounts.counted.filter((c) => c.pending).map((c) => ({ at: c.line.lineStart, pending: c })),
    ...amounts.buffers.map((b) => ({ at: b.lineStart, buffer: b })),
  ].sort((x, y) => x.at - y.at);
  const drop = (line: IngredientLine | BufferLine, d: ChemDiagnostic) => {
    diagnostics.push(d);
    amounts.diagnostics.push(d);
    amounts.skipped.push(skippedLine(line, reasonOf([d])));
    amounts.skipped.sort((x, y) => x.lineStart - y.lineStart);
  };
  const removeCounted = (c: CountedLine) => amounts.counted.splice(amounts.counted.indexOf(c), 1);
  solvable.forEach((s, k) => {
    if (k > 0) {
      const line = s.pending ? s.pending.line : (s.buffer as BufferLine);
      const range = s.pending ? (s.pending.line.solveFor as { start: number; end: number }) : { start: line.lineStart, end: line.lineEnd };
      if (s.pending) removeCounted(s.pending);
      drop(
        line,
        finding(
          s.pending ? 'batch-ph-target' : 'batch-buffer',
          range.start,
          range.end,
          'Only one line of a batch can be solved for its pH (the first one is); give this amount as a number.',
        ),
      );
      return;
    }
    if (s.pending) {
      const c = s.pending;
      const target = c.line.solveFor as NonNullable<IngredientLine['solveFor']>;
      const r = solveForPH(fixed, c.line.analysis, target.pH, V, T);
      if ('error' in r) {
        removeCounted(c);
        drop(c.line, finding('batch-ph-target', target.start, target.end, r.error));
        return;
      }
      c.moles = r.moles;
      c.massG = (r.moles * c.molarMass) / c.line.assay;
      c.concentrationM = r.moles / V;
      c.pending = false;
      c.solvedFor = { targetPH: target.pH, pH: r.pH };
      // A liquid reagent solved for (NaOH @ 50%, HCl @ 37%): the volume to pour too.
      diagnostics.push(...liquidVolume(c));
      fixed.push({ analysis: c.line.analysis, moles: r.moles });
      return;
    }
    const b = s.buffer as BufferLine;
    const spec = b.buffer as NonNullable<BufferLine['buffer']>;
    const total = b.total as NonNullable<BufferLine['total']>;
    const target = b.target as NonNullable<BufferLine['target']>;
    const design = designBuffer(fixed, spec.system, spec.counterIon, total.valueM, target.pH, V, T);
    if ('error' in design) {
      drop(b, finding('batch-buffer', target.start, target.end, design.error));
      return;
    }
    if (design.weak && design.pKa !== null)
      diagnostics.push(
        finding(
          'batch-buffer-range',
          b.lineStart,
          b.lineEnd,
          `pH ${pHText(target.pH)} is more than one unit from the ${design.system} pKa of ${design.pKa.toFixed(2)}: this buffer has little capacity there.`,
          'warning',
        ),
      );
    for (const role of ['acid', 'base'] as const) {
      const form = design[role];
      if (!(form.moles > 0)) continue;
      const analysis = analyseFormula(form.formula, settings);
      const M = analysis.molarMass?.value ?? 0;
      const line: IngredientLine = {
        kind: 'ingredient',
        source: b.source,
        lineStart: b.lineStart,
        lineEnd: b.lineEnd,
        formula: { text: form.formula, start: b.name.start, end: b.name.end },
        analysis,
        amount: { text: total.text, start: total.start, end: total.end },
        value: total.valueM,
        assay: 1,
        diagnostics: [],
        via: 'formula',
        notes: [],
      };
      amounts.counted.push({
        line,
        molarMass: M,
        moles: form.moles,
        massG: form.moles * M,
        amount: { value: total.valueM, unit: 'M', text: total.text, start: total.start, end: total.end },
        concentrationM: form.moles / V,
        massFraction: null,
        fractionOfTotal: null,
        buffer: { role, design },
        measure: 'weigh',
        volumeML: null,
        notes: [],
        handling: [],
      });
      fixed.push({ analysis, moles: form.moles });
    }
    amounts.counted.sort((x, y) => x.line.lineStart - y.line.lineStart);
  });
  if (amounts.counted.length === 0) return { solution: null, noSolution: 'no ingredient is counted', diagnostics };
  const weighed = amounts.counted.reduce((s, c) => s + c.massG, 0);
  if (weighed >= V * 1000) {
    return { solution: null, noSolution: 'the ingredients weigh more than the water of the final volume: not a dilute aqueous solution', diagnostics };
  }
  // In the order of the counted lines (the outputs pair each ingredient with how the model read it).
  const request = { volumeL: V, temperatureC: T, ingredients: amounts.counted.map((c) => ({ analysis: c.line.analysis, moles: c.moles })) };
  // Without a stated pH, a line solved or a solid its components can form, the equilibrium can raise no
  // finding but its own convergence: it is solved when something first reads it (a hover, a table, JSON).
  if (!headers.pH && solvable.length === 0 && !formsASolid(componentsOf(request.ingredients))) return { solution: () => batchSolution(request), diagnostics };
  const solution = batchSolution(request);
  diagnostics.push(...findings(solution, headers, settings, openLine, amounts.skipped.length));
  return { solution, diagnostics };
}

function findings(
  s: BatchSolution,
  headers: BatchHeaders,
  settings: ChemSettings,
  openLine: { start: number; end: number },
  notCounted: number,
): ChemDiagnostic[] {
  const out: ChemDiagnostic[] = [];
  if (!s.converged) {
    out.push(
      finding(
        'batch-equilibrium',
        openLine.start,
        openLine.end,
        `The equilibrium of this batch did not converge in ${s.iterations} iterations; its pH and species are not given.`,
        'warning',
      ),
    );
    return out;
  }
  for (const sat of oversaturated(s)) {
    const p = s.precipitates.find((x) => x.solid === sat.solid);
    const amount = p
      ? `about ${massWords(p.massG)} would come out at equilibrium${s.afterPrecipitation ? ` (the pH then ${pHText(s.afterPrecipitation.pH)})` : ''}`
      : 'none of it at equilibrium, where the other solids take up its ions';
    out.push(
      finding(
        'batch-precipitation',
        openLine.start,
        openLine.end,
        `${sat.display} (${sat.name}) is oversaturated: saturation index ${signedText(sat.saturationIndex)}; ${amount}. An estimate of an ideal model.`,
        'warning',
      ),
    );
  }
  const tolerance = settings.phTolerance ?? DEFAULT_PH_TOLERANCE;
  if (headers.pH && Math.abs(s.pH - headers.pH.value) > tolerance) {
    const d = s.pH - headers.pH.value;
    out.push(
      finding(
        'batch-ph',
        headers.pH.start,
        headers.pH.end,
        `The computed pH is ${pHText(s.pH)}, ${Math.abs(d).toFixed(2)} ${d > 0 ? 'above' : 'below'} the ${pHText(headers.pH.value)} stated (tolerance ${tolerance})${notCounted ? `, with ${notCounted === 1 ? '1 line' : `${notCounted} lines`} of the batch not counted` : ''}; an estimate: measure it.`,
        'warning',
      ),
    );
  }
  return out;
}
