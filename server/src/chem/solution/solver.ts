/**
 * The speciation solver: the tableau formulation of aquatic chemistry (Morel & Hering, Principles and
 * Applications of Aquatic Chemistry, 1993, ch. 2; the method of MINEQL and its successors).
 *
 * Unknowns: X_j = log10 of the free concentration of each component j (H⁺ is component 0). Each species
 * i has log c_i = log K_i + Σ_j a_ij (X_j + log γ_j) − log γ_i. Equations: the mass balance of every
 * component, R_j = Σ_i a_ij c_i − T_j = 0; for H⁺ that is the proton condition relative to the components
 * (TOTH), which with electroneutral inputs is the charge balance. At fixed activity coefficients the
 * R_j are the gradient of the strictly convex G(X) = Σ_i c_i / ln 10 − Σ_j T_j X_j, whose Hessian is the
 * Jacobian J_jk = ln 10 Σ_i a_ij a_ik c_i: Newton–Raphson with a backtracking line search on G (step
 * damping) converges from any start. The activity coefficients (Davies, from the ionic strength of the
 * current species) are brought up to date at every iteration; the solution is the fixed point where the
 * mass balances hold and the ionic strength no longer moves.
 *
 * Solids (the precipitation problem) are the same minimisation under the constraints SI_s ≤ 0: an
 * active-set method adds the most oversaturated solid, solves the Karush–Kuhn–Tucker system (mass
 * balances with the solid amounts p_s, and SI_s = 0 for the solids present) by Newton, drops a solid whose
 * amount comes out negative, and repeats.
 *
 * A fixed pH (the species distribution over pH) takes H⁺ out of the unknowns.
 *
 * Bounded: at most `maxIterations` Newton steps per solve and 12 changes of the set of solids; a solve
 * that does not meet the tolerance says so (`converged: false`).
 */
import { daviesFactor, DAVIES_LIMIT_M, debyeHuckelA, LN10 } from './activity';
import type { TableauSystem } from './system';

export interface SolveOptions {
  /** Activity model: Davies (default) or ideal (γ = 1: the textbook arithmetic). */
  activity?: 'davies' | 'ideal';
  /** Hold −log10 a(H⁺) at this value instead of solving the proton condition. */
  fixedPH?: number;
  /** Let oversaturated solids come out (the amounts at equilibrium). */
  precipitate?: boolean;
  /** A start (log10 free concentrations) from a nearby solve. */
  start?: Float64Array;
  /** Hold the activity coefficients at these (per species, log10) instead of computing them. */
  logGamma?: Float64Array;
  maxIterations?: number;
}

export interface Precipitate {
  /** Index into system.solids. */
  solid: number;
  /** mol per litre of solution. */
  molPerL: number;
}

export interface Equilibrium {
  system: TableauSystem;
  totals: Float64Array;
  converged: boolean;
  iterations: number;
  /** log10 free concentrations of the components. */
  X: Float64Array;
  /** log10 concentration and log10 activity coefficient of each species. */
  logC: Float64Array;
  logGamma: Float64Array;
  /** Ionic strength of the species, M. */
  I: number;
  /** −log10 a(H⁺). */
  pH: number;
  /** log10 (IAP / K) of each solid of the system. */
  si: Float64Array;
  /** Solids present at equilibrium (only with `precipitate`). */
  precipitates: Precipitate[];
  /** Largest scaled residual of the mass balances at the end. */
  residual: number;
  activity: 'davies' | 'ideal';
  /** The Davies equation was used above its range (I > 0.5 M). */
  outOfRange: boolean;
}

const TOL = 1e-13;
const ACCEPT = 1e-10;
const MAX_STEP = 4;

/** Scratch space for one solve (no allocation inside the iterations). */
class Work {
  c: Float64Array;
  logC: Float64Array;
  lg: Float64Array;
  R: Float64Array;
  S: Float64Array;
  M: Float64Array;
  rhs: Float64Array;
  X2: Float64Array;
  dX: Float64Array;
  p2: Float64Array;
  constructor(ns: number, nc: number, nsolid: number) {
    const n = nc + nsolid;
    this.c = new Float64Array(ns);
    this.logC = new Float64Array(ns);
    this.lg = new Float64Array(ns);
    this.R = new Float64Array(n);
    this.S = new Float64Array(n);
    this.M = new Float64Array(n * n);
    this.rhs = new Float64Array(n);
    this.X2 = new Float64Array(nc);
    this.dX = new Float64Array(n);
    this.p2 = new Float64Array(nsolid);
  }
}

/** Species concentrations from X at the coefficients in `w.lg` (logC and c). */
function species(sys: TableauSystem, X: Float64Array, w: Work): void {
  const { ns, nc, A, logK } = sys;
  const lg = w.lg;
  for (let i = 0; i < ns; i++) {
    let s = logK[i] - lg[i];
    const row = i * nc;
    for (let j = 0; j < nc; j++) {
      const a = A[row + j];
      if (a !== 0) s += a * (X[j] + lg[j]);
    }
    // Beyond 10^±300 the number is no concentration; clamp so that sums stay finite.
    if (s > 300) s = 300;
    else if (s < -300) s = -300;
    w.logC[i] = s;
    w.c[i] = Math.exp(LN10 * s);
  }
}

function ionicStrength(sys: TableauSystem, c: Float64Array): number {
  let I = 0;
  for (let i = 0; i < sys.ns; i++) I += c[i] * sys.z2[i];
  return 0.5 * I;
}

/** Davies coefficients for ionic strength I into w.lg; returns whether they moved. */
function setGamma(sys: TableauSystem, I: number, A: number, w: Work): void {
  const f = daviesFactor(I, A);
  for (let i = 0; i < sys.ns; i++) w.lg[i] = -sys.z2[i] * f;
}

/**
 * Mass-balance residuals over the unknown components (from index `u0`) with the solids present, and
 * their scales; the largest scaled residual.
 */
function residuals(sys: TableauSystem, T: Float64Array, w: Work, u0: number, active: readonly number[], p: Float64Array): number {
  const { ns, nc, A } = sys;
  let worst = 0;
  for (let j = u0; j < nc; j++) {
    let r = -T[j];
    let s = Math.abs(T[j]);
    for (let i = 0; i < ns; i++) {
      const a = A[i * nc + j];
      if (a !== 0) {
        const v = a * w.c[i];
        r += v;
        s += Math.abs(v);
      }
    }
    for (let k = 0; k < active.length; k++) {
      const b = sys.solids[active[k]].b[j];
      if (b !== 0) {
        r += b * p[k];
        s += Math.abs(b * p[k]);
      }
    }
    w.R[j] = r;
    w.S[j] = s > 1e-300 ? s : 1e-300;
    const e = Math.abs(r) / w.S[j];
    if (e > worst) worst = e;
  }
  return worst;
}

/** G(X) at the coefficients in w.lg, over the unknown components (species computed into w). */
function objective(sys: TableauSystem, T: Float64Array, X: Float64Array, w: Work, u0: number): number {
  species(sys, X, w);
  let g = 0;
  for (let i = 0; i < sys.ns; i++) g += w.c[i];
  g /= LN10;
  for (let j = u0; j < sys.nc; j++) g -= T[j] * X[j];
  return g;
}

/** Solve M x = rhs in place (Gaussian elimination, partial pivoting); false where M is singular. */
function gauss(M: Float64Array, rhs: Float64Array, n: number): boolean {
  for (let k = 0; k < n; k++) {
    let piv = k;
    let best = Math.abs(M[k * n + k]);
    for (let r = k + 1; r < n; r++) {
      const v = Math.abs(M[r * n + k]);
      if (v > best) {
        best = v;
        piv = r;
      }
    }
    if (!(best > 1e-14)) return false;
    if (piv !== k) {
      for (let c = 0; c < n; c++) {
        const t = M[k * n + c];
        M[k * n + c] = M[piv * n + c];
        M[piv * n + c] = t;
      }
      const t = rhs[k];
      rhs[k] = rhs[piv];
      rhs[piv] = t;
    }
    const d = M[k * n + k];
    for (let r = k + 1; r < n; r++) {
      const f = M[r * n + k] / d;
      if (f === 0) continue;
      for (let c = k; c < n; c++) M[r * n + c] -= f * M[k * n + c];
      rhs[r] -= f * rhs[k];
    }
  }
  for (let k = n - 1; k >= 0; k--) {
    let s = rhs[k];
    for (let c = k + 1; c < n; c++) s -= M[k * n + c] * rhs[c];
    rhs[k] = s / M[k * n + k];
  }
  return true;
}

/**
 * The Newton step over the unknowns (components from u0, then the active solids), symmetrically scaled by
 * the Jacobian's diagonal; into w.dX. False where the system is singular (solids that cannot coexist).
 */
function newtonStep(sys: TableauSystem, X: Float64Array, w: Work, u0: number, active: readonly number[]): boolean {
  const { ns, nc, A } = sys;
  const nu = nc - u0;
  const n = nu + active.length;
  const M = w.M;
  M.fill(0, 0, n * n);
  for (let i = 0; i < ns; i++) {
    const ci = w.c[i] * LN10;
    if (ci === 0) continue;
    const row = i * nc;
    for (let a = u0; a < nc; a++) {
      const aa = A[row + a];
      if (aa === 0) continue;
      const f = aa * ci;
      for (let b = a; b < nc; b++) {
        const ab = A[row + b];
        if (ab !== 0) M[(a - u0) * n + (b - u0)] += f * ab;
      }
    }
  }
  for (let a = 0; a < nu; a++) for (let b = 0; b < a; b++) M[a * n + b] = M[b * n + a];
  // Scale the component block to unit diagonal: y = D^½ ΔX.
  const d = w.S; // reuse: scales per unknown component (S is recomputed by residuals before it is read again)
  for (let a = 0; a < nu; a++) d[a] = 1 / Math.sqrt(Math.max(M[a * n + a], 1e-300));
  for (let a = 0; a < nu; a++) for (let b = 0; b < nu; b++) M[a * n + b] *= d[a] * d[b];
  for (let k = 0; k < active.length; k++) {
    const bv = sys.solids[active[k]].b;
    for (let a = 0; a < nu; a++) {
      const v = bv[a + u0] * d[a];
      M[a * n + nu + k] = v;
      M[(nu + k) * n + a] = v;
    }
  }
  for (let a = 0; a < nu; a++) w.rhs[a] = -w.R[a + u0] * d[a];
  for (let k = 0; k < active.length; k++) {
    const s = sys.solids[active[k]];
    let q = -s.logK;
    for (let j = 0; j < nc; j++) if (s.b[j] !== 0) q += s.b[j] * (X[j] + w.lg[j]);
    w.rhs[nu + k] = -q;
  }
  if (!gauss(M, w.rhs, n)) return false;
  for (let a = 0; a < nu; a++) w.dX[a] = w.rhs[a] * d[a];
  for (let k = 0; k < active.length; k++) w.dX[nu + k] = w.rhs[nu + k];
  return true;
}

/** A start: every component free at its total, H⁺ at pH 7 (or the pH held). */
function initialX(sys: TableauSystem, T: Float64Array, fixedLogH: number | undefined): Float64Array {
  const X = new Float64Array(sys.nc);
  X[0] = fixedLogH ?? -7;
  for (let j = 1; j < sys.nc; j++) X[j] = T[j] > 0 ? Math.log10(T[j]) : -30;
  return X;
}

/**
 * A start for Newton: a few rounds of the continued-fraction update of the components with positive
 * totals (X_j += log10(T_j / Σ_i a_ij c_i), which keeps every concentration in proportion; Morel &
 * Hering's "positive continued fraction"), each followed by a one-dimensional Newton step on the proton
 * condition. From "every component free at its total" a strong complexant (ammonia and nickel, EDTA)
 * would otherwise start Newton many decades from the answer.
 */
function warmUp(sys: TableauSystem, T: Float64Array, X: Float64Array, w: Work, u0: number): void {
  const { ns, nc, A } = sys;
  for (let round = 0; round < 6; round++) {
    species(sys, X, w);
    for (let j = 1; j < nc; j++) {
      if (!(T[j] > 0)) continue;
      let sum = 0;
      for (let i = 0; i < ns; i++) {
        const a = A[i * nc + j];
        if (a > 0) sum += a * w.c[i];
      }
      if (sum > 0) X[j] += Math.log10(T[j] / sum);
    }
    if (u0 === 1) continue;
    species(sys, X, w);
    let r = -T[0];
    let d = 0;
    for (let i = 0; i < ns; i++) {
      const a = A[i * nc];
      if (a !== 0) {
        r += a * w.c[i];
        d += a * a * w.c[i];
      }
    }
    const step = -r / (LN10 * Math.max(d, 1e-300));
    X[0] += Math.max(-2, Math.min(2, step));
  }
}

interface Inner {
  converged: boolean;
  iterations: number;
  residual: number;
  singular: boolean;
}

/**
 * Newton iterations for the unknowns with the solids in `active` present (amounts `p`), the activity
 * coefficients brought up to date each step (unless held). X and p are updated in place.
 */
function iterate(
  sys: TableauSystem,
  T: Float64Array,
  X: Float64Array,
  p: Float64Array,
  active: readonly number[],
  w: Work,
  o: { u0: number; davies: boolean; A: number; heldGamma: boolean; maxIterations: number },
): Inner {
  const { nc } = sys;
  const nu = nc - o.u0;
  let lastI = -1;
  let residual = Infinity;
  let previous = Infinity;
  for (let it = 0; it < o.maxIterations; it++) {
    species(sys, X, w);
    let moved = false;
    if (o.davies && !o.heldGamma) {
      const I = ionicStrength(sys, w.c);
      moved = !(Math.abs(I - lastI) <= 1e-12 * I + 1e-20);
      if (moved) {
        lastI = I;
        setGamma(sys, I, o.A, w);
        species(sys, X, w);
      }
    }
    residual = residuals(sys, T, w, o.u0, active, p);
    let q = 0;
    for (let k = 0; k < active.length; k++) {
      const s = sys.solids[active[k]];
      let v = -s.logK;
      for (let j = 0; j < nc; j++) if (s.b[j] !== 0) v += s.b[j] * (X[j] + w.lg[j]);
      q = Math.max(q, Math.abs(v));
    }
    // Converged: the tolerance met, or rounding reached below the acceptance level (no more progress).
    if (q < 1e-11 && !moved && (residual < TOL || (residual < ACCEPT && residual >= 0.5 * previous)))
      return { converged: true, iterations: it, residual, singular: false };
    previous = residual;
    if (!newtonStep(sys, X, w, o.u0, active)) return { converged: false, iterations: it, residual, singular: true };
    let big = 0;
    for (let a = 0; a < nu; a++) big = Math.max(big, Math.abs(w.dX[a]));
    let alpha = big > MAX_STEP ? MAX_STEP / big : 1;
    if (residual < 1e-6) {
      // Near the solution Newton converges quadratically, and G no longer changes by more than its rounding:
      // the full step.
      for (let a = 0; a < nu; a++) X[a + o.u0] += alpha * w.dX[a];
      for (let k = 0; k < active.length; k++) p[k] += alpha * w.dX[nu + k];
    } else if (active.length === 0) {
      // Backtracking on G (Armijo): the residuals are its gradient.
      let slope = 0;
      for (let a = 0; a < nu; a++) slope += w.R[a + o.u0] * w.dX[a];
      const g0 = objectiveNoTouch(sys, T, X, w, o.u0);
      for (let tries = 0; tries < 40; tries++) {
        for (let j = 0; j < nc; j++) w.X2[j] = X[j];
        for (let a = 0; a < nu; a++) w.X2[a + o.u0] += alpha * w.dX[a];
        const g = objective(sys, T, w.X2, w, o.u0);
        if (g <= g0 + 1e-4 * alpha * slope || !(slope < 0)) break;
        alpha *= 0.5;
      }
      for (let a = 0; a < nu; a++) X[a + o.u0] += alpha * w.dX[a];
    } else {
      // With solids: backtracking on the scaled residual norm.
      const phi0 = merit(sys, T, X, p, active, w, o.u0);
      for (let tries = 0; tries < 30; tries++) {
        for (let j = 0; j < nc; j++) w.X2[j] = X[j];
        for (let a = 0; a < nu; a++) w.X2[a + o.u0] += alpha * w.dX[a];
        for (let k = 0; k < active.length; k++) w.p2[k] = p[k] + alpha * w.dX[nu + k];
        if (merit(sys, T, w.X2, w.p2, active, w, o.u0) <= phi0 * (1 - 1e-4 * alpha)) break;
        alpha *= 0.5;
      }
      for (let a = 0; a < nu; a++) X[a + o.u0] += alpha * w.dX[a];
      for (let k = 0; k < active.length; k++) p[k] += alpha * w.dX[nu + k];
    }
    if (it === o.maxIterations - 1) {
      species(sys, X, w);
      residual = residuals(sys, T, w, o.u0, active, p);
    }
  }
  return { converged: residual < ACCEPT, iterations: o.maxIterations, residual, singular: false };
}

/** G at X without disturbing the species computed for X (they are recomputed by the caller's next step). */
function objectiveNoTouch(sys: TableauSystem, T: Float64Array, X: Float64Array, w: Work, u0: number): number {
  let g = 0;
  for (let i = 0; i < sys.ns; i++) g += w.c[i];
  g /= LN10;
  for (let j = u0; j < sys.nc; j++) g -= T[j] * X[j];
  return g;
}

function merit(sys: TableauSystem, T: Float64Array, X: Float64Array, p: Float64Array, active: readonly number[], w: Work, u0: number): number {
  species(sys, X, w);
  residuals(sys, T, w, u0, active, p);
  let phi = 0;
  for (let j = u0; j < sys.nc; j++) phi += (w.R[j] / w.S[j]) ** 2;
  for (let k = 0; k < active.length; k++) {
    const s = sys.solids[active[k]];
    let v = -s.logK;
    for (let j = 0; j < sys.nc; j++) if (s.b[j] !== 0) v += s.b[j] * (X[j] + w.lg[j]);
    phi += v * v;
  }
  return phi;
}

function saturation(sys: TableauSystem, X: Float64Array, lg: Float64Array, out: Float64Array): void {
  sys.solids.forEach((s, k) => {
    let v = -s.logK;
    for (let j = 0; j < sys.nc; j++) if (s.b[j] !== 0) v += s.b[j] * (X[j] + lg[j]);
    out[k] = v;
  });
}

/**
 * Solve the equilibrium of a system with component totals T (mol/L; T[0] is the proton condition's
 * total, TOTH). Never throws; says whether it converged.
 */
export function solveEquilibrium(sys: TableauSystem, T: Float64Array, options: SolveOptions = {}): Equilibrium {
  const activity = options.activity ?? 'davies';
  const davies = activity === 'davies';
  const A = debyeHuckelA(sys.T - 273.15);
  const w = new Work(sys.ns, sys.nc, sys.solids.length);
  const u0 = options.fixedPH === undefined ? 0 : 1;
  const heldGamma = options.logGamma !== undefined;
  if (options.logGamma) w.lg.set(options.logGamma);
  const maxIterations = options.maxIterations ?? 200;
  const X = options.start ? Float64Array.from(options.start) : initialX(sys, T, undefined);
  // The pH held is of the activity: X_H = −pH − log γ(H⁺), brought up to date with γ.
  const hold = (x: Float64Array) => {
    if (options.fixedPH !== undefined) x[0] = -options.fixedPH - w.lg[0];
  };
  hold(X);
  const o = { u0, davies, A, heldGamma, maxIterations };
  const none = new Float64Array(0);
  if (!options.start) warmUp(sys, T, X, w, u0);
  let inner: Inner;
  if (u0 === 1 && davies && !heldGamma) {
    // With the pH held, γ(H⁺) moves X_H: a few rounds until it stands still.
    inner = iterate(sys, T, X, none, [], w, o);
    for (let round = 0; round < 8; round++) {
      const before = X[0];
      hold(X);
      if (Math.abs(X[0] - before) < 1e-13) break;
      const again = iterate(sys, T, X, none, [], w, o);
      inner = { ...again, iterations: inner.iterations + again.iterations };
    }
  } else inner = iterate(sys, T, X, none, [], w, o);
  let iterations = inner.iterations;
  let converged = inner.converged;
  let residual = inner.residual;
  const si = new Float64Array(sys.solids.length);
  saturation(sys, X, w.lg, si);
  let precipitates: Precipitate[] = [];
  if (options.precipitate && converged && sys.solids.length) {
    const r = precipitateSolids(sys, T, X, w, o, si, residual);
    iterations += r.iterations;
    converged = r.converged;
    residual = r.residual;
    precipitates = r.precipitates;
    hold(X);
  }
  species(sys, X, w);
  const I = ionicStrength(sys, w.c);
  const eq: Equilibrium = {
    system: sys,
    totals: T,
    converged,
    iterations,
    X,
    logC: Float64Array.from(w.logC),
    logGamma: Float64Array.from(w.lg),
    I,
    pH: -(X[0] + w.lg[0]),
    si,
    precipitates,
    residual,
    activity,
    outOfRange: davies && I > DAVIES_LIMIT_M,
  };
  return eq;
}

/** The active-set loop: solids added while oversaturated, dropped when their amount turns negative. */
function precipitateSolids(
  sys: TableauSystem,
  T: Float64Array,
  X: Float64Array,
  w: Work,
  o: { u0: number; davies: boolean; A: number; heldGamma: boolean; maxIterations: number },
  homogeneousSI: Float64Array,
  homogeneousResidual: number,
): { converged: boolean; iterations: number; residual: number; precipitates: Precipitate[] } {
  const active: number[] = [];
  let amounts: number[] = [];
  const refused = new Set<number>();
  const si = Float64Array.from(homogeneousSI);
  let iterations = 0;
  let residual = homogeneousResidual;
  const X0 = Float64Array.from(X);
  const lg0 = Float64Array.from(w.lg);
  for (let pass = 0; pass < 12; pass++) {
    // The most oversaturated solid not yet present joins.
    let best = -1;
    for (let k = 0; k < sys.solids.length; k++) if (!active.includes(k) && !refused.has(k) && si[k] > 1e-9 && (best < 0 || si[k] > si[best])) best = k;
    if (best < 0) break;
    const trial = [...active, best];
    const p = new Float64Array(trial.length);
    amounts.forEach((v, k) => (p[k] = v));
    const Xt = Float64Array.from(X);
    const r = iterate(sys, T, Xt, p, trial, w, o);
    iterations += r.iterations;
    if (r.singular || !r.converged) {
      refused.add(best);
      continue;
    }
    // A solid whose amount came out negative leaves; the rest is solved again without it.
    let set = trial;
    let pv = Array.from(p);
    for (let drop = 0; drop < set.length && pv.some((v) => v < 0); drop++) {
      const worst = pv.indexOf(Math.min(...pv));
      set = set.filter((_, k) => k !== worst);
      pv = pv.filter((_, k) => k !== worst);
      const p2 = Float64Array.from(pv);
      const r2 = iterate(sys, T, Xt, p2, set, w, o);
      iterations += r2.iterations;
      pv = Array.from(p2);
      if (!r2.converged) break;
    }
    if (!set.includes(best)) refused.add(best);
    active.length = 0;
    active.push(...set);
    amounts = pv;
    X.set(Xt);
    species(sys, X, w);
    residual = residuals(sys, T, w, o.u0, active, Float64Array.from(amounts));
    saturation(sys, X, w.lg, si);
  }
  if (active.length === 0) {
    // Nothing stays out: back to the homogeneous solution (with its coefficients).
    X.set(X0);
    w.lg.set(lg0);
    residual = homogeneousResidual;
  }
  return { converged: residual < ACCEPT, iterations, residual, precipitates: active.map((solid, k) => ({ solid, molPerL: amounts[k] })) };
}

/**
 * Buffer capacity β = dC(base)/dpH at the solution, mol/(L·pH), from the Jacobian: adding strong base
 * lowers TOTH, and dX_H/dTOTH is the H⁺ entry of J⁻¹e_H (activity coefficients held; solids left out).
 * Null where the Jacobian is singular.
 */
export function bufferCapacity(eq: Equilibrium): number | null {
  const sys = eq.system;
  const { ns, nc, A } = sys;
  const M = new Float64Array(nc * nc);
  for (let i = 0; i < ns; i++) {
    const ci = Math.exp(LN10 * eq.logC[i]) * LN10;
    const row = i * nc;
    for (let a = 0; a < nc; a++) {
      const aa = A[row + a];
      if (aa === 0) continue;
      for (let b = 0; b < nc; b++) {
        const ab = A[row + b];
        if (ab !== 0) M[a * nc + b] += aa * ab * ci;
      }
    }
  }
  const d = new Float64Array(nc);
  for (let a = 0; a < nc; a++) d[a] = 1 / Math.sqrt(Math.max(M[a * nc + a], 1e-300));
  for (let a = 0; a < nc; a++) for (let b = 0; b < nc; b++) M[a * nc + b] *= d[a] * d[b];
  const rhs = new Float64Array(nc);
  rhs[0] = d[0];
  if (!gauss(M, rhs, nc)) return null;
  const dXdT = rhs[0] * d[0];
  return dXdT > 0 ? 1 / dXdT : null;
}
