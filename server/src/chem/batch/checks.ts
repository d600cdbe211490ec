/**
 * Stage 4 of a batch: cautions and checks over the amounts — each substance's cautions (a line not counted
 * keeps its formula's), one line per caution for the batch, the weighed mass against the `total:`, and the
 * solubility of each ingredient in the estimated water (solubility.ts).
 */
import { cautionsFor, type Caution } from '../cautions';
import type { ChemDiagnostic } from '../diagnostic';
import type { BatchAmounts } from './amounts';
import type { BatchHeaders } from './read';
import { checkSolubility, fmt } from './solubility';
import { finding } from './tokens';
import type { SkippedLine, SolubilityCheck } from './types';

export interface BatchChecks {
  /** The cautions of each counted line, in the same order. */
  cautions: Caution[][];
  /** One line per caution, naming every substance it applies to. */
  batchCautions: Caution[];
  /** The solubility check of each counted line, in the same order. */
  solubility: Array<SolubilityCheck | undefined>;
  waterG: number | null;
  diagnostics: ChemDiagnostic[];
}

/** Check the batch (stage 4). */
export function checkBatch(amounts: BatchAmounts, headers: BatchHeaders): BatchChecks {
  const cautions = amounts.counted.map((c) => cautionsFor(c.line.analysis));
  const named = amounts.counted.map((c, k) => ({ who: c.line.analysis.display, cautions: cautions[k] }));
  const sol = checkSolubility(amounts.counted, headers.volumeL);
  return {
    cautions,
    batchCautions: batchCautions(named, amounts.skipped),
    solubility: sol.checks,
    waterG: sol.waterG,
    diagnostics: [...totalCheck(amounts.weighedG, headers), ...sol.diagnostics],
  };
}

/** A warning on the `total:` where the ingredients weigh more than it. */
function totalCheck(weighedG: number, { totalMassG, totalRange }: BatchHeaders): ChemDiagnostic[] {
  if (totalMassG === null || !totalRange || !(weighedG > totalMassG * (1 + 1e-9))) return [];
  const message = `The ingredients weigh ${fmt(weighedG)} g, more than the batch's total of ${fmt(totalMassG)} g; the shares of the total add up to ${fmt((weighedG / totalMassG) * 100)} %.`;
  return [finding('batch-total', totalRange.start, totalRange.end, message, 'warning')];
}

/** One line per caution, naming every ingredient it applies to; a line not counted still carries its formula's cautions. */
function batchCautions(counted: ReadonlyArray<{ who: string; cautions: readonly Caution[] }>, skipped: readonly SkippedLine[]): Caution[] {
  const byText = new Map<string, { cls: Caution['cls']; who: string[] }>();
  const add = (who: string, list: readonly Caution[]) => {
    for (const c of list) {
      const at = byText.get(c.text);
      if (at) {
        if (!at.who.includes(who)) at.who.push(who);
      } else byText.set(c.text, { cls: c.cls, who: [who] });
    }
  };
  for (const c of counted) add(c.who, c.cautions);
  for (const s of skipped) if (s.analysis) add(`${s.analysis.display} (line not counted)`, s.cautions);
  return [...byText].map(([text, v]) => ({ cls: v.cls, text: `${v.who.join(', ')}: ${text}` }));
}
