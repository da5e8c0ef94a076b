import { PCA } from 'ml-pca';

/** Principal components of row-major data (see pcaScores). */
export interface PcaScores {
  /** Fraction of the total variance per component, largest first (all components). */
  readonly explainedVariance: number[];
  /** Scores of every row on the first nComponents components, row-major (n x nComponents). */
  scores(nComponents: number): Float64Array;
}

/**
 * Principal component analysis of n rows of `dim` values (row-major),
 * centred, not scaled, from the eigen-decomposition of the dim x dim
 * covariance matrix, as ml-pca 4.1.1 computes it with
 * PCA(rows, {center: true, scale: false, method: 'covarianceMatrix'}) and
 * predict(rows, {nComponents}) (library source read for the order of
 * operations), and with the same result to the last bit: column means
 * (sums in row order / n), centred values, covariance entries summed over
 * rows in order / (n - 1), the library's symmetric eigen-decomposition
 * (ml-pca, given the covariance), scores summed over the columns in order.
 * What differs is the cost: the covariance and the scores are computed on
 * flat typed arrays, and only the scores asked for (the library multiplies
 * by every eigenvector, dim times more work, through per-element calls).
 * Checked against ml-pca in test/core/stats/pca-scores.test.ts.
 *
 * Requires n >= 2 and dim >= 1.
 */
export function pcaScores(points: Float64Array, dim: number): PcaScores {
  const n = Math.floor(points.length / dim);
  const means = new Float64Array(dim);
  for (let i = 0; i < n; i++) for (let b = 0; b < dim; b++) means[b] += points[i * dim + b];
  for (let b = 0; b < dim; b++) means[b] /= n;
  const centred = new Float64Array(n * dim);
  for (let i = 0; i < n; i++) for (let b = 0; b < dim; b++) centred[i * dim + b] = points[i * dim + b] - means[b];
  // Covariance: column a against column b, summed over the rows in order, then / (n - 1).
  const column = new Float64Array(n);
  const cov: number[][] = Array.from({ length: dim }, () => new Array<number>(dim).fill(0));
  const columns: Float64Array[] = [];
  for (let a = 0; a < dim; a++) {
    const c = new Float64Array(n);
    for (let k = 0; k < n; k++) c[k] = centred[k * dim + a];
    columns.push(c);
  }
  for (let b = 0; b < dim; b++) {
    column.set(columns[b]);
    for (let a = 0; a < dim; a++) cov[a][b] = dot(columns[a], column, n) / (n - 1);
  }
  const pca = new PCA(cov, { isCovarianceMatrix: true });
  const U = pca.getEigenvectors();
  return {
    explainedVariance: pca.getExplainedVariance(),
    scores(nComponents: number): Float64Array {
      const out = new Float64Array(n * nComponents);
      const u = new Float64Array(dim);
      for (let j = 0; j < nComponents; j++) {
        for (let k = 0; k < dim; k++) u[k] = U.get(k, j);
        for (let i = 0; i < n; i++) {
          let s = 0;
          for (let k = 0; k < dim; k++) s += centred[i * dim + k] * u[k];
          out[i * nComponents + j] = s;
        }
      }
      return out;
    },
  };
}

/** Sum over k < n of x[k] * y[k], in order from 0 (a small function V8 optimises whole). */
function dot(x: Float64Array, y: Float64Array, n: number): number {
  let s = 0;
  for (let k = 0; k < n; k++) s += x[k] * y[k];
  return s;
}
