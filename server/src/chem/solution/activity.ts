/**
 * Activity coefficients and temperature.
 *
 * Davies equation: log10 γ = −A z² (√I / (1 + √I) − 0.3 I), for ions in water up to I ≈ 0.5 M (Davies,
 * Ion Association, 1962); neutral species γ = 1. A from the Debye–Hückel limiting law,
 * A = 1.82483×10⁶ √ρ / (ε T)^{3/2} (molar scale), with the relative permittivity of water from Malmberg &
 * Maryott, J. Res. NBS 56 (1956) 1 (ε = 87.740 − 0.40008 t + 9.398×10⁻⁴ t² − 1.410×10⁻⁶ t³, t in °C) and
 * the density of water from the Kell (1975) fit: A = 0.5108 at 25 °C, as in the Bates–Guggenheim
 * convention of the IUPAC pH scale.
 *
 * Above I = 0.5 M the Davies curve is outside its range (the model says so); above 1 M it turns up
 * steeply for multiply charged ions, so the coefficients are held at their I = 1 M values there, which
 * keeps the solver stable and the figures rough but bounded.
 *
 * Van 't Hoff: log K(T) = log K(25 °C) − ΔH° / (R ln 10) · (1/T − 1/298.15 K), with ΔH° constant.
 */
export const T25 = 298.15;
const R = 8.314462618e-3; // kJ/(mol·K)
export const LN10 = Math.LN10;

/** The ionic strength above which the Davies equation is outside its range. */
export const DAVIES_LIMIT_M = 0.5;
/** The ionic strength at which the coefficients are held above it (see the header). */
export const DAVIES_CAP_M = 1;

/** Relative permittivity of water at t °C (Malmberg & Maryott 1956). */
export function permittivity(tC: number): number {
  return 87.74 - 0.40008 * tC + 9.398e-4 * tC * tC - 1.41e-6 * tC * tC * tC;
}

/** Density of water at t °C, g/cm³ (Kell 1975). */
export function waterDensity(tC: number): number {
  const t = tC;
  return (
    (999.83952 + 16.945176 * t - 7.9870401e-3 * t * t - 46.170461e-6 * t ** 3 + 105.56302e-9 * t ** 4 - 280.54253e-12 * t ** 5) / (1 + 16.87985e-3 * t) / 1000
  );
}

/** The Debye–Hückel A constant (molar scale) at t °C. */
export function debyeHuckelA(tC: number): number {
  const T = tC + 273.15;
  return (1.82483e6 * Math.sqrt(waterDensity(tC))) / Math.pow(permittivity(tC) * T, 1.5);
}

/** The Davies bracket √I/(1+√I) − 0.3 I times A: log10 γ = −z² × this. */
export function daviesFactor(I: number, A: number): number {
  const i = Math.min(Math.max(I, 0), DAVIES_CAP_M);
  const s = Math.sqrt(i);
  return A * (s / (1 + s) - 0.3 * i);
}

/** d(daviesFactor)/dI (0 above the cap, where the coefficients are held). */
export function daviesSlope(I: number, A: number): number {
  if (I >= DAVIES_CAP_M) return 0;
  const s = Math.sqrt(Math.max(I, 1e-12));
  return A * (1 / (2 * s * (1 + s) * (1 + s)) - 0.3);
}

/** log10 γ of an ion of charge z by Davies. */
export const daviesLogGamma = (z: number, I: number, A: number) => -z * z * daviesFactor(I, A);

/** log K at T (kelvin) from its 25 °C value and ΔH° (kJ/mol) by van 't Hoff. */
export function vantHoff(logK25: number, dH: number, T: number): number {
  return logK25 - (dH / (R * LN10)) * (1 / T - 1 / T25);
}
