/** The contract's JSON for a batch block (`ionwright batch --json`). */
import type { BatchAnalysis, BatchSolution } from '../chem/batch';
import { upkeepJson } from '../chem/upkeep';
import { round } from './card';
import { toLsp } from './diagnostics';
import type { AnalysedDocument, BatchOccurrence } from './document';

const r = (x: number | null, p = 9) => (x === null ? null : round(x, p));
/** Concentrations span many decades: significant figures, not decimals. */
const sigs = (x: number) => (x === 0 || !Number.isFinite(x) ? x : Number(x.toPrecision(6)));

/** The contract's `solution`: the equilibrium of the made-up batch (null without one). */
export function solutionJson(s: BatchSolution | null) {
  if (!s) return null;
  return {
    temperatureC: s.temperatureC,
    pH: s.converged ? round(s.pH, 4) : null,
    ionicStrengthM: s.converged ? sigs(s.ionicStrengthM) : null,
    activityModel: s.activityModel,
    converged: s.converged,
    iterations: s.iterations,
    species: s.converged
      ? s.species.map((x) => ({ formula: x.label, display: x.display, charge: x.charge, concentrationM: sigs(x.concentrationM), activity: sigs(x.activity) }))
      : [],
    saturation: s.converged
      ? s.saturation.map((x) => ({ solid: x.solid, name: x.name, saturationIndex: round(x.saturationIndex, 3), logKsp: x.logKsp, source: x.source }))
      : [],
    /** dC(base)/dpH, mol/(L·pH). */
    bufferCapacity: s.bufferCapacity === null ? null : sigs(s.bufferCapacity),
    /** What would come out at equilibrium, and the pH then. */
    precipitates: s.precipitates.map((p) => ({ solid: p.solid, name: p.name, molPerL: sigs(p.molPerL), massG: sigs(p.massG) })),
    afterPrecipitation: s.afterPrecipitation ? { pH: round(s.afterPrecipitation.pH, 4), ionicStrengthM: sigs(s.afterPrecipitation.ionicStrengthM) } : null,
    outOfRange: s.outOfRange,
    ingredients: s.ingredients.map((i) => ({ formula: i.formula, as: i.as, ...(i.leftOut ? { leftOut: i.leftOut } : {}) })),
    notes: s.notes,
  };
}

/**
 * The contract's `hazards`: `[{kind, message, ingredients}]`, with the harm, the 0-based lines of the
 * ingredients named, the rule, its source and the pH a pH-dependent rule used.
 */
export function hazardsJson(doc: AnalysedDocument, a: BatchAnalysis) {
  return a.hazards.map((h) => ({
    kind: h.kind,
    message: h.message,
    ingredients: h.ingredients,
    harm: h.harm,
    /** 0-based document lines of the ingredients, in the same order; the warning is on the last. */
    lines: h.lines.map((offset) => doc.lines.positionAt(offset).line),
    rule: h.rule,
    source: h.source,
    ...(h.pH ? { pH: { value: round(h.pH.value, 2), from: h.pH.from } } : {}),
  }));
}

/** The contract's `heat`: `{kJ, temperatureRiseK, method}` (an estimate), with its steps, limits and advice; null where no heat is known. */
export function heatJson(doc: AnalysedDocument, a: BatchAnalysis) {
  const h = a.heat;
  if (!h) return null;
  return {
    kJ: sigs(h.kJ),
    /** Negative: the batch cools. Null where the batch's water is not known. */
    temperatureRiseK: h.temperatureRiseK === null ? null : sigs(h.temperatureRiseK),
    method: h.method,
    estimate: true,
    uncertaintyK: sigs(h.uncertaintyK),
    startC: h.startC,
    finalC: h.finalC === null ? null : round(h.finalC, 2),
    thresholdK: h.thresholdK,
    exceeds: h.exceeds,
    steps: h.steps.map((st) => ({
      kind: st.kind,
      ingredient: st.ingredient,
      /** 0-based document line of the ingredient; null for a neutralisation between ingredients. */
      line: st.ingredientIndex === null ? null : doc.lines.positionAt(a.ingredients[st.ingredientIndex].lineStart).line,
      kJ: sigs(st.kJ),
      ...(st.kJPerMol !== undefined ? { kJPerMol: sigs(st.kJPerMol) } : {}),
      method: st.method,
      ...(st.source ? { source: st.source } : {}),
      ...(st.uncertaintyKJ !== undefined ? { uncertaintyKJ: sigs(st.uncertaintyKJ) } : {}),
    })),
    advice: h.advice,
    notes: h.notes,
  };
}

export function batchJson(doc: AnalysedDocument, b: BatchOccurrence) {
  const a = b.analysis;
  return {
    name: a.name,
    /** 0-based line of the block's opening line, as the ranges of `check`. */
    line: doc.lines.positionAt(b.ref.start).line,
    volumeL: r(a.volumeL),
    totalMassG: r(a.totalMassG),
    ingredients: a.ingredients.map((i) => ({
      /** The formula as written, or (for a line that named its substance or a shelf label) the formula read. */
      formula: i.via === 'formula' ? i.formulaText : i.analysis.ascii,
      ...(i.via !== 'formula' ? { written: i.formulaText } : {}),
      /** Hill formula of what is weighed (hydrate water included). */
      hill: i.analysis.hill,
      display: i.formula,
      amount: i.amount.text,
      assay: i.assay,
      molarMass: r(i.molarMass, 6),
      moles: r(i.moles),
      massG: r(i.massG),
      /** Volume of the reagent as supplied to pour (liquids), or of the stock to take; null where weighed. */
      volumeML: r(i.volumeML, 6),
      measure: i.measure,
      via: i.via,
      ...(i.name ? { name: i.name } : {}),
      ...(i.shelf ? { shelf: i.shelf } : {}),
      ...(i.density ? { density: i.density } : {}),
      ...(i.basis ? { basis: i.basis } : {}),
      ...(i.stock ? { stock: i.stock } : {}),
      ...(i.notes.length ? { notes: i.notes } : {}),
      ...(i.handling.length ? { handling: i.handling } : {}),
      concentrationM: r(i.concentrationM),
      /** Share of the weighed mass (the counted ingredients), with or without `total:`. */
      massFraction: r(i.massFraction),
      ...(a.totalMassG !== null ? { fractionOfTotal: r(i.fractionOfTotal) } : {}),
      ions: i.ions.map((x) => ({ ion: x.key, count: x.count, charge: x.charge })),
      ...(i.undissociated ? { undissociated: i.undissociated } : {}),
      cautions: i.cautions.map((c) => c.text),
      ...(i.solvedFor ? { solvedFor: { pH: i.solvedFor.targetPH, reached: round(i.solvedFor.pH, 4) } } : {}),
      ...(i.buffer
        ? {
            buffer: {
              system: i.buffer.design.system,
              role: i.buffer.role,
              totalM: i.buffer.design.totalM,
              pH: i.buffer.design.pH === undefined ? null : round(i.buffer.design.pH, 4),
              // The buffering step's base : acid concentration ratio as designed, and Henderson–Hasselbalch's for it.
              forms: i.buffer.design.forms,
              pKa: i.buffer.design.pKa,
              ratio: Number.isFinite(i.buffer.design.ratio) ? round(i.buffer.design.ratio, 6) : null,
              idealRatio: i.buffer.design.idealRatio === null ? null : round(i.buffer.design.idealRatio, 6),
            },
          }
        : {}),
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
    temperatureC: a.temperatureC,
    statedPH: a.statedPH,
    solution: solutionJson(a.solution),
    /** Bath upkeep: titres, the tank and the additions (null where the batch has no titre line or tank). */
    upkeep: a.upkeep ? upkeepJson(a.upkeep) : null,
    hazards: hazardsJson(doc, a),
    heat: heatJson(doc, a),
    notes: a.notes,
    cautions: a.cautions.map((c) => c.text),
    diagnostics: a.diagnostics.map((d) => toLsp(doc.lines, d)),
  };
}
