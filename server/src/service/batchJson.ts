/** The contract's JSON for a batch block (`ionwright batch --json`). */
import { round } from './card';
import { toLsp } from './diagnostics';
import type { AnalysedDocument, BatchOccurrence } from './document';

const r = (x: number | null, p = 9) => (x === null ? null : round(x, p));

export function batchJson(doc: AnalysedDocument, b: BatchOccurrence) {
  const a = b.analysis;
  return {
    name: a.name,
    /** 0-based line of the block's opening line, as the ranges of `check`. */
    line: doc.lines.positionAt(b.ref.start).line,
    volumeL: r(a.volumeL),
    totalMassG: r(a.totalMassG),
    ingredients: a.ingredients.map((i) => ({
      formula: i.formulaText,
      /** Hill formula of what is weighed (hydrate water included). */
      hill: i.analysis.hill,
      display: i.formula,
      amount: i.amount.text,
      assay: i.assay,
      molarMass: r(i.molarMass, 6),
      moles: r(i.moles),
      massG: r(i.massG),
      /** Volume of the reagent as supplied, for liquids measured by volume; every ingredient is weighed so far. */
      volumeML: null,
      concentrationM: r(i.concentrationM),
      /** Share of the weighed mass (the counted ingredients), with or without `total:`. */
      massFraction: r(i.massFraction),
      ...(a.totalMassG !== null ? { fractionOfTotal: r(i.fractionOfTotal) } : {}),
      ions: i.ions.map((x) => ({ ion: x.key, count: x.count, charge: x.charge })),
      ...(i.undissociated ? { undissociated: i.undissociated } : {}),
      cautions: i.cautions.map((c) => c.text),
      ...(i.solubility
        ? {
            solubility: {
              salt: i.solubility.row.formula,
              gPer100gWater: i.solubility.row.gPer100gWater,
              temperatureC: i.solubility.row.temperatureC,
              per100gWaterEstimate: r(i.solubility.per100gWater, 6),
              exceeds: i.solubility.exceeds,
              source: i.solubility.row.source,
            },
          }
        : {}),
    })),
    /** Every non-blank line that is not counted: 0-based document line, the line as written, why. */
    skipped: a.skipped.map((l) => ({
      line: doc.lines.positionAt(l.lineStart).line,
      text: l.text,
      reason: l.reason,
      code: l.code,
      ...(l.analysis ? { formula: l.formulaText, cautions: l.cautions.map((c) => c.text) } : {}),
    })),
    incomplete: a.skipped.length > 0,
    ions: a.ions.map((x) => ({ ion: x.key, display: x.ion, charge: x.charge, concentrationM: r(x.concentrationM) })),
    ionicStrengthM: r(a.ionicStrengthM),
    /** Estimated water in the batch, g: final volume × 1 g/mL less the dissolved mass (null without a volume). */
    waterEstimateG: r(a.waterG, 6),
    netChargeEqPerL: r(a.netChargeEqPerL),
    notes: a.notes,
    cautions: a.cautions.map((c) => c.text),
    diagnostics: a.diagnostics.map((d) => toLsp(doc.lines, d)),
  };
}
