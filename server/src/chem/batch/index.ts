/**
 * Batch arithmetic: a batch block's lines → per-ingredient moles, mass to weigh, concentration and mass
 * fraction; the ions of strong electrolytes, the ionic strength I = ½ Σ cᵢ zᵢ² and the net charge; and the
 * equilibrium of the made-up solution (pH, species, saturation).
 *
 * Lines (each may end in a `#` comment):
 *   name: Rinse buffer R-7
 *   volume: 500 mL          final volume (L, mL, µL)
 *   total: 250 g            total mass of the batch, for wt% targets
 *   pH: 7.40                the pH the batch is expected at (a warning beyond the setting)
 *   temperature: 40 °C      for the equilibrium constants (25 °C unless given)
 *   <formula> <number> <unit> [@ <assay>%]
 *   <formula> to pH <value> [@ <assay>%]              the amount that brings the batch to that pH
 *   [sodium|potassium] <system> buffer <total> to pH <value>   the acid and base forms to weigh
 * Units (units.ts): g mg µg kg (mass weighed), mol mmol µmol (amount: the tool computes the mass), M mM µM
 * (target concentration in the final volume), wt% (mass fraction of the total). An assay (`@ 99.5%`) says
 * how much of what is weighed is the substance: the mass to weigh is divided by it.
 *
 * The analysis is a pipeline of stages with plain data between them; each stage's data keeps the line it
 * came from, so every output shows every line, counted or not (`skipped`, with the reason):
 *   1. read.ts      lines read: headers, and ingredients as formula, amount, unit, assay
 *   2. amounts.ts   moles, mass to weigh, concentration; a line with any error is not counted
 *   3. solution.ts  the equilibrium (chem/solution/): `to pH` and buffer lines solved, then pH, species,
 *                   saturation; then the two shares of each line (amounts.ts)
 *   4. mix.ts       dissociation, the nominal ions of the mix, ionic strength, net charge
 *   5. checks.ts    cautions, the total, solubility (solubility.ts)
 *   6. safety.ts    beside the checks: dangerous pairs and the heat of making up (chem/safety/)
 */
import { DEFAULT_CHEM_SETTINGS, type ChemSettings } from '../settings';
import { computeAmounts, computeShares, type BatchAmounts } from './amounts';
import { checkBatch, type BatchChecks } from './checks';
import { mixIons, type BatchMix } from './mix';
import { readLines, type BatchHeaders, type ReadBatch } from './read';
import { safetyStage, type BatchSafety } from './safety';
import { solutionStage, type SolutionStage } from './solution';
import { analyseUpkeep, type Upkeep } from '../upkeep';
import type { BatchAnalysis, BatchContext, BatchLine, BatchSolution, Ingredient } from './types';

export type {
  AmountUnit,
  BatchAnalysis,
  BatchContext,
  BatchIon,
  BatchLine,
  BatchSolution,
  BufferDesign,
  Ingredient,
  IngredientInModel,
  IonShare,
  PrecipitateAmount,
  SkippedLine,
  SolidSaturation,
  SolubilityCheck,
  SolutionSpecies,
  StockBatch,
} from './types';
export { dissociate } from './mix';
export { anhydrousOf } from './solubility';

const MODEL_NOTE = 'Salts are taken as fully dissolved and dissociated; weak acids and bases are treated as undissociated; activities are not modelled.';
const NOMINAL_NOTE =
  'The ions and ionic strength above are nominal (salts fully dissociated, weak acids undissociated); pH, species and saturation are from the equilibrium, with activities.';

/**
 * Analyse a batch block's lines. Offsets in diagnostics are absolute (the lines carry their offsets);
 * `openLine` is the block's opening line, where findings about the whole batch go (the first line where
 * absent).
 */
export function analyseBatch(
  lines: BatchLine[],
  openName: string | null = null,
  settings: ChemSettings = DEFAULT_CHEM_SETTINGS,
  openLine?: { start: number; end: number },
  context: BatchContext = {},
): BatchAnalysis {
  const read = readLines(lines, openName, settings, context);
  // Later, between reading and amounts: chem/names/ (an ingredient named instead of written as a formula)
  // and chem/reagents/ (liquids by volume with density and assay, stock dilutions, units per volume).
  const amounts = computeAmounts(read);
  const first = lines[0] ? { start: lines[0].start, end: lines[0].start + lines[0].text.length } : { start: 0, end: 0 };
  const solution = solutionStage(amounts, read.headers, settings, openLine ?? first);
  computeShares(amounts, read.headers);
  const mix = mixIons(amounts.counted, read.headers.volumeL);
  const checks = checkBatch(amounts, read.headers);
  // Bath upkeep (chem/upkeep): titre lines against the batch's targets, and the additions for the tank.
  const upkeep = read.titres.length || read.tankLine ? upkeepStage(read, amounts, openLine ?? first) : null;
  const safety = safetyStage(amounts, read.headers, solution, settings, openLine ?? first);
  return assemble(
    read.headers,
    amounts,
    solution,
    mix,
    checks,
    safety,
    [
      ...read.diagnostics,
      ...amounts.diagnostics,
      ...solution.diagnostics.filter((d) => !amounts.diagnostics.includes(d)),
      ...mix.diagnostics,
      ...checks.diagnostics,
      ...safety.diagnostics,
      ...(upkeep?.diagnostics ?? []),
    ],
    upkeep,
  );
}

/** The stages' data as the batch's result: one ingredient per counted line, the findings in text order. */
function assemble(
  headers: BatchHeaders,
  amounts: BatchAmounts,
  solution: SolutionStage,
  mix: BatchMix,
  checks: BatchChecks,
  safety: BatchSafety,
  diagnostics: BatchAnalysis['diagnostics'],
  upkeep: Upkeep | null,
): BatchAnalysis {
  const ingredients = amounts.counted.map((c, k): Ingredient => {
    const { line } = c;
    const d = mix.dissociations[k];
    const solubility = checks.solubility[k];
    // One object shape, the optional fields assigned after: no object spreads in this loop (a hot one).
    const out: Ingredient = {
      formulaText: line.formula.text,
      formula: line.analysis.display,
      analysis: line.analysis,
      lineStart: line.lineStart,
      lineEnd: line.lineEnd,
      formulaStart: line.formula.start,
      formulaEnd: line.formula.end,
      amount: c.amount,
      assay: line.assay,
      molarMass: c.molarMass,
      moles: c.moles,
      massG: c.massG,
      concentrationM: c.concentrationM,
      massFraction: c.massFraction,
      fractionOfTotal: c.fractionOfTotal,
      ions: d.ions,
      cautions: checks.cautions[k],
      measure: c.measure,
      volumeML: c.volumeML,
      via: line.via,
      notes: c.notes,
      handling: c.handling,
    };
    if (d.undissociated) out.undissociated = d.undissociated;
    if (solubility) out.solubility = solubility;
    if (c.solvedFor) out.solvedFor = c.solvedFor;
    if (c.buffer) out.buffer = c.buffer;
    if (line.name) out.name = line.name;
    if (line.shelf) {
      const e = line.shelf;
      const shelf: NonNullable<Ingredient['shelf']> = { label: e.label, substance: e.substance.text };
      if (e.assayPercent !== undefined) shelf.assayPercent = e.assayPercent;
      if (e.densityGPerML !== undefined) shelf.densityGPerML = e.densityGPerML;
      if (e.lot) shelf.lot = e.lot;
      if (e.supplier) shelf.supplier = e.supplier;
      out.shelf = shelf;
    }
    if (c.density) out.density = c.density;
    if (c.basis) out.basis = c.basis;
    if (line.stock) out.stock = line.stock.text;
    return out;
  });
  const notes = [solution.solution ? NOMINAL_NOTE : MODEL_NOTE];
  if (headers.volumeL === null && ingredients.length) notes.push('No final volume given: concentrations, ionic strength and pH are not computed.');
  else if (!solution.solution && solution.noSolution) notes.push(`No equilibrium: ${solution.noSolution}.`);
  const lazy = typeof solution.solution === 'function' ? solution.solution : null;
  diagnostics.sort((x, y) => x.start - y.start);
  const { name, volumeL, totalMassG } = headers;
  const { ions, ionicStrengthM, netChargeEqPerL } = mix;
  const out: BatchAnalysis = {
    name,
    volumeL,
    totalMassG,
    ingredients,
    skipped: amounts.skipped,
    ions,
    ionicStrengthM,
    netChargeEqPerL,
    waterG: checks.waterG,
    diagnostics,
    cautions: checks.batchCautions,
    notes,
    temperatureC: headers.temperatureC,
    statedPH: headers.pH?.value ?? null,
    solution: lazy ? null : (solution.solution as BatchSolution | null),
    hazards: safety.hazards,
    heat: typeof safety.heat === 'function' ? null : safety.heat,
    ...(solution.noSolution ? { noSolution: solution.noSolution } : {}),
  };
  if (upkeep) out.upkeep = upkeep;
  if (typeof safety.heat === 'function') lazyProperty(out, 'heat', safety.heat);
  if (lazy) lazyProperty(out, 'solution', lazy);
  return out;
}

/** A property of the analysis made on first read, then kept (an analysis is shared and read-only otherwise). */
function lazyProperty<K extends 'heat' | 'solution'>(out: BatchAnalysis, key: K, make: () => BatchAnalysis[K]): void {
  let made = false;
  let value: BatchAnalysis[K];
  Object.defineProperty(out, key, {
    enumerable: true,
    configurable: true,
    get: () => {
      if (!made) {
        value = make();
        made = true;
      }
      return value;
    },
  });
}

/** The upkeep of a batch: its titres against the counted lines' concentrations, and the tank's additions. */
function upkeepStage(read: ReadBatch, amounts: BatchAmounts, at: { start: number; end: number }): Upkeep {
  const targets = [];
  for (const c of amounts.counted) {
    // A line solved for the pH or designed as a buffer has no concentration of its own to keep.
    if (c.concentrationM === null || !(c.concentrationM > 0) || c.buffer || c.solvedFor) continue;
    targets.push({ formula: c.line.analysis.ascii, targetM: c.concentrationM, assay: c.line.assay, start: c.line.lineStart, end: c.line.lineEnd });
  }
  return analyseUpkeep({ titreLines: read.titres, tankLine: read.tankLine, targets, at });
}
