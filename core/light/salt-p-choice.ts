import type { Parameters } from '../defaults';
import { formatNumber } from '../table/format-number';

/** Which SALT p the identification rule uses on a schedule, and what the user must be told. */
export interface SaltPChoice {
  /** The p the rule and `tag_p` use. */
  readonly kind: 'calibrated' | 'published';
  /** Can the chosen p go below alphaSalt at all on this schedule? */
  readonly canPass: boolean;
  /** Smallest value the chosen p can take (1 / (J + 1), or 1 / #null for the published p; NaN without SALT). */
  readonly resolution: number;
  /** Why the choice, for reason strings and run.json ("" when nothing needs saying). */
  readonly note: string;
}

/**
 * Chooses between SALT's published p (p = #(null >= test) / #null; valid but
 * conservative: under no light effect it clusters near 0.5) and the
 * rank-calibrated p (the test histogram's rank among all J + 1 histograms by
 * median distance to the others; a permutation p, close to uniform when the
 * test window is exchangeable with the baseline windows, never below
 * 1 / (J + 1)). Depends on the schedule only (J baseline windows), never on a
 * unit's spikes, so the choice cannot favour any unit.
 *
 * light.saltP: 'published' and 'calibrated' force the choice; 'auto' takes the
 * calibrated p when 1 / (J + 1) < alphaSalt, else the published p (with 10-ms
 * windows and ~1 Hz pulses J + 1 <= 100, so the calibrated p could never pass
 * 0.01). Forced 'calibrated' with 1 / (J + 1) >= alphaSalt: canPass false and
 * the note says "too few light-free baseline windows for p < alpha: J = ...".
 * J < 2 (SALT not run): resolution NaN, canPass false, note "".
 */
export function saltPChoice(J: number, p: Parameters['light']): SaltPChoice {
  const rows = J + 1;
  const nullCount = (J * (J - 1)) / 2;
  if (!(J >= 2)) return { kind: p.saltP === 'published' ? 'published' : 'calibrated', canPass: false, resolution: NaN, note: '' };
  const calOk = 1 / rows < p.alphaSalt;
  const a = formatNumber(p.alphaSalt, 3);
  const floor = `calibrated p >= 1/${rows} = ${formatNumber(1 / rows, 3)}`;
  if (p.saltP === 'published') return { kind: 'published', canPass: true, resolution: 1 / nullCount, note: '' };
  if (p.saltP === 'calibrated') {
    return { kind: 'calibrated', canPass: calOk, resolution: 1 / rows, note: calOk ? '' : `too few light-free baseline windows for p < ${a}: J = ${J} (${floor})` };
  }
  if (calOk) return { kind: 'calibrated', canPass: true, resolution: 1 / rows, note: '' };
  return {
    kind: 'published',
    canPass: true,
    resolution: 1 / nullCount,
    note: `published SALT p used: too few light-free baseline windows for a calibrated p < ${a} (J = ${J}, ${floor})`,
  };
}
