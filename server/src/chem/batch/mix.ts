/**
 * Stage 3 of a batch: the ions of the mix — each counted ingredient dissociated (ions/dissociation.ts),
 * the ions summed over the final volume, the ionic strength I = ½ Σ cᵢ zᵢ² and the net charge — and a
 * warning where ions listed on their own leave a net charge.
 *
 * Model: every salt is taken as fully dissolved and dissociated into the ions of its formula; the ions are
 * not protonated or deprotonated further. Strong acids give up their first proton (H2SO4 → H⁺ + HSO₄⁻).
 * Weak acids and bases and molecular substances stay undissociated. Activities are not modelled.
 */
import type { FormulaAnalysis } from '../analyse';
import { analysisDerivedCache } from '../cache';
import type { ChemDiagnostic } from '../diagnostic';
import { electrolyteIons, type IonShare } from '../ions/dissociation';
import type { CountedLine } from './amounts';
import type { BatchIon } from './types';

export interface Dissociation {
  ions: IonShare[];
  /** Why it is not split into ions, when it is not. */
  undissociated?: string;
}

export interface BatchMix {
  /** The dissociation of each counted line, in the same order. */
  dissociations: Dissociation[];
  ions: BatchIon[];
  ionicStrengthM: number | null;
  netChargeEqPerL: number | null;
  diagnostics: ChemDiagnostic[];
}

/**
 * Dissociations by formula text. What a formula gives in water depends on its reading alone, not on the
 * settings, and the text an analysis keeps is already a flat copy (analyse.ts), so it is the key.
 */
const dissociations = analysisDerivedCache<Dissociation>(50_000, 8 * 1024 * 1024);

/** Ions of a strong electrolyte, or why it stays whole (memoised by formula text; read-only). */
export function dissociate(a: FormulaAnalysis): Dissociation {
  let hit = dissociations.get(a.input);
  if (!hit) {
    hit = electrolyteIons(a);
    dissociations.set(a.input, hit, 96 + hit.ions.length * 160 + 2 * (hit.undissociated?.length ?? 0));
  }
  return hit;
}

/** The ions of the whole mix (stage 3); without a final volume there are no concentrations. */
export function mixIons(counted: readonly CountedLine[], volumeL: number | null): BatchMix {
  const dissociated = counted.map((c) => dissociate(c.line.analysis));
  const ionMap = new Map<string, BatchIon>();
  let listedCharge = 0;
  let listedAny = false;
  if (volumeL) {
    counted.forEach((c, k) => {
      const listed = c.line.analysis.charge !== 0;
      for (const ion of dissociated[k].ions) {
        const conc = (c.moles * ion.count) / volumeL;
        const at = ionMap.get(ion.key);
        if (at) at.concentrationM += conc;
        else ionMap.set(ion.key, { ion: ion.ion, key: ion.key, charge: ion.charge, concentrationM: conc });
        if (listed) {
          listedCharge += conc * ion.charge;
          listedAny = true;
        }
      }
    });
  }
  const ions = [...ionMap.values()];
  const diagnostics = listedAny ? listedChargeWarning(counted, ions, listedCharge) : [];
  return { dissociations: dissociated, ions, ...strengthAndCharge(ions, volumeL), diagnostics };
}

/** The ionic strength and the net charge of the mix (null without a volume). */
function strengthAndCharge(ions: readonly BatchIon[], volumeL: number | null): { ionicStrengthM: number | null; netChargeEqPerL: number | null } {
  const ionicStrengthM = volumeL ? 0.5 * ions.reduce((s, x) => s + x.concentrationM * x.charge * x.charge, 0) : null;
  const rawNet = volumeL ? ions.reduce((s, x) => s + x.concentrationM * x.charge, 0) : null;
  // Rounding noise of a neutral recipe is reported as the zero it is.
  const scale = ions.reduce((s, x) => s + Math.abs(x.concentrationM * x.charge), 0);
  const netChargeEqPerL = rawNet === null ? null : Math.abs(rawNet) <= 1e-9 * Math.max(scale, 1e-12) ? 0 : rawNet;
  return { ionicStrengthM, netChargeEqPerL };
}

/** A warning on the first ion listed on its own, where those ions do not balance. */
function listedChargeWarning(counted: readonly CountedLine[], ions: readonly BatchIon[], listedCharge: number): ChemDiagnostic[] {
  if (!(Math.abs(listedCharge) > 1e-9 * ions.reduce((m, x) => Math.max(m, x.concentrationM), 1))) return [];
  const first = counted.find((c) => c.line.analysis.charge !== 0);
  if (!first) return [];
  return [
    {
      code: 'batch-charge',
      severity: 'warning',
      start: first.line.lineStart,
      end: first.line.lineEnd,
      message: `The ions listed on their own leave a net charge of ${listedCharge > 0 ? '+' : ''}${listedCharge.toPrecision(3)} eq/L; add counter-ions or list the salts instead.`,
    },
  ];
}
