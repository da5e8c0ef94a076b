import type { RateProfile } from './rate-profile';
import type { TaskSchedule } from './task-schedule';
import type { RampSpec, RewardResponseSpec } from './types';
import { windowProfile } from './window-profile';
import { constantProfile } from './constant-profile';

/**
 * A unit's gain profile over the task from its ramp and reward answer.
 *
 * Ramp: from sweep_on to reward the gain is 1 + gain * progress^power, where
 * progress runs 0 -> 1 with the sweep (on probe trials it moves by the jump's
 * shift at the jump, so ramping units follow the sweep's jump with a lasting
 * step). The ramp is held constant on steps of `stepS` (value at each step's
 * midpoint; a break is placed at the jump). Reward: gain `reward.gain` on
 * [reward + latencyS, reward + latencyS + durationS). Gains are clamped at 0.
 * Without ramp and reward answer the profile is the constant 1.
 */
export function taskProfile(
  schedule: TaskSchedule,
  ramp: RampSpec | null,
  reward: RewardResponseSpec | null,
  stepS: number,
): RateProfile {
  const hasRamp = ramp !== null && ramp.gain !== 0;
  if (!hasRamp && reward === null) return constantProfile(1);
  const start: number[] = [];
  const stop: number[] = [];
  const gain: number[] = [];
  const n = schedule.sweepOnS.length;
  for (let i = 0; i < n; i++) {
    const on = schedule.sweepOnS[i];
    const rw = schedule.rewardS[i];
    const sweep = schedule.sweepS[i];
    const tj = schedule.jumpS[i];
    const shift = schedule.jumpShiftS[i];
    if (hasRamp) {
      const pieces: [number, number, number][] = Number.isNaN(tj)
        ? [[on, rw, 0]]
        : [
            [on, tj, 0],
            [tj, rw, shift],
          ];
      for (const [a, b, sh] of pieces) {
        const steps = Math.max(1, Math.round((b - a) / stepS));
        const w = (b - a) / steps;
        for (let k = 0; k < steps; k++) {
          const s0 = a + k * w;
          const s1 = k === steps - 1 ? b : a + (k + 1) * w;
          const mid = (s0 + s1) / 2;
          const p = Math.min(1, Math.max(0, (mid - on + sh) / sweep));
          start.push(s0);
          stop.push(s1);
          gain.push(Math.max(0, 1 + ramp!.gain * Math.pow(p, ramp!.power)));
        }
      }
    }
    if (reward) {
      start.push(rw + reward.latencyS);
      stop.push(rw + reward.latencyS + reward.durationS);
      gain.push(Math.max(0, reward.gain));
    }
  }
  return windowProfile(start, stop, gain);
}
