/**
 * Ordinary least squares. Source: NIST/ITL StRD linear regression dataset
 * "Norris", certified values (verified; REFERENCES.md), data in
 * test/fixtures/stats/norris.json. NIST certifies 15 significant digits; the
 * two-pass centred sums reproduce them to ~1e-12 relative (tolerances below).
 */
import { describe, expect, it } from 'vitest';
import { linearFit } from '../../../core/stats';
import { close } from '../../helpers/close';
import { loadFixture } from '../../helpers/fixtures';

const fx = loadFixture<{ x: number[]; y: number[]; certified: Record<string, number> }>('stats/norris.json');

describe('linearFit', () => {
  it('reproduces the NIST StRD Norris certified values', () => {
    const { x, y, certified: c } = fx.cases[0];
    expect(x.length).toBe(36);
    const f = linearFit(x, y);
    close(f.intercept, c.b0, 1e-11, 0, 'B0');
    close(f.slope, c.b1, 1e-12, 0, 'B1');
    close(f.interceptSe, c.b0Sd, 1e-11, 0, 'SD(B0)');
    close(f.slopeSe, c.b1Sd, 1e-11, 0, 'SD(B1)');
    close(f.residualSd, c.residualSd, 1e-11, 0, 'residual SD');
    close(f.r2, c.r2, 1e-13, 0, 'R^2');
    close(f.residualSs, c.residualSs, 1e-10, 0, 'residual SS');
    // t = B1 / SD(B1) from the certified values; p is far below any threshold.
    close(f.slopeT, c.b1 / c.b1Sd, 1e-10);
    expect(f.slopeP).toBeLessThan(1e-80);
    // Without the t distribution: every other field identical, slopeP NaN.
    const g = linearFit(x, y, false);
    for (const k of Object.keys(f) as (keyof typeof f)[]) {
      if (k === 'slopeP') expect(g.slopeP).toBeNaN();
      else expect(Object.is(g[k], f[k]), k).toBe(true);
    }
  });

  it('handles edge cases: constant x, two points, constant y', () => {
    expect(linearFit([1, 1, 1], [1, 2, 3]).slope).toBeNaN();
    const two = linearFit([0, 1], [1, 3]);
    expect(two.slope).toBe(2);
    expect(two.slopeSe).toBeNaN();
    const flat = linearFit([0, 1, 2, 3], [5, 5, 5, 5]);
    expect(flat.slope).toBe(0);
    expect(flat.r2).toBeNaN();
  });
});
