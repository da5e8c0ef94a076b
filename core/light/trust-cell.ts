/** Dead time of the simulated units, s (common practice: ~2 ms absolute refractory period). */
export const TRUST_REFRACTORY_S = 0.002;
const REFRACTORY_S = TRUST_REFRACTORY_S;

/**
 * Rounds a unit's baseline rate and ISI CV to the simulation grid (rate: powers of sqrt 2; CV: steps of 0.25 in [0.25, 3]),
 * so units alike share one simulation; rate capped at 0.8 / dead time; rate <= 0 -> 0, CV NaN -> 1 (Poisson).
 */
export function trustCell(rateHz: number, cv: number): { rateHz: number; cv: number } {
  const r = rateHz > 0 && Number.isFinite(rateHz) ? Math.min(0.8 / REFRACTORY_S, Math.pow(2, Math.round(2 * Math.log2(rateHz)) / 2)) : 0;
  const c = Number.isFinite(cv) && cv > 0 ? Math.min(3, Math.max(0.25, Math.round(cv * 4) / 4)) : 1;
  return { rateHz: r, cv: c };
}

