/** Dead time of the simulated units, s (common practice: ~2 ms absolute refractory period). */
export const TRUST_REFRACTORY_S = 0.002;
const REFRACTORY_S = TRUST_REFRACTORY_S;

/** Rate nodes of the trust grid, Hz: powers of 2 from 1/8 to the dead-time cap. */
const LOG2_RATE_MIN = -3;
const LOG2_RATE_MAX = Math.floor(Math.log2(0.8 / REFRACTORY_S));
/** ISI CV nodes of the trust grid: 0.5 (regular), 1 (Poisson-like), 2 (bursty). */
export const TRUST_CV_NODES = [0.5, 1, 2] as const;

/** One grid node and its bilinear weight for a unit. */
export interface TrustCorner {
  readonly rateHz: number;
  readonly cv: number;
  readonly weight: number;
}

/**
 * Where a unit sits on the trust grid: the (up to 4) nodes around its baseline
 * rate and ISI CV and their bilinear weights in (log2 rate, log2 CV). Rate
 * nodes: powers of 2 from 0.125 Hz to 256 Hz (0.8 / dead time); CV nodes 0.5, 1,
 * 2; values outside are clamped to the edge nodes. Rate <= 0 or NaN -> the one
 * node rate 0 (a silent unit), CV NaN -> 1. Nodes with weight 0 are left out.
 * The trust figures of a unit are the weighted means of its nodes' figures
 * (the lead's design: simulate a grid once per session, interpolate).
 */
export function trustCell(rateHz: number, cv: number): TrustCorner[] {
  const c = Number.isFinite(cv) && cv > 0 ? cv : 1;
  const lc = Math.min(1, Math.max(-1, Math.log2(c)));
  const ci = lc >= 0 ? 1 : 0;
  const cf = lc - (ci - 1);
  const cvs: [number, number][] = [
    [TRUST_CV_NODES[ci], 1 - cf],
    [TRUST_CV_NODES[ci + 1], cf],
  ];
  let rates: [number, number][];
  if (!(rateHz > 0 && Number.isFinite(rateHz))) rates = [[0, 1]];
  else {
    const lr = Math.min(LOG2_RATE_MAX, Math.max(LOG2_RATE_MIN, Math.log2(rateHz)));
    const ri = Math.min(LOG2_RATE_MAX - 1, Math.floor(lr));
    const rf = lr - ri;
    rates = [
      [Math.pow(2, ri), 1 - rf],
      [Math.pow(2, ri + 1), rf],
    ];
  }
  const out: TrustCorner[] = [];
  for (const [r, wr] of rates) for (const [v, wv] of cvs) if (wr * wv > 0) out.push({ rateHz: r, cv: v, weight: wr * wv });
  return out;
}
