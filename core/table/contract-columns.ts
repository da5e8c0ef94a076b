/**
 * The stable head of units.csv (DESIGN.md section 3): these columns come
 * first, in this order, with exactly these names. Per-kind jump columns
 * (jump_K, jump_K_delta_hz, jump_K_p) follow them, kinds in sorted order;
 * every other column follows in the order the analysis steps produce them.
 */
export const CONTRACT_COLUMNS = [
  'unit',
  'n_spikes',
  'rate_hz',
  'tag',
  'tag_latency_ms',
  'tag_jitter_ms',
  'tag_reliability',
  'tag_p',
  'ramp',
  'ramp_slope_hz_per_s',
  'ramp_p',
  'ramp_q',
] as const;

/** Verdict words of the contract. */
export const TAG_VERDICTS = ['tagged', 'borderline', 'untagged'] as const;
export const RAMP_VERDICTS = ['up', 'down', 'flat'] as const;
export const JUMP_VERDICTS = ['excited', 'suppressed', 'none'] as const;
