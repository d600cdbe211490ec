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
      display: i.formula,
      amount: i.amount.text,
      assay: i.assay,
      molarMass: r(i.molarMass, 6),
      moles: r(i.moles),
      massG: r(i.massG),
      concentrationM: r(i.concentrationM),
      massFraction: r(i.massFraction),
      ions: i.ions.map((x) => ({ ion: x.key, count: x.count, charge: x.charge })),
      ...(i.undissociated ? { undissociated: i.undissociated } : {}),
      cautions: i.cautions.map((c) => c.text),
    })),
    ions: a.ions.map((x) => ({ ion: x.key, display: x.ion, charge: x.charge, concentrationM: r(x.concentrationM) })),
    ionicStrengthM: r(a.ionicStrengthM),
    netChargeEqPerL: r(a.netChargeEqPerL),
    notes: a.notes,
    cautions: a.cautions.map((c) => c.text),
    diagnostics: a.diagnostics.map((d) => toLsp(doc.lines, d)),
  };
}
