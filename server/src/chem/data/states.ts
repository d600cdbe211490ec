/**
 * Oxidation states of metals as a formula reader needs them, beyond the data set's lists (./generated.ts,
 * from pymatgen: "common", "other known" and "ICSD-observed" states).
 *
 * Sources: N. N. Greenwood & A. Earnshaw, Chemistry of the Elements, 2nd ed. (1997), the chapters on these
 * elements; IUPAC Red Book 2005 for the compounds named. Recalled, not read from the book at hand: FROM
 * MEMORY. Each list names the compounds that justify it.
 */

/**
 * Usual states added to the data set's "common" ones (cost 0 when a formula is read): states a chemist
 * meets every day and that pymatgen lists only as ICSD-observed or "other".
 * Mn(III) (Mn2O3, Mn3O4, MnF3, manganese(III) acetate), Cr(II) (CrCl2), Cu(I) (CuCl, Cu2O, CuCN),
 * V(II–IV) (VCl2, V2O3, VO2, VOSO4), Ti(III) (TiCl3, Ti2O3), Au(I) (AuCl, [Au(CN)2]⁻), Pt(II, IV) and
 * Pd(II) (PtCl2, PtCl4, PdCl2), Ni(III) only in oxides (LiNiO2, NiO(OH)), Ag(I), Hg(I, II), Sn(II, IV),
 * Pb(II, IV), Ce(III, IV), Eu(II, III), Rh(III), Ir(III, IV), Ru(III, IV), Os(IV, VIII), Mo(IV, VI),
 * W(IV, VI), U(IV, VI), Tl(I, III), In(I, III), Sb(III, V), Bi(III).
 */
export const USUAL_EXTRA: Record<string, number[]> = {
  Mn: [3], Cr: [2], Cu: [1], V: [2, 3, 4], Ti: [3], Au: [1], Co: [3], Ni: [3], Ag: [1], Hg: [1],
  Pt: [2, 4], Pd: [2], Os: [8], Ru: [8], In: [1], Sb: [3, 5],
};

/**
 * States of metals in simple salts of polyatomic anions and of chloride, bromide, iodide (sulfates,
 * nitrates, perchlorates, acetates, halides, cyanides…): the states the metal shows in such salts. A
 * salt formula that balances only with another state (Ni(SO4)2 with Ni⁴⁺, Cu(NO3)3 with Cu³⁺) is a
 * mis-written formula, not a high-valent salt. Fluorides are read with the wider usual set (the high
 * states are fluorides: UF6, CrF5, AgF2), oxides and chalcogenides too (MnO2, CrO2, Fe3O4).
 * Elements not listed keep their usual states.
 * Justifying salts: Ti(II–IV) TiCl2, TiCl3, TiCl4, Ti(SO4)2, TiOSO4; Zr(III, IV) ZrCl3, ZrCl4, Zr(SO4)2;
 * Hf(IV) HfCl4; V(II–V) VSO4, VCl3, VCl4, VOCl3; Nb(III–V), Ta(III–V) NbCl5, TaCl5; Cr(II, III) CrCl2,
 * Cr2(SO4)3, Cr(NO3)3; Mo(II–V) MoCl2–MoCl5; W(II–VI) WCl2–WCl6; Mn(II, III) MnSO4, MnCl2, Mn(CH3COO)3,
 * MnF3; Re(III–VI) ReCl3, ReCl5, ReCl6; Fe(II, III) FeSO4, Fe2(SO4)3, FeCl3; Ru(III, IV) RuCl3;
 * Os(III, IV) OsCl3, OsCl4; Co(II, III) CoSO4, CoF3, Co2(SO4)3·18H2O, Co(CH3COO)3; Rh(III) RhCl3,
 * Rh2(SO4)3; Ir(III, IV) IrCl3, IrCl4; Ni(II) NiSO4, NiCl2, Ni(NO3)2; Pd(II) PdCl2, Pd(NO3)2, PdSO4;
 * Pt(II, IV) PtCl2, PtCl4; Cu(I, II) CuCl, CuCN, CuSO4; Ag(I) AgNO3; Au(I, III) AuCl, AuCN, AuCl3;
 * Zn, Cd(II); Hg(I, II) Hg2Cl2, HgCl2; Al, Ga(III); In(I, III) InCl, In2(SO4)3; Tl(I, III) TlCl, TlCl3;
 * Ge(II, IV) GeCl2, GeCl4; Sn(II, IV) SnSO4, SnCl4; Pb(II, IV) Pb(NO3)2, Pb(CH3COO)4, PbCl4;
 * Sb(III, V) SbCl3, SbCl5; Bi(III) Bi(NO3)3; Ce(III, IV) CeCl3, Ce(SO4)2; Eu, Sm, Yb(II, III) EuCl2,
 * SmI2, YbCl2; Th(IV); U(III–VI) UCl3, UCl4, UCl5, UCl6; Sc, Y, La and the other lanthanides (III).
 */
export const SALT_STATES: Record<string, number[]> = {
  Sc: [3], Y: [3], La: [3], Ti: [4, 3, 2], Zr: [4, 3], Hf: [4], V: [3, 2, 4, 5], Nb: [5, 3, 4], Ta: [5, 3, 4],
  Cr: [3, 2], Mo: [5, 3, 4, 2], W: [6, 4, 5, 2], Mn: [2, 3], Re: [3, 4, 5, 6], Fe: [2, 3], Ru: [3, 4], Os: [3, 4],
  Co: [2, 3], Rh: [3], Ir: [3, 4], Ni: [2], Pd: [2], Pt: [2, 4], Cu: [2, 1], Ag: [1], Au: [3, 1], Zn: [2], Cd: [2],
  Hg: [2, 1], Al: [3], Ga: [3], In: [3, 1], Tl: [1, 3], Ge: [4, 2], Sn: [2, 4], Pb: [2, 4], Sb: [3, 5], Bi: [3],
  Ce: [3, 4], Pr: [3], Nd: [3], Sm: [3, 2], Eu: [3, 2], Gd: [3], Tb: [3], Dy: [3], Ho: [3], Er: [3], Tm: [3],
  Yb: [3, 2], Lu: [3], Th: [4], U: [4, 6, 3, 5],
};

/** The states a metal shows in simple salts, or undefined where the table has no entry. */
export function saltStates(symbol: string): number[] | undefined {
  return SALT_STATES[symbol];
}
