/**
 * The batch as the safety reading sees it: each ingredient's pure and anhydrous mass, the water it brings
 * (a reagent supplied as an aqueous solution, a hydrate), the batch's water and mass, and its pH.
 *
 * The water of a batch with a final volume V is estimated as 0.997 g/mL × (V − Σ vᵢ), vᵢ the volume each
 * dissolved substance takes up: liquids by their density, ionic solids 0.3 mL/g and molecular solids
 * 0.62 mL/g (apparent volumes in water: NaCl 0.28, Na2SO4 0.08, sucrose and glucose 0.62, urea 0.73 mL/g;
 * an estimate, common practice). Without a volume, the water is what the lines list (H2O lines, the water
 * of aqueous reagents and hydrates); none means a dry blend.
 */
import { acidBaseShare, solveParts, type Part } from './ph';
import { reactiveGroups, type GroupMember } from './groups';
import { mainPart, type MainPart } from './substance';
import type { SafetyBatch, SafetyIngredient } from './types';
import type { FormulaAnalysis } from '../analyse';

export const WATER_MOLAR_MASS = 18.015;
const WATER_DENSITY = 0.997;
const IONIC_SOLID_ML_PER_G = 0.3;
const MOLECULAR_SOLID_ML_PER_G = 0.62;

/** Liquid reagents by Hill formula: density of the pure liquid (g/mL), heat capacity (J/(g·K)), and whether what is not the substance is water. */
export interface LiquidProps {
  density: number;
  cp: number;
  /** The reagent is sold as a solution in water (what is not the substance is water). */
  aqueous: boolean;
}

/**
 * Densities and heat capacities of pure liquids at 20–25 °C (CRC Handbook, "Physical constants of organic
 * compounds" and "Heat capacity of liquids"; from memory). HCl and NH3 are gases: their density is the
 * apparent one in solution (about 18 and 24 mL/mol).
 */
export const LIQUIDS: Readonly<Record<string, LiquidProps>> = Object.freeze({
  H2O4S: { density: 1.83, cp: 1.42, aqueous: true },
  HNO3: { density: 1.51, cp: 1.74, aqueous: true },
  ClH: { density: 2.0, cp: 0.8, aqueous: true },
  BrH: { density: 2.2, cp: 0.5, aqueous: true },
  ClHO4: { density: 1.77, cp: 1.2, aqueous: true },
  H3O4P: { density: 1.87, cp: 1.2, aqueous: true },
  FH: { density: 1.0, cp: 2.3, aqueous: true },
  C2H4O2: { density: 1.05, cp: 2.05, aqueous: true },
  CH2O2: { density: 1.22, cp: 2.15, aqueous: true },
  C3H6O3: { density: 1.21, cp: 2.3, aqueous: true },
  CH2O: { density: 1.09, cp: 2.0, aqueous: true },
  H2O2: { density: 1.45, cp: 2.6, aqueous: true },
  H3N: { density: 0.7, cp: 4.7, aqueous: true },
  H4N2: { density: 1.0, cp: 3.1, aqueous: true },
  ClNaO: { density: 2.0, cp: 1.0, aqueous: true },
  CH4O: { density: 0.792, cp: 2.53, aqueous: false },
  C2H6O: { density: 0.789, cp: 2.44, aqueous: false },
  C3H8O: { density: 0.786, cp: 2.6, aqueous: false },
  C3H6O: { density: 0.784, cp: 2.16, aqueous: false },
  C3H8O3: { density: 1.26, cp: 2.43, aqueous: false },
  C2H6O2: { density: 1.11, cp: 2.41, aqueous: false },
  C3H8O2: { density: 1.036, cp: 2.5, aqueous: false },
  C2H7NO: { density: 1.01, cp: 2.7, aqueous: false },
  C6H15NO3: { density: 1.12, cp: 2.3, aqueous: false },
  C4H11NO2: { density: 1.09, cp: 2.4, aqueous: false },
});

/** Hydroxides sold both as solids and as solutions: what is not the substance is water only below 90 % assay. */
const CAUSTICS = new Set(['HNaO', 'HKO']);

export interface IngredientState {
  index: number;
  ing: SafetyIngredient;
  main: MainPart | null;
  members: GroupMember[];
  /** Typeset formula. */
  display: string;
  /** Moles of the substance; null where not known. */
  moles: number | null;
  /** Grams of the substance as its formula reads (hydrate water included). */
  pureG: number | null;
  /** Grams of its main part alone (without the hydrate water). */
  anhydrousG: number | null;
  /** Grams of the reagent as supplied. */
  reagentG: number | null;
  /** Grams of water the reagent brings with it (solution water and hydrate water). */
  waterG: number;
  /** Supplied as a solution in water. */
  aqueousReagent: boolean;
  /** A water line (H2O). */
  isWater: boolean;
  liquid?: LiquidProps;
}

export interface BatchState {
  items: IngredientState[];
  volumeL: number | null;
  /** Grams of water in the batch; null for a dry blend or where the estimate failed. */
  waterG: number | null;
  /** How the water was found. */
  waterFrom: 'given' | 'volume' | 'lines' | 'none';
  /** Estimated mass of the batch, g. */
  massG: number | null;
  aqueous: boolean;
  /** The batch's pH: the solution chemistry's, or (computed on first use) the estimate here; null for a dry blend. */
  readonly pH: { value: number; from: 'solution' | 'estimate' } | null;
  /** The pH if it was given or has been estimated by now (the reading reports only what it used). */
  pHIfUsed(): { value: number; from: 'solution' | 'estimate' } | null;
  notes: string[];
}

export function batchState(batch: SafetyBatch): BatchState {
  const notes: string[] = [];
  const items = batch.ingredients.map((ing, index) => ingredientState(ing, index));
  const volumeL = batch.volumeL && batch.volumeL > 0 ? batch.volumeL : null;
  let waterG: number | null = null;
  let waterFrom: BatchState['waterFrom'] = 'none';
  if (batch.waterG != null && batch.waterG >= 0) {
    waterG = batch.waterG;
    waterFrom = 'given';
  } else if (volumeL) {
    let taken = 0;
    for (const it of items) if (!it.isWater && it.anhydrousG !== null) taken += it.anhydrousG * specificVolume(it);
    const w = WATER_DENSITY * (volumeL * 1000 - taken);
    if (w > 0) {
      waterG = w;
      waterFrom = 'volume';
    } else notes.push('The dissolved substances take up more than the final volume: the batch water could not be estimated.');
  } else {
    let w = 0;
    for (const it of items) w += it.isWater ? (it.reagentG ?? 0) : it.waterG;
    if (w > 0) {
      waterG = w;
      waterFrom = 'lines';
    }
  }
  let massG: number | null;
  if (waterG !== null) {
    massG = waterG;
    for (const it of items) if (!it.isWater) massG += it.anhydrousG ?? 0;
  } else {
    let m = 0;
    for (const it of items) m += it.reagentG ?? 0;
    massG = m > 0 ? m : null;
  }
  // A batch with a final volume is a solution, even where its water could not be estimated.
  const aqueous = volumeL !== null || (waterG !== null && waterG > 0);
  // The given pH and the estimate are read only when something asks for them (an acid-sensitive pair, a
  // neutralisation): the caller's pH may be a getter over an equilibrium solved on first read.
  const given = (): BatchState['pH'] => {
    const pH = batch.pH;
    return pH != null && Number.isFinite(pH) ? { value: pH, from: 'solution' as const } : null;
  };
  let estimate: BatchState['pH'] | undefined;
  const state: BatchState = {
    items,
    volumeL,
    waterG,
    waterFrom,
    massG,
    aqueous,
    get pH() {
      if (estimate === undefined) estimate = given() ?? (aqueous ? estimatePH(items, estimateVolumeL(volumeL, waterG)) : null);
      return estimate;
    },
    pHIfUsed: () => estimate ?? null,
    notes,
  };
  return state;
}

function estimatePH(items: readonly IngredientState[], v: number | null): BatchState['pH'] {
  if (!v) return null;
  const parts: Part[] = [];
  for (const it of items) {
    if (it.isWater) continue;
    const share = acidBaseShare(it.ing.analysis);
    if (!share.active) continue;
    // An acid or base of unknown amount (a line not counted) leaves the pH unknown: the pair alone decides.
    if (it.moles === null) return null;
    parts.push({ share, moles: it.moles });
  }
  const value = parts.length ? solveParts(parts, v) : 7;
  return value === null ? null : { value, from: 'estimate' };
}

/** The volume to take concentrations over: the final volume, or the water's. */
export function estimateVolumeL(volumeL: number | null, waterG: number | null): number | null {
  return volumeL ?? (waterG ? waterG / (1000 * WATER_DENSITY) : null);
}

function specificVolume(it: IngredientState): number {
  if (it.liquid) return 1 / it.liquid.density;
  return it.ing.analysis.charges?.basis === 'ionic' ? IONIC_SOLID_ML_PER_G : MOLECULAR_SOLID_ML_PER_G;
}

/** What an ingredient's state needs of its analysis alone, once per analysis (analyses are shared and read-only). */
interface Static {
  main: MainPart | null;
  members: GroupMember[];
  isWater: boolean;
  liquid: LiquidProps | undefined;
  caustic: boolean;
}
const statics = new WeakMap<FormulaAnalysis, Static>();

function staticOf(a: FormulaAnalysis): Static {
  let s = statics.get(a);
  if (!s) {
    const main = mainPart(a);
    s = {
      main,
      members: reactiveGroups(a),
      isWater: !!main && main.hill === 'H2O' && main.adducts.length === 0 && a.charge === 0,
      liquid: main && !main.water && a.charge === 0 ? LIQUIDS[main.hill] : undefined,
      caustic: !!main && CAUSTICS.has(main.hill) && !main.water,
    };
    statics.set(a, s);
  }
  return s;
}

function ingredientState(ing: SafetyIngredient, index: number): IngredientState {
  const a = ing.analysis;
  const st = staticOf(a);
  const { main, isWater, liquid } = st;
  const members = ing.name ? reactiveGroups(a, ing.name) : st.members;
  const M = a.molarMass?.value ?? null;
  const assay = ing.assay && ing.assay > 0 && ing.assay <= 1 ? ing.assay : 1;
  let moles = ing.moles !== null && Number.isFinite(ing.moles) && ing.moles >= 0 ? ing.moles : null;
  let reagentG = ing.massG !== null && Number.isFinite(ing.massG) && ing.massG >= 0 ? ing.massG : null;
  if (moles === null && reagentG !== null && M) moles = (reagentG * assay) / M;
  const pureG = moles !== null && M ? moles * M : reagentG !== null ? reagentG * assay : null;
  if (reagentG === null && pureG !== null) reagentG = pureG / assay;
  const aqueousReagent = assay < 1 && (st.caustic ? assay <= 0.9 : (liquid?.aqueous ?? false) || (ing.volumeML != null && ing.volumeML > 0));
  const hydrateG = main && moles !== null ? moles * main.water * WATER_MOLAR_MASS : 0;
  const solutionWater = aqueousReagent && reagentG !== null && pureG !== null ? Math.max(0, reagentG - pureG) : 0;
  const anhydrousG = pureG === null ? null : Math.max(0, pureG - hydrateG);
  return {
    index,
    ing,
    main,
    members,
    display: a.display,
    moles,
    pureG,
    anhydrousG,
    reagentG,
    waterG: hydrateG + solutionWater,
    aqueousReagent,
    isWater,
    liquid,
  };
}
