/**
 * Inlay hints (LSP `textDocument/inlayHint`): what the batch analysis computed, written beside the line it
 * was computed for, so that a chemist reads the amount to weigh without opening a hover or a table.
 *
 * The hints of a batch come from hint makers, one per stage of the batch pipeline whose results belong
 * beside a line (`HINT_MAKERS`): the mass to weigh beside each line weighed to a target (an amount, a
 * concentration, a mass fraction, a unit per volume, or `to pH`: the solved amount); the volume to pour
 * beside a liquid's target line and the stock volume beside a dilution; the batch's computed pH after its
 * opening line. A maker returns nothing where its stage computed nothing: no hint shows a value that was
 * not computed.
 */
import type { Ingredient } from '../chem/batch';
import { unitSpelled } from '../chem/batch/units';
import { reagentUnit } from '../chem/reagents';
import { pHText } from './solution';
import { shiftBatch, type AnalysedDocument, type BatchOccurrence } from './document';
import { massText, mlText, molarMassText, percent, sig } from './format';
import type { Position } from './positions';
import type { ServiceSettings } from './settings';

/** LSP InlayHintKind: a hint about a value (Parameter is for call arguments). */
export const InlayHintKind = { Type: 1, Parameter: 2 } as const;

/** A hint at an offset of the note (absolute), with its text and what its tooltip explains. */
export interface BatchLineHint {
  offset: number;
  label: string;
  tooltip: string;
}

/** One stage's hints for a batch (offsets absolute). */
export type HintMaker = (batch: BatchOccurrence, settings: ServiceSettings) => BatchLineHint[];

export interface InlayHint {
  position: Position;
  label: string;
  kind: number;
  tooltip: { kind: 'markdown'; value: string };
  paddingLeft: boolean;
}

/** A line given as a target: any unit but a mass (chem/batch/units.ts), whose line already says what to weigh. */
const isTarget = (i: Ingredient) => unitSpelled(i.amount.unit)?.kind !== 'mass' && reagentUnit(i.amount.unit)?.kind !== 'volume';

/** The mass to weigh beside each target line. */
export const massToWeigh: HintMaker = (batch, settings) => {
  const out: BatchLineHint[] = [];
  for (const i of batch.analysis.ingredients) {
    if (!isTarget(i) || i.massG === null || i.measure !== 'weigh') continue;
    const parts = [`${massText(i.massG)} of ${i.formula} to weigh`];
    if (i.moles !== null) parts.push(`${sig(i.moles)} mol × ${molarMassText(i.molarMass, settings)} g/mol`);
    if (i.assay < 1) parts.push(`divided by the assay, ${percent(i.assay, 1)}`);
    out.push({ offset: i.lineEnd, label: `⇒ ${massText(i.massG)}`, tooltip: parts.join('; ') + '.' });
  }
  return out;
};

/** The volume to pour beside a liquid's target line, and the stock volume beside a dilution. */
export const volumeToMeasure: HintMaker = (batch) => {
  const out: BatchLineHint[] = [];
  for (const i of batch.analysis.ingredients) {
    if (i.volumeML === null || !isTarget(i)) continue;
    const what = i.measure === 'stock' ? `of the stock (${i.stock ?? ''})` : `of ${i.formula}${i.assay < 1 ? ` at ${percent(i.assay, 1)}` : ''} to pour`;
    const parts = [`${mlText(i.volumeML)} ${what}`];
    if (i.basis) parts.push(i.basis);
    if (i.density) parts.push(`density ${i.density}`);
    out.push({ offset: i.lineEnd, label: `⇒ ${mlText(i.volumeML)}`, tooltip: parts.join('; ') + '.' });
  }
  return out;
};

/** The batch's computed pH after its opening line (an equilibrium estimate; only where it converged). */
export const batchPH: HintMaker = (batch) => {
  const s = batch.analysis.solution;
  if (!s || !s.converged) return [];
  const stated = batch.analysis.statedPH !== null ? `; the batch states pH ${pHText(batch.analysis.statedPH)}` : '';
  return [
    {
      offset: batch.ref.open.end,
      label: `pH ≈ ${pHText(s.pH)}`,
      tooltip: `The pH of the made-up batch at ${s.temperatureC} °C, an equilibrium estimate (${s.activityModel} activities)${stated}; measure it.`,
    },
  ];
};

/** The hint makers, in the order their hints are shown. */
export const HINT_MAKERS: readonly HintMaker[] = [batchPH, massToWeigh, volumeToMeasure];

/** Every hint of one batch, from every maker, in the order of the text. */
export function batchLineHints(batch: BatchOccurrence, settings: ServiceSettings): BatchLineHint[] {
  const out = HINT_MAKERS.flatMap((make) => make(batch, settings));
  return out.length > 1 ? out.sort((a, b) => a.offset - b.offset) : out;
}

/** The hints of the batches that overlap [start, end) (offsets of the note): only those blocks are read. */
export function inlayHints(doc: AnalysedDocument, start: number, end: number, settings: ServiceSettings): InlayHint[] {
  const out: InlayHint[] = [];
  const blocks = doc.blocks;
  // The first block that ends at or after `start`.
  let lo = 0;
  let hi = blocks.length;
  while (lo < hi) {
    const mid = (lo + hi) >> 1;
    if (blocks[mid].end < start) lo = mid + 1;
    else hi = mid;
  }
  for (let k = lo; k < blocks.length && blocks[k].start <= end; k++) {
    const b = blocks[k];
    for (const rel of b.rel.batches) {
      if (rel.ref.end + b.start < start || rel.ref.start + b.start > end) continue;
      for (const h of batchLineHints(shiftBatch(rel, b.start), settings)) {
        if (h.offset < start || h.offset > end) continue;
        out.push({
          position: doc.lines.positionAt(h.offset),
          label: h.label,
          kind: InlayHintKind.Type,
          tooltip: { kind: 'markdown', value: h.tooltip },
          paddingLeft: true,
        });
      }
    }
  }
  return out;
}
