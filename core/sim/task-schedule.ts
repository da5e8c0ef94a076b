import type { Events, Trials } from '../model/types';
import type { Rng } from '../random/rng';
import type { TaskSpec } from './types';

/** The simulated task timeline, trial by trial (arrays indexed by trial). */
export interface TaskSchedule {
  readonly trials: Trials;
  readonly events: Events;
  readonly sweepOnS: Float64Array;
  readonly rewardS: Float64Array;
  /** Nominal sweep duration of the trial's condition, s. */
  readonly sweepS: Float64Array;
  /** Jump time (NaN on trials without a jump) and kind ("" without). */
  readonly jumpS: Float64Array;
  readonly jumpKind: readonly string[];
  /** Sweep time skipped by the jump, s: +shift forward, -shift backward, 0 none. */
  readonly jumpShiftS: Float64Array;
  /** Stop of the last trial, s. */
  readonly endS: number;
}

/**
 * Draws the auditory-countdown trials from `startS` (s). Trial i: start;
 * `sweep_on` after preSweepS; a condition drawn by weight; on probe
 * conditions a `jump` at a uniform time in jumpAfterS after
 * sweep_on, which moves the sweep forward (reward jumpShiftS earlier) or back
 * (later), kinds counterbalanced (every run of len(jumpKinds) probe trials
 * holds each kind once, in random order); `reward` when the sweep reaches its top; stop postRewardS later;
 * a uniform inter-trial interval before the next start. Trials are numbered
 * from 1. trials.covariates: `sweep_s` (nominal sweep length) and
 * `jump_shift_s` (signed shift, 0 on trials without a jump).
 *
 * Throws when a forward jump could reach the end of the sweep.
 */
export function taskSchedule(spec: TaskSpec, startS: number, rng: Rng): TaskSchedule {
  const n = spec.trials;
  const totalWeight = spec.conditions.reduce((a, c) => a + c.weight, 0);
  if (!(totalWeight > 0)) throw new Error('task: condition weights must sum to > 0');
  for (const c of spec.conditions) {
    if (c.probe && spec.jumpAfterS[1] + spec.jumpShiftS >= c.sweepS) {
      throw new Error(`task: a forward jump at ${spec.jumpAfterS[1]} s by ${spec.jumpShiftS} s would end the ${c.sweepS} s sweep of "${c.name}"`);
    }
  }
  const uniformIn = (r: readonly [number, number]) => r[0] + (r[1] - r[0]) * rng.uniform();
  const trial = new Float64Array(n);
  const start = new Float64Array(n);
  const stop = new Float64Array(n);
  const condition: string[] = [];
  const sweepOnS = new Float64Array(n);
  const rewardS = new Float64Array(n);
  const sweepS = new Float64Array(n);
  const jumpS = new Float64Array(n).fill(NaN);
  const jumpKind: string[] = [];
  const jumpShiftS = new Float64Array(n);
  const evTime: number[] = [];
  const evLabel: string[] = [];
  const evTrial: number[] = [];
  const evKind: string[] = [];
  const push = (t: number, label: string, tr: number, kind: string) => {
    evTime.push(t);
    evLabel.push(label);
    evTrial.push(tr);
    evKind.push(kind);
  };
  const kindBag: ('forward' | 'backward')[] = [];
  let t = startS;
  for (let i = 0; i < n; i++) {
    if (i > 0) t = stop[i - 1] + uniformIn(spec.itiS);
    let pick = rng.uniform() * totalWeight;
    let cond = spec.conditions[spec.conditions.length - 1];
    for (const c of spec.conditions) {
      if (pick < c.weight) {
        cond = c;
        break;
      }
      pick -= c.weight;
    }
    trial[i] = i + 1;
    start[i] = t;
    condition.push(cond.name);
    sweepS[i] = cond.sweepS;
    sweepOnS[i] = t + spec.preSweepS;
    push(sweepOnS[i], 'sweep_on', i + 1, '');
    let kind = '';
    if (cond.probe && spec.jumpKinds.length > 0) {
      if (kindBag.length === 0) {
        kindBag.push(...spec.jumpKinds);
        shuffleInPlace(rng, kindBag);
      }
      kind = kindBag.pop()!;
      jumpS[i] = sweepOnS[i] + uniformIn(spec.jumpAfterS);
      jumpShiftS[i] = kind === 'forward' ? spec.jumpShiftS : -spec.jumpShiftS;
      push(jumpS[i], 'jump', i + 1, kind);
    }
    jumpKind.push(kind);
    rewardS[i] = sweepOnS[i] + cond.sweepS - jumpShiftS[i];
    push(rewardS[i], 'reward', i + 1, '');
    stop[i] = rewardS[i] + spec.postRewardS;
  }
  return {
    trials: { trial, start, stop, condition, covariates: { sweep_s: sweepS.slice(), jump_shift_s: jumpShiftS.slice() } },
    events: { time: Float64Array.from(evTime), label: evLabel, trial: Float64Array.from(evTrial), kind: evKind },
    sweepOnS,
    rewardS,
    sweepS,
    jumpS,
    jumpKind,
    jumpShiftS,
    endS: n > 0 ? stop[n - 1] : startS,
  };
}

function shuffleInPlace<T>(rng: Rng, xs: T[]): void {
  for (let i = xs.length - 1; i > 0; i--) {
    const j = rng.int(i + 1);
    const t = xs[i];
    xs[i] = xs[j];
    xs[j] = t;
  }
}
