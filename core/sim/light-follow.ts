/**
 * Answer probability and latency shift of a light-driven unit for pulse k
 * (0-based) of a train at frequency f (Hz; NaN for single pulses):
 *   steady fraction   s = 1 / (1 + (f / followHalfHz)^2)   (1 for singles)
 *   weight of pulse k w = decay^k
 *   probability       p = reliability * (s + (1 - s) * w)
 *   latency shift       = latencyGrowthMs * (1 - s) * (1 - w)    (ms)
 * so the first pulse of every train is answered like a single pulse, and
 * answers fade and slow down along the train, more at higher frequencies
 * (the behaviour reported for opsin-driven firing at >= 20-40 Hz; the
 * functional form is our own, common practice for simulation).
 */
export function lightFollow(
  k: number,
  frequencyHz: number,
  reliability: number,
  followHalfHz: number,
  decayPerPulse: number,
  latencyGrowthMs: number,
): { probability: number; latencyShiftMs: number } {
  const s = Number.isFinite(frequencyHz) && frequencyHz > 0 ? 1 / (1 + (frequencyHz / followHalfHz) ** 2) : 1;
  const w = Math.pow(decayPerPulse, k);
  return {
    probability: Math.min(1, Math.max(0, reliability * (s + (1 - s) * w))),
    latencyShiftMs: latencyGrowthMs * (1 - s) * (1 - w),
  };
}
