import type { UnitTruth } from './types';

/**
 * The simulator's truth as CSV text, one row per unit, for people and for
 * scoring analyses against it: unit, light_class, latency_ms, jitter_ms,
 * reliability, rate_hz (asked for), expected_rate_hz, realised_rate_hz,
 * evoked_spikes, shape, ramp, ramp_gain, ramp_slope_hz_per_s, then per jump
 * kind K (sorted): jump_K, jump_K_mechanism, jump_K_delta_hz. Numbers with
 * 6 significant digits; NaN as an empty cell.
 */
export function truthTable(truth: readonly UnitTruth[]): string {
  const kinds = [...new Set(truth.flatMap((t) => Object.keys(t.jump)))].sort();
  const head = [
    'unit',
    'light_class',
    'latency_ms',
    'jitter_ms',
    'reliability',
    'rate_hz',
    'expected_rate_hz',
    'realised_rate_hz',
    'evoked_spikes',
    'shape',
    'ramp',
    'ramp_gain',
    'ramp_slope_hz_per_s',
    ...kinds.flatMap((k) => [`jump_${k}`, `jump_${k}_mechanism`, `jump_${k}_delta_hz`]),
  ];
  const f = (x: number) => (Number.isFinite(x) ? String(Number(x.toPrecision(6))) : '');
  const rows = truth.map((t) =>
    [
      t.unit,
      t.lightClass,
      f(t.latencyMs),
      f(t.jitterMs),
      f(t.reliability),
      f(t.rateHz),
      f(t.expectedRateHz),
      f(t.realisedRateHz),
      String(t.evokedSpikes),
      f(t.shape),
      t.ramp,
      f(t.rampGain),
      f(t.rampSlopeHzPerS),
      ...kinds.flatMap((k) => {
        const j = t.jump[k];
        return j ? [j.answer, j.mechanism, f(j.expectedDeltaHz)] : ['', '', ''];
      }),
    ].join(','),
  );
  return [head.join(','), ...rows].join('\n') + '\n';
}
