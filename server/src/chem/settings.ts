/** Settings the chemistry core reads. The editor maps its configuration onto these. */
export interface ChemSettings {
  /** ΔEN below this is nonpolar covalent (common practice: 0.4). */
  nonpolarBelow: number;
  /** ΔEN above this is ionic (common practice: 1.8; some texts use 1.7 or 2.0). */
  ionicAbove: number;
  /** Which lattice-energy method to show first when several apply. */
  latticePreference: 'best' | 'kapustinskii' | 'born-lande' | 'born-mayer' | 'born-haber';
  /** A batch's computed pH may differ from its `pH:` header by this much before a warning (pH units; 0.3 when absent). */
  phTolerance?: number;
  /** A batch's estimated |ΔT| of making up may reach this before a `batch-heat` warning (K; 15 when absent). */
  heatThresholdK?: number;
}

/** The default of `phTolerance` (common practice for a pH specification of a made-up bath). */
export const DEFAULT_PH_TOLERANCE = 0.3;

/** The default of `heatThresholdK` (common practice: a batch that warms by more than about 15 K is made up with care). */
export const DEFAULT_HEAT_THRESHOLD_K = 15;

export const DEFAULT_CHEM_SETTINGS: ChemSettings = Object.freeze({
  nonpolarBelow: 0.4,
  ionicAbove: 1.8,
  latticePreference: 'best',
  phTolerance: DEFAULT_PH_TOLERANCE,
  heatThresholdK: DEFAULT_HEAT_THRESHOLD_K,
});
