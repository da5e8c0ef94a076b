import type { Recording } from '../model/types';
import { linkEventsToTrials } from './link-events-to-trials';

/** Anchor times per trial for time-warping. */
export interface TrialAnchors {
  /** The anchor labels, in order. */
  readonly labels: readonly string[];
  /** trials x labels, row-major, s (NaN where the trial lacks the anchor). */
  readonly times: Float64Array;
  /** 1 where the trial has every anchor, strictly increasing. */
  readonly valid: Uint8Array;
  readonly trials: number;
}

/**
 * For each trial, the time of the first event of each anchor label linked to
 * it (linkEventsToTrials). The labels "trial_start" and "trial_stop" mean the
 * trial table's start and stop unless events carry those labels. A trial is
 * valid for warping when all its anchors exist and increase strictly; the
 * rest are reported invalid (not dropped silently: callers count them).
 */
export function trialAnchors(recording: Recording, labels: readonly string[]): TrialAnchors {
  const { events, trials } = recording;
  const nT = trials.start.length;
  const K = labels.length;
  const times = new Float64Array(nT * K).fill(NaN);
  const eventLabels = new Set(events.label);
  const link = linkEventsToTrials(events.time, events.trial, trials);
  labels.forEach((label, k) => {
    if (!eventLabels.has(label) && (label === 'trial_start' || label === 'trial_stop')) {
      const col = label === 'trial_start' ? trials.start : trials.stop;
      for (let r = 0; r < nT; r++) times[r * K + k] = col[r];
      return;
    }
    for (let i = 0; i < events.time.length; i++) {
      const r = link[i];
      if (r < 0 || events.label[i] !== label) continue;
      const cell = r * K + k;
      if (!(times[cell] <= events.time[i])) times[cell] = events.time[i];
    }
  });
  const valid = new Uint8Array(nT);
  for (let r = 0; r < nT; r++) {
    let ok = K >= 2;
    for (let k = 0; k < K && ok; k++) {
      const t = times[r * K + k];
      if (!Number.isFinite(t) || (k > 0 && !(t > times[r * K + k - 1]))) ok = false;
    }
    valid[r] = ok ? 1 : 0;
  }
  return { labels: [...labels], times, valid, trials: nT };
}
