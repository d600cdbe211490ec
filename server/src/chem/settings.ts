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
}

/** The default of `phTolerance` (common practice for a pH specification of a made-up bath). */
export const DEFAULT_PH_TOLERANCE = 0.3;

export const DEFAULT_CHEM_SETTINGS: ChemSettings = Object.freeze({
  nonpolarBelow: 0.4,
  ionicAbove: 1.8,
  latticePreference: 'best',
  phTolerance: DEFAULT_PH_TOLERANCE,
});
