/**
 * Reagents as supplied: liquids by volume and assay with their densities, amounts per volume and the
 * other units, dilution from a stock, another form of an ingredient, scaling a batch, and the shelf.
 * Pure functions over numbers, formula analyses (chem/analyse.ts) and text; plain data out, with
 * `findings` (./findings.ts) for what was assumed or is missing.
 *
 * How a batch line calls them (integration note for the batch reader, chem/batch/read.ts → amounts.ts):
 *
 * 1. The substance. If the line's first token does not parse as a formula, call
 *    `nameAtStart(lineText)` (chem/names): status `exact` gives `formula` (analyse it) and `end` (where
 *    the amount starts); `ambiguous` / `near` / `unknown` skip the line with `message` as the reason (a
 *    near name is never taken). `solution` set (bleach, muriatic acid) means the line needs `@ <assay>`.
 *    A shelf label first: `labelAtStart(shelf, lineText)` (the shelf from `parseShelf(body, offset)`)
 *    gives the entry (formula, assay, density, lot) and where the label ends.
 * 2. The amount. Units of chem/batch/units.ts stay there. For any other unit, `reagentUnit(text)` says
 *    whether it is a reagent unit; then
 *      `amountIn({ value, unit, analysis, batch: { volumeL, totalMassG, solventMassG, aqueous },
 *                  role, assayPercent, densityGPerML })`
 *    returns `{ moles, massG, volumeML?, density?, basis, findings }` (g/L, mg/L, %w/v, %v/v, ppm, ppb,
 *    mol/kg, N with role `acid|base|redox|ion`, and mL, L, µL: a liquid poured as supplied).
 * 3. A target with an assay (`HCl 0.5 M @ 37%`): moles from the target as now, then
 *    `volumeFor(analysis, moles, assayPercent, labelDensity)` → `volumeML` (the contract's `volumeML`),
 *    `massG` of the substance, `solutionMassG`, `density.text` (the density used and its source),
 *    `cautions` (the handling lines of concentrated acids and bases) and `findings`.
 *    A volume of a liquid (`H2SO4 10 mL @ 96%`): `pour(analysis, 10, 96)` (or `amountIn` with unit mL).
 * 4. A dilution (`NiSO4 0.1 M from 1.5 M`, or `from batch "Acid stock"` with that batch's concentration):
 *    `dilution({ value: 0.1, unit: 'M' }, { value: 1.5, unit: 'M' }, volumeL, molarMass)` →
 *    `stockVolumeML` (the line's `volumeML`), `moles`, `basis`.
 * 5. Quick fixes and commands (not the reader): `substituteForm(from, to, massG, { fromAssayPercent,
 *    toAssayPercent, keep })` for another form; `scaleBatch(lines, from, to)` with `roundMass` /
 *    `roundVolume` for a new size.
 * Findings map to diagnostics on the line (suggested codes: `reagent-assay-needed` for assay-needed,
 * `reagent-unknown-liquid`, `reagent-basis-missing`, `reagent-dilution-impossible`, `batch-ppm-basis`,
 * `shelf-syntax`, `shelf-substance`; the `information` ones belong in the hover, not the problems list).
 * A name read exactly may carry `lookalikes` (sodium chlorite: not the chloride or the chlorate): show
 * them in the line's hover. Cards take `namesOf(analysis)` (chem/names) for the trade's name beside the
 * systematic one.
 * Cost: bench/names-reagents.ts reads a 10,000-line sheet by names and liquids against the batch
 * reading of the same sheet by formulas (about 1.25× with the names and densities read on top).
 */
export { AQUEOUS, AQUEOUS_SOLVENTS, PURE_LIQUIDS, WATER_20C, type DensityTable, type PureLiquid } from './densities';
export {
  densityAt,
  handlingCautions,
  liquidName,
  liquidOf,
  pour,
  reagentDensity,
  reagentMolarity,
  volumeFor,
  type DensityReading,
  type LiquidMatch,
  type Poured,
} from './liquids';
export { amountIn, reagentUnit, REAGENT_UNITS, type AmountRequest, type BatchBasis, type ReagentAmount, type ReagentUnit, type ReagentUnitKind } from './units';
export { equivalentsOf, type EquivalentRole, type Equivalents } from './equivalents';
export { dilution, type Concentration, type Dilution } from './dilution';
export { substituteForm, type FormChange } from './forms';
export { BALANCES, VOLUME_MEASURES, roundMass, roundVolume, scaleBatch, type Rounded, type ScaleLine, type Scaled, type ScaledLine } from './scale';
export { labelAtStart, parseShelf, shelfEntry, type Shelf, type ShelfEntry } from './shelf';
export type { ReagentFinding, ReagentFindingKind } from './findings';
