/** Settings the chemistry core reads. The editor maps its configuration onto these. */
export interface ChemSettings {
  /** ΔEN below this is nonpolar covalent (common practice: 0.4). */
  nonpolarBelow: number;
  /** ΔEN above this is ionic (common practice: 1.8; some texts use 1.7 or 2.0). */
  ionicAbove: number;
  /** Which lattice-energy method to show first when several apply. */
  latticePreference: 'best' | 'kapustinskii' | 'born-lande' | 'born-mayer' | 'born-haber';
}

export const DEFAULT_CHEM_SETTINGS: ChemSettings = Object.freeze({
  nonpolarBelow: 0.4,
  ionicAbove: 1.8,
  latticePreference: 'best',
});
