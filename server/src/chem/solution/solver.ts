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
import { daviesFactor, daviesSlope, DAVIES_LIMIT_M, debyeHuckelA, LN10 } from './activity';
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
  /** Largest scaled residual accepted (default 1e-13: the balances to rounding). */
  tolerance?: number;
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
/** Loosest tolerance a caller may ask for. */
const LOOSEST = 1e-6;
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
  solidCoupling: Float64Array;
  Y: Float64Array;
  Y2: Float64Array;
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
    this.solidCoupling = new Float64Array(nsolid * nc);
    this.Y = new Float64Array(nc);
    this.Y2 = new Float64Array(nc);
  }
}

/** One scratch space, grown as needed (a solve does not re-enter itself): no allocation per solve. */
let scratch = new Work(64, 16, 16);
function workFor(ns: number, nc: number, nsolid: number): Work {
  const w = scratch;
  if (w.c.length < ns || w.X2.length < nc || w.p2.length < nsolid || w.R.length < nc + nsolid)
    scratch = new Work(Math.max(ns, w.c.length), Math.max(nc, w.X2.length), Math.max(nsolid, w.p2.length));
  return scratch;
}

/** Species concentrations from X at the coefficients in `w.lg` (logC and c). */
function species(sys: TableauSystem, X: Float64Array, w: Work): void {
  const { ns, nc, logK, rowPtr, col, val } = sys;
  const lg = w.lg;
  const Y = w.Y;
  for (let j = 0; j < nc; j++) Y[j] = X[j] + lg[j];
  for (let i = 0; i < ns; i++) {
    let s = logK[i] - lg[i];
    for (let k = rowPtr[i], e = rowPtr[i + 1]; k < e; k++) s += val[k] * Y[col[k]];
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
  const { ns, nc, rowPtr, col, val } = sys;
  const R = w.R;
  const S = w.S;
  for (let j = 0; j < nc; j++) {
    R[j] = -T[j];
    S[j] = Math.abs(T[j]);
  }
  for (let i = 0; i < ns; i++) {
    const c = w.c[i];
    for (let k = rowPtr[i], e = rowPtr[i + 1]; k < e; k++) {
      const v = val[k] * c;
      R[col[k]] += v;
      S[col[k]] += Math.abs(v);
    }
  }
  for (let k = 0; k < active.length; k++) {
    const b = sys.solids[active[k]].b;
    for (let j = 0; j < nc; j++)
      if (b[j] !== 0) {
        R[j] += b[j] * p[k];
        S[j] += Math.abs(b[j] * p[k]);
      }
  }
  let worst = 0;
  for (let j = u0; j < nc; j++) {
    if (!(S[j] > 1e-300)) S[j] = 1e-300;
    const e = Math.abs(R[j]) / S[j];
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
function newtonStep(sys: TableauSystem, X: Float64Array, w: Work, u0: number, active: readonly number[], fPrime: number): boolean {
  const { ns, nc } = sys;
  const nu = nc - u0;
  const n = nu + active.length;
  const M = w.M;
  M.fill(0, 0, n * n);
  const { rowPtr, col, val } = sys;
  for (let i = 0; i < ns; i++) {
    const ci = w.c[i] * LN10;
    if (ci === 0) continue;
    const e = rowPtr[i + 1];
    for (let k = rowPtr[i]; k < e; k++) {
      const a = col[k];
      if (a < u0) continue;
      const f = val[k] * ci;
      for (let l = k; l < e; l++) {
        const b = col[l];
        M[(a - u0) * n + (b - u0)] += f * val[l];
      }
    }
  }
  for (let a = 0; a < nu; a++) for (let b = 0; b < a; b++) M[a * n + b] = M[b * n + a];
  if (fPrime !== 0) couple(sys, w, u0, active, fPrime, n);
  // Scale the component block to unit diagonal: y = D^½ ΔX.
  const d = w.S; // reuse: scales per unknown component (S is recomputed by residuals before it is read again)
  for (let a = 0; a < nu; a++) d[a] = 1 / Math.sqrt(Math.max(M[a * n + a], 1e-300));
  for (let a = 0; a < nu; a++) for (let b = 0; b < nu; b++) M[a * n + b] *= d[a] * d[b];
  for (let k = 0; k < active.length; k++) {
    const bv = sys.solids[active[k]].b;
    for (let a = 0; a < nu; a++) {
      const v = bv[a + u0] * d[a];
      M[a * n + nu + k] = v;
      M[(nu + k) * n + a] = v + (fPrime !== 0 ? w.solidCoupling[k * nu + a] * d[a] : 0);
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

/**
 * The activity coefficients' part of the Jacobian (near the solution): with the Davies factor f(I),
 * log γ_i = −z_i² f, so ∂ log c_i/∂I = −f′ s_i (s_i = Σ_j a_ij z_j² − z_i²) and I = ½ Σ z_i² c_i depends on X
 * through every c_i: dI/dX_k = ½ ln10 Σ_i z_i² a_ik c_i / (1 − ½ Σ_i z_i² ∂c_i/∂I). The mass balances gain
 * u_j · dI/dX_k (u_j = Σ_i a_ij ∂c_i/∂I), the solids' rows w_s · dI/dX_k (w_s = −f′ Σ_j b_sj z_j²): Newton
 * converges quadratically with the coefficients instead of at the rate of their fixed-point iteration.
 */
function couple(sys: TableauSystem, w: Work, u0: number, active: readonly number[], fPrime: number, n: number): void {
  const { ns, nc, z2, zShift } = sys;
  const M = w.M;
  const nu = nc - u0;
  let selfTerm = 0;
  const u = w.X2; // scratch (the line search writes X2 only after the step is solved)
  u.fill(0);
  const v = w.rhs;
  v.fill(0, 0, nu);
  const { rowPtr, col, val } = sys;
  for (let i = 0; i < ns; i++) {
    const c = w.c[i];
    if (c === 0) continue;
    const dcdI = -c * LN10 * fPrime * zShift[i];
    selfTerm += 0.5 * z2[i] * dcdI;
    for (let k = rowPtr[i], e = rowPtr[i + 1]; k < e; k++) {
      const j = col[k];
      if (j < u0) continue;
      u[j] += val[k] * dcdI;
      v[j - u0] += 0.5 * LN10 * z2[i] * val[k] * c;
    }
  }
  const denom = 1 - selfTerm;
  if (!(Math.abs(denom) > 1e-12)) return;
  for (let b = 0; b < nu; b++) v[b] /= denom;
  for (let a = 0; a < nu; a++) {
    const ua = u[a + u0];
    if (ua === 0) continue;
    for (let b = 0; b < nu; b++) M[a * n + b] += ua * v[b];
  }
  for (let k = 0; k < active.length; k++) {
    const bv = sys.solids[active[k]].b;
    let ws = 0;
    for (let j = 0; j < nc; j++) ws += bv[j] * z2[j];
    ws *= -fPrime;
    // The solid rows are filled after scaling (newtonStep); keep the unscaled coupling in place for it.
    for (let b = 0; b < nu; b++) w.solidCoupling[k * nu + b] = ws * v[b];
  }
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
  const { ns, nc, rowPtr, col, val } = sys;
  const sum = w.Y2;
  for (let round = 0; round < 4; round++) {
    species(sys, X, w);
    sum.fill(0, 0, nc);
    for (let i = 0; i < ns; i++) for (let k = rowPtr[i], e = rowPtr[i + 1]; k < e; k++) if (val[k] > 0) sum[col[k]] += val[k] * w.c[i];
    // The proton step from the same concentrations as the others' (one evaluation a round).
    for (let j = 1; j < nc; j++) if (T[j] > 0 && sum[j] > 0) X[j] += Math.log10(T[j] / sum[j]);
    if (u0 === 1) continue;
    let r = -T[0];
    let d = 0;
    for (let i = 0; i < ns; i++) {
      const k = rowPtr[i];
      if (k < rowPtr[i + 1] && col[k] === 0) {
        const a = val[k];
        r += a * w.c[i];
        d += a * a * w.c[i];
      }
    }
    const step = -r / (LN10 * Math.max(d, 1e-300));
    X[0] += Math.max(-2, Math.min(2, step));
  }
}

interface Opts {
  u0: number;
  davies: boolean;
  A: number;
  heldGamma: boolean;
  maxIterations: number;
  /** Scaled residual at which the iterations stop. */
  tol: number;
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
function iterate(sys: TableauSystem, T: Float64Array, X: Float64Array, p: Float64Array, active: readonly number[], w: Work, o: Opts): Inner {
  const { nc } = sys;
  const nu = nc - o.u0;
  let lastI = -1;
  let residual = Infinity;
  let previous = Infinity;
  // Once the residual grows from one step to the next, the coefficients and the concentrations are chasing
  // each other: the coefficients are then held until the mass balances are within 1 %.
  let hold = false;
  let holds = 0;
  // Whether w holds the species of X at the present coefficients (the line search's last try was taken).
  let fresh = false;
  /** Armijo backtracking on G along w.dX from X, halving from `alpha`: the step length taken. */
  const backtrack = (slope: number, alpha: number): number => {
    const g0 = objectiveNoTouch(sys, T, X, w, o.u0);
    for (let tries = 0; tries < 40; tries++) {
      for (let j = 0; j < nc; j++) w.X2[j] = X[j];
      for (let a = 0; a < nu; a++) w.X2[a + o.u0] += alpha * w.dX[a];
      const g = objective(sys, T, w.X2, w, o.u0);
      if (g <= g0 + 1e-4 * alpha * slope || !(slope < 0)) {
        fresh = true;
        return alpha;
      }
      alpha *= 0.5;
    }
    return alpha;
  };
  for (let it = 0; it < o.maxIterations; it++) {
    if (!fresh) species(sys, X, w);
    fresh = false;
    let moved = false;
    if (hold && previous < 1e-2) hold = false;
    if (o.davies && !o.heldGamma && !hold) {
      // The coefficients brought to the ionic strength of the species they give (a few rounds of the
      // fixed point at this X), so that Newton sees consistent residuals.
      // Newton on the one equation I = I(c(X, I)): quadratic where the plain fixed point converges only at
      // the rate ½ Σ z² ∂c/∂I.
      // Far from the solution one round is enough (the concentrations move more than γ does); near it, a few.
      const rounds = previous < 1e-3 ? 4 : 1;
      for (let round = 0; round < rounds; round++) {
        const I = ionicStrength(sys, w.c);
        // A relative change of 1e-10 in I moves log γ by less than 1e-10: the coefficients stand.
        if (Math.abs(I - lastI) <= 1e-10 * I + 1e-20) break;
        moved = true;
        let next = I;
        if (lastI > 0) {
          const fp = daviesSlope(lastI, o.A);
          let self = 0;
          for (let i = 0; i < sys.ns; i++) self -= 0.5 * sys.z2[i] * w.c[i] * LN10 * fp * sys.zShift[i];
          if (1 - self > 0.05) next = lastI + (I - lastI) / (1 - self);
          if (!(next > 0)) next = I;
        }
        lastI = next;
        setGamma(sys, next, o.A, w);
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
    if (q < 1e-11 && !moved && (residual < o.tol || (residual < ACCEPT && residual >= 0.5 * previous)))
      return { converged: true, iterations: it, residual, singular: false };
    if (residual > previous && it > 0 && o.davies && !o.heldGamma) {
      // The second time: a cycle of the coefficients; the nested iteration takes over (solveEquilibrium).
      if (++holds > 1) return { converged: false, iterations: it, residual, singular: false };
      hold = true;
    }
    previous = residual;
    // Within 0.1 % the step is Newton's on the whole system (coefficients included), taken in full; further
    // out it is the convex problem's at the present coefficients, with the line search.
    const near = residual < 1e-3;
    const fPrime = o.davies && !o.heldGamma && near ? daviesSlope(lastI, o.A) : 0;
    if (!newtonStep(sys, X, w, o.u0, active, fPrime)) return { converged: false, iterations: it, residual, singular: true };
    let big = 0;
    for (let a = 0; a < nu; a++) big = Math.max(big, Math.abs(w.dX[a]));
    let alpha = big > MAX_STEP ? MAX_STEP / big : 1;
    if (near) {
      // Near the solution Newton converges quadratically (and G changes by little more than its rounding):
      // the full step.
      for (let a = 0; a < nu; a++) X[a + o.u0] += alpha * w.dX[a];
      for (let k = 0; k < active.length; k++) p[k] += alpha * w.dX[nu + k];
    } else if (active.length === 0) {
      // Backtracking on G (Armijo): the residuals are its gradient.
      let slope = 0;
      for (let a = 0; a < nu; a++) slope += w.R[a + o.u0] * w.dX[a];
      alpha = backtrack(slope, alpha);
      for (let a = 0; a < nu; a++) X[a + o.u0] += alpha * w.dX[a];
    } else {
      // With solids: the same backtracking on G over the surface where the solids are saturated (the step
      // keeps to it, B ΔX = −Q): G's gradient is the mass balances without the solids' terms.
      let slope = 0;
      for (let a = 0; a < nu; a++) {
        let g = w.R[a + o.u0];
        for (let k = 0; k < active.length; k++) g -= sys.solids[active[k]].b[a + o.u0] * p[k];
        slope += g * w.dX[a];
      }
      alpha = backtrack(slope, alpha);
      for (let a = 0; a < nu; a++) X[a + o.u0] += alpha * w.dX[a];
      for (let k = 0; k < active.length; k++) p[k] += alpha * w.dX[nu + k];
    }
    if (it === o.maxIterations - 1) {
      species(sys, X, w);
      residual = residuals(sys, T, w, o.u0, active, p);
    }
  }
  return { converged: residual < Math.max(ACCEPT, o.tol), iterations: o.maxIterations, residual, singular: false };
}

/**
 * The fallback where the coefficients and the concentrations do not settle together (a cycle, at high ionic
 * strength or across the coefficients' cap): the mass balances solved at fixed coefficients (the convex
 * problem, which always converges), the ionic strength then moved by a safeguarded secant on
 * g(I) = I(c(I)) − I, bracketed as it goes.
 */
function iterateNested(sys: TableauSystem, T: Float64Array, X: Float64Array, p: Float64Array, active: readonly number[], w: Work, o: Opts): Inner {
  const held = { ...o, heldGamma: true, maxIterations: Math.min(100, o.maxIterations) };
  species(sys, X, w);
  let I = ionicStrength(sys, w.c);
  let lo = 0;
  let hi = Infinity;
  let prev: { I: number; g: number } | null = null;
  let iterations = 0;
  let last: Inner = { converged: false, iterations: 0, residual: Infinity, singular: false };
  for (let outer = 0; outer < 40; outer++) {
    setGamma(sys, I, o.A, w);
    last = iterate(sys, T, X, p, active, w, held);
    iterations += last.iterations;
    if (!last.converged) return { ...last, iterations };
    species(sys, X, w);
    const Ic = ionicStrength(sys, w.c);
    const g = Ic - I;
    if (Math.abs(g) <= 1e-10 * I + 1e-20) return { ...last, iterations };
    if (g > 0) lo = Math.max(lo, I);
    else hi = Math.min(hi, I);
    let next = Ic;
    if (prev && prev.g !== g) next = I - (g * (I - prev.I)) / (g - prev.g);
    if (!(next > lo && next < hi)) next = Number.isFinite(hi) ? 0.5 * (lo + hi) : Ic;
    prev = { I, g };
    I = next;
  }
  return { ...last, converged: false, iterations };
}

/** G at X without disturbing the species computed for X (they are recomputed by the caller's next step). */
function objectiveNoTouch(sys: TableauSystem, T: Float64Array, X: Float64Array, w: Work, u0: number): number {
  let g = 0;
  for (let i = 0; i < sys.ns; i++) g += w.c[i];
  g /= LN10;
  for (let j = u0; j < sys.nc; j++) g -= T[j] * X[j];
  return g;
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
  const w = workFor(sys.ns, sys.nc, sys.solids.length);
  const u0 = options.fixedPH === undefined ? 0 : 1;
  const heldGamma = options.logGamma !== undefined;
  if (options.logGamma) w.lg.set(options.logGamma);
  else w.lg.fill(0);
  const maxIterations = options.maxIterations ?? 200;
  const X = options.start ? Float64Array.from(options.start) : initialX(sys, T, undefined);
  // The pH held is of the activity: X_H = −pH − log γ(H⁺), brought up to date with γ.
  const hold = (x: Float64Array) => {
    if (options.fixedPH !== undefined) x[0] = -options.fixedPH - w.lg[0];
  };
  hold(X);
  const o: Opts = { u0, davies, A, heldGamma, maxIterations, tol: Math.min(LOOSEST, Math.max(TOL, options.tolerance ?? TOL)) };
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
  } else inner = iterate(sys, T, X, none, [], w, { ...o, maxIterations: Math.min(maxIterations, 40) });
  if (!inner.converged && davies && !heldGamma && !inner.singular) {
    const nested = iterateNested(sys, T, X, none, [], w, o);
    inner = { ...nested, iterations: inner.iterations + nested.iterations };
  }
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
    // The indices where the solids have come out (0 for those present).
    saturation(sys, X, w.lg, si);
  }
  species(sys, X, w);
  const I = ionicStrength(sys, w.c);
  const eq: Equilibrium = {
    system: sys,
    totals: T,
    converged,
    iterations,
    X,
    logC: w.logC.slice(0, sys.ns),
    logGamma: w.lg.slice(0, sys.ns),
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

/**
 * X moved the least distance onto the surface where the solids of `active` are saturated (B X = κ):
 * X −= Bᵀ (B Bᵀ)⁻¹ Q, over the unknown components. False where the solids cannot all be saturated at once.
 */
function project(sys: TableauSystem, X: Float64Array, lg: Float64Array, active: readonly number[], u0: number): boolean {
  const k = active.length;
  const BB = new Float64Array(k * k);
  const q = new Float64Array(k);
  for (let a = 0; a < k; a++) {
    const ba = sys.solids[active[a]];
    let v = -ba.logK;
    for (let j = 0; j < sys.nc; j++) if (ba.b[j] !== 0) v += ba.b[j] * (X[j] + lg[j]);
    q[a] = v;
    for (let b = 0; b < k; b++) {
      const bb = sys.solids[active[b]].b;
      let sum = 0;
      for (let j = u0; j < sys.nc; j++) sum += ba.b[j] * bb[j];
      BB[a * k + b] = sum;
    }
  }
  if (!gauss(BB, q, k)) return false;
  for (let j = u0; j < sys.nc; j++) {
    let d = 0;
    for (let a = 0; a < k; a++) d += sys.solids[active[a]].b[j] * q[a];
    X[j] -= d;
  }
  return true;
}

/** The active-set loop: solids added while oversaturated, dropped when their amount turns negative. */
function precipitateSolids(
  sys: TableauSystem,
  T: Float64Array,
  X: Float64Array,
  w: Work,
  o: Opts,
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
  const lg0 = w.lg.slice(0, sys.ns);
  for (let pass = 0; pass < 12; pass++) {
    // The most oversaturated solid not yet present joins.
    let best = -1;
    for (let k = 0; k < sys.solids.length; k++) if (!active.includes(k) && !refused.has(k) && si[k] > 1e-9 && (best < 0 || si[k] > si[best])) best = k;
    if (best < 0) break;
    const trial = [...active, best];
    const p = new Float64Array(trial.length);
    amounts.forEach((v, k) => (p[k] = v));
    const Xt = Float64Array.from(X);
    if (!project(sys, Xt, w.lg, trial, o.u0)) {
      refused.add(best);
      continue;
    }
    let r = iterate(sys, T, Xt, p, trial, w, { ...o, maxIterations: Math.min(o.maxIterations, 40) });
    if (!r.converged && !r.singular && o.davies && !o.heldGamma) {
      const nested = iterateNested(sys, T, Xt, p, trial, w, o);
      r = { ...nested, iterations: r.iterations + nested.iterations };
    }
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
  return { converged: residual < Math.max(ACCEPT, o.tol), iterations, residual, precipitates: active.map((solid, k) => ({ solid, molPerL: amounts[k] })) };
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
