/**
 * Poisson GLM by IRLS. Source: Dobson (1990) An Introduction to Generalized
 * Linear Models, p. 93 (verified as reproduced in R's glm documentation;
 * REFERENCES.md). Published values have 4-7 significant digits, so the
 * tolerance is half a unit in the last published digit; the exact MLE of the
 * outcome effects (ln 21, ln(40/63), ln(47/63); computed) is checked to 1e-9.
 */
import { describe, expect, it } from 'vitest';
import { chiSquareSf, poissonGlm } from '../../../core/stats';
import { close } from '../../helpers/close';
import { loadFixture } from '../../helpers/fixtures';

const offsetCases = loadFixture<{ X: number[]; p: number; y: number[]; exposure: number[]; coefficients: number[]; deviance: number; nullDeviance: number }>(
  'stats/poisson-offset.json',
);

const counts = [18, 17, 15, 20, 10, 20, 25, 13, 12];
const outcome = [1, 2, 3, 1, 2, 3, 1, 2, 3];
const treatment = [1, 1, 1, 2, 2, 2, 3, 3, 3];

function design(withTreatment: boolean): { X: Float64Array; p: number } {
  const p = withTreatment ? 5 : 3;
  const X = new Float64Array(9 * p);
  for (let i = 0; i < 9; i++) {
    const row = [1, outcome[i] === 2 ? 1 : 0, outcome[i] === 3 ? 1 : 0];
    if (withTreatment) row.push(treatment[i] === 2 ? 1 : 0, treatment[i] === 3 ? 1 : 0);
    X.set(row, i * p);
  }
  return { X, p };
}

describe('poissonGlm', () => {
  it('reproduces Dobson (1990) p. 93: coefficients, standard errors, deviances, AIC', () => {
    const { X, p } = design(true);
    const f = poissonGlm(X, p, counts);
    expect(f.converged).toBe(true);
    close(f.coefficients[0], 3.044522, 0, 5e-7, 'intercept');
    close(f.coefficients[1], -0.454255, 0, 5e-7, 'outcome2');
    close(f.coefficients[2], -0.292987, 0, 5e-7, 'outcome3');
    close(f.coefficients[3], 0, 0, 1e-8, 'treatment2');
    close(f.coefficients[4], 0, 0, 1e-8, 'treatment3');
    close(f.standardErrors[0], 0.1709, 0, 5e-5, 'SE intercept');
    close(f.standardErrors[1], 0.2022, 0, 5e-5, 'SE outcome2');
    close(f.standardErrors[2], 0.1927, 0, 5e-5, 'SE outcome3');
    close(f.standardErrors[3], 0.2, 0, 5e-5, 'SE treatment2');
    close(f.nullDeviance, 10.5814, 0, 5e-5, 'null deviance');
    expect(f.dfNull).toBe(8);
    close(f.deviance, 5.1291, 0, 5e-5, 'residual deviance');
    expect(f.dfResidual).toBe(4);
    close(f.aic, 56.761, 0, 5e-4, 'AIC');
    // Exact MLE (computed): intercept ln 21, outcome effects ln(40/63), ln(47/63).
    close(f.coefficients[0], Math.log(21), 1e-9);
    close(f.coefficients[1], Math.log(40 / 63), 1e-9);
    close(f.coefficients[2], Math.log(47 / 63), 1e-9);
  });

  it('gives the likelihood-ratio test of outcome as the drop in deviance', () => {
    const full = poissonGlm(design(false).X, 3, counts);
    // Drop = 10.5814 - 5.1291 = 5.4523 on 2 df (Dobson 1990 p. 93 deviances).
    close(full.nullDeviance - full.deviance, 10.5814 - 5.1291, 0, 1e-4);
    const p = chiSquareSf(full.nullDeviance - full.deviance, 2);
    close(p, Math.exp(-(10.5814 - 5.1291) / 2), 0, 1e-4); // chi-square(2) tail = exp(-x/2)
  });

  it('aggregated counts with prior weights give the same coefficients as the raw data', () => {
    // Two covariate values, counts repeated: weight = multiplicity, y = mean count.
    const xRaw = [0, 0, 0, 1, 1, 1, 1];
    const yRaw = [2, 3, 1, 5, 4, 6, 7];
    const Xr = new Float64Array(xRaw.flatMap((v) => [1, v]));
    const raw = poissonGlm(Xr, 2, yRaw);
    const agg = poissonGlm(new Float64Array([1, 0, 1, 1]), 2, [2, 5.5], { weights: [3, 4] });
    close(agg.coefficients[0], raw.coefficients[0], 1e-10);
    close(agg.coefficients[1], raw.coefficients[1], 1e-10);
    close(agg.standardErrors[1], raw.standardErrors[1], 1e-8);
    close(agg.nullDeviance - agg.deviance, raw.nullDeviance - raw.deviance, 1e-8);
    close(raw.coefficients[1], Math.log(5.5 / 2), 1e-10);
  });

  it('reports a singular design as not converged with NaN coefficients', () => {
    const X = new Float64Array([1, 2, 1, 2, 1, 2]);
    const f = poissonGlm(X, 2, [1, 2, 3]);
    expect(f.converged).toBe(false);
    expect(f.coefficients[0]).toBeNaN();
  });

  // Offset log(exposure) (the progress ramp's occupancy). Source: SciPy 1.17
  // scipy.optimize.minimize (BFGS) of the same likelihood, fixture
  // test/fixtures/stats/poisson-offset.json (generator make_poisson_offset.py
  // beside it). Tolerance 1e-6 absolute on coefficients (the optimiser stops at
  // gradient 1e-12, far below; IRLS converges to 1e-10 relative deviance) and
  // 1e-8 relative on deviances.
  it.each(offsetCases.cases.map((c, i) => [i, c] as const))('offset log(exposure): SciPy case %i', (_i, c) => {
    const f = poissonGlm(new Float64Array(c.X), c.p, c.y, { offset: c.exposure.map(Math.log) });
    expect(f.converged).toBe(true);
    c.coefficients.forEach((b, k) => close(f.coefficients[k], b, 0, 1e-6, `b${k}`));
    close(f.deviance, c.deviance, 1e-8, 1e-10, 'deviance');
    close(f.nullDeviance, c.nullDeviance, 1e-10, 1e-12, 'null deviance');
  });

  it('offset with one binary covariate: the MLE is the ratio of count per exposure (closed form)', () => {
    // Poisson rate MLE = total count / total exposure in each group (definition
    // of the MLE; e.g. Dobson & Barnett 2008, section on Poisson regression with
    // exposure, from memory), so b0 = ln(r0) and b1 = ln(r1 / r0).
    const X = new Float64Array([1, 0, 1, 0, 1, 1, 1, 1, 1, 1]);
    const y = [3, 7, 20, 14, 9];
    const e = [2, 4.5, 3, 2.5, 1.5];
    const f = poissonGlm(X, 2, y, { offset: e.map(Math.log) });
    const r0 = 10 / 6.5;
    const r1 = 43 / 7;
    close(f.coefficients[0], Math.log(r0), 1e-10);
    close(f.coefficients[1], Math.log(r1 / r0), 1e-10);
  });
});
