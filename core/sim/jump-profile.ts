import type { RateProfile } from './rate-profile';
import type { TaskSchedule } from './task-schedule';
import type { JumpResponseSpec } from './types';
import { windowProfile } from './window-profile';
import { constantProfile } from './constant-profile';

/**
 * A unit's gain profile from its answers to sweep jumps, by kind. On each
 * trial with a jump of a kind the unit answers: burst or dip, gain on
 * [jump + latencyS, jump + latencyS + durationS) (a transient); step, gain
 * from jump + latencyS until reward (a lasting change, not a transient).
 * Gains are clamped at 0.
 */
export function jumpProfile(
  schedule: TaskSchedule,
  answers: { readonly forward?: JumpResponseSpec; readonly backward?: JumpResponseSpec },
): RateProfile {
  const byKind = answers as Readonly<Record<string, JumpResponseSpec | undefined>>;
  const start: number[] = [];
  const stop: number[] = [];
  const gain: number[] = [];
  for (let i = 0; i < schedule.jumpS.length; i++) {
    const tj = schedule.jumpS[i];
    if (Number.isNaN(tj)) continue;
    const a = byKind[schedule.jumpKind[i]];
    if (!a) continue;
    const s = tj + a.latencyS;
    const e = a.type === 'step' ? schedule.rewardS[i] : s + a.durationS;
    start.push(s);
    stop.push(e);
    gain.push(Math.max(0, a.gain));
  }
  return start.length ? windowProfile(start, stop, gain) : constantProfile(1);
}
