import { logGamma } from './distributions';

export interface PoissonGlmOptions {
  /** Prior weights per observation (default 1). */
  readonly weights?: ArrayLike<number>;
  /** Offset added to the linear predictor (log scale), e.g. log(exposure). */
  readonly offset?: ArrayLike<number>;
  /** Relative change of deviance that ends the iterations (default 1e-10). */
  readonly tolerance?: number;
  /** Iteration limit (default 50). */
  readonly maxIterations?: number;
}

export interface PoissonGlmFit {
  /** Coefficients on the log scale, one per column of X. */
  readonly coefficients: Float64Array;
  /** Standard errors from the inverse Fisher information (dispersion 1). */
  readonly standardErrors: Float64Array;
  /** Fitted means. */
  readonly fitted: Float64Array;
  /** Residual deviance 2 sum w (y log(y/mu) - (y - mu)). */
  readonly deviance: number;
  /** Deviance of the intercept-only model (with the same weights and offset). */
  readonly nullDeviance: number;
  /** n - p and n - 1 (n = observations with positive weight). */
  readonly dfResidual: number;
  readonly dfNull: number;
  /** Pearson chi-square sum w (y - mu)^2 / mu; its ratio to dfResidual estimates overdispersion. */
  readonly pearsonChi2: number;
  /** Log-likelihood sum w (y log mu - mu - log y!) and AIC = -2 logLik + 2 p. */
  readonly logLik: number;
  readonly aic: number;
  readonly iterations: number;
  readonly converged: boolean;
}

/**
 * Poisson regression with log link, fitted by iteratively reweighted least
 * squares (Fisher scoring; McCullagh & Nelder 1989, section 2.5): start at
 * mu = y + 0.1, then repeat: working response z = eta - offset + (y - mu)/mu,
 * weights w mu, solve (X'WX) b = X'Wz by Cholesky, until the deviance changes
 * by less than tolerance * (|dev| + 0.1).
 *
 * X is row-major (n rows, p columns) and should contain an intercept column
 * (the null deviance assumes one). Units: coefficients are log-rate changes
 * per unit of each column. Edge cases: a singular X'WX (collinear columns, or
 * all-zero counts) gives NaN coefficients and converged = false.
 * Reference: Dobson (1990) An Introduction to Generalized Linear Models,
 * p. 93 example (coefficients, standard errors, deviances, AIC as published).
 */
export function poissonGlm(X: ArrayLike<number>, p: number, y: ArrayLike<number>, options: PoissonGlmOptions = {}): PoissonGlmFit {
  const n = y.length;
  const w = options.weights;
  const off = options.offset;
  const tol = options.tolerance ?? 1e-10;
  const maxIt = options.maxIterations ?? 50;
  const mu = new Float64Array(n);
  const eta = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    mu[i] = y[i] + 0.1;
    eta[i] = Math.log(mu[i]);
  }
  const beta = new Float64Array(p).fill(NaN);
  const xtwx = new Float64Array(p * p);
  const xtwz = new Float64Array(p);
  let dev = deviance(y, mu, w);
  let converged = false;
  let it = 0;
  let chol: Float64Array | null = null;
  for (it = 1; it <= maxIt; it++) {
    xtwx.fill(0);
    xtwz.fill(0);
    for (let i = 0; i < n; i++) {
      const wi = (w ? w[i] : 1) * mu[i];
      if (!(wi > 0)) continue;
      const z = eta[i] - (off ? off[i] : 0) + (y[i] - mu[i]) / mu[i];
      const row = i * p;
      for (let a = 0; a < p; a++) {
        const xa = X[row + a] * wi;
        xtwz[a] += xa * z;
        for (let b = 0; b <= a; b++) xtwx[a * p + b] += xa * X[row + b];
      }
    }
    chol = cholesky(xtwx, p);
    if (!chol) break;
    const b = choleskySolve(chol, p, xtwz);
    for (let a = 0; a < p; a++) beta[a] = b[a];
    for (let i = 0; i < n; i++) {
      let e = off ? off[i] : 0;
      const row = i * p;
      for (let a = 0; a < p; a++) e += X[row + a] * beta[a];
      eta[i] = e;
      mu[i] = Math.exp(e);
    }
    const devNew = deviance(y, mu, w);
    if (Math.abs(devNew - dev) / (Math.abs(devNew) + 0.1) < tol) {
      dev = devNew;
      converged = true;
      break;
    }
    dev = devNew;
  }
  const se = new Float64Array(p).fill(NaN);
  if (chol && converged) {
    // Information at the final fit.
    xtwx.fill(0);
    for (let i = 0; i < n; i++) {
      const wi = (w ? w[i] : 1) * mu[i];
      if (!(wi > 0)) continue;
      const row = i * p;
      for (let a = 0; a < p; a++) for (let b = 0; b <= a; b++) xtwx[a * p + b] += X[row + a] * wi * X[row + b];
    }
    const c = cholesky(xtwx, p);
    if (c) {
      const e = new Float64Array(p);
      for (let a = 0; a < p; a++) {
        e.fill(0);
        e[a] = 1;
        se[a] = Math.sqrt(choleskySolve(c, p, e)[a]);
      }
    }
  } else {
    beta.fill(NaN);
  }
  // Null model: intercept only with the same offset has a closed form.
  let sy = 0;
  let se0 = 0;
  let nObs = 0;
  for (let i = 0; i < n; i++) {
    const wi = w ? w[i] : 1;
    if (!(wi > 0)) continue;
    nObs++;
    sy += wi * y[i];
    se0 += wi * Math.exp(off ? off[i] : 0);
  }
  const mu0 = new Float64Array(n);
  const scale = sy / se0;
  for (let i = 0; i < n; i++) mu0[i] = scale * Math.exp(off ? off[i] : 0);
  let pearson = 0;
  let ll = 0;
  for (let i = 0; i < n; i++) {
    const wi = w ? w[i] : 1;
    if (!(wi > 0)) continue;
    const r = y[i] - mu[i];
    pearson += (wi * r * r) / mu[i];
    ll += wi * ((y[i] > 0 ? y[i] * Math.log(mu[i]) : 0) - mu[i] - logGamma(y[i] + 1));
  }
  return {
    coefficients: beta,
    standardErrors: se,
    fitted: mu,
    deviance: converged ? dev : NaN,
    nullDeviance: deviance(y, mu0, w),
    dfResidual: nObs - p,
    dfNull: nObs - 1,
    pearsonChi2: converged ? pearson : NaN,
    logLik: converged ? ll : NaN,
    aic: converged ? -2 * ll + 2 * p : NaN,
    iterations: it,
    converged,
  };
}

function deviance(y: ArrayLike<number>, mu: ArrayLike<number>, w: ArrayLike<number> | undefined): number {
  let d = 0;
  for (let i = 0; i < y.length; i++) {
    const wi = w ? w[i] : 1;
    if (!(wi > 0)) continue;
    const yi = y[i];
    d += wi * ((yi > 0 ? yi * Math.log(yi / mu[i]) : 0) - (yi - mu[i]));
  }
  return 2 * d;
}

/** Lower Cholesky factor of a symmetric positive-definite matrix given by its lower triangle; null if not SPD. */
function cholesky(a: Float64Array, p: number): Float64Array | null {
  const l = new Float64Array(p * p);
  for (let i = 0; i < p; i++) {
    for (let j = 0; j <= i; j++) {
      let s = a[i * p + j];
      for (let k = 0; k < j; k++) s -= l[i * p + k] * l[j * p + k];
      if (i === j) {
        if (!(s > 1e-12 * Math.abs(a[i * p + i])) || !(s > 0)) return null;
        l[i * p + i] = Math.sqrt(s);
      } else {
        l[i * p + j] = s / l[j * p + j];
      }
    }
  }
  return l;
}

function choleskySolve(l: Float64Array, p: number, b: ArrayLike<number>): Float64Array {
  const x = new Float64Array(p);
  for (let i = 0; i < p; i++) {
    let s = b[i];
    for (let k = 0; k < i; k++) s -= l[i * p + k] * x[k];
    x[i] = s / l[i * p + i];
  }
  for (let i = p - 1; i >= 0; i--) {
    let s = x[i];
    for (let k = i + 1; k < p; k++) s -= l[k * p + i] * x[k];
    x[i] = s / l[i * p + i];
  }
  return x;
}
