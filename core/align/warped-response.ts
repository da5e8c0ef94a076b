import type { Recording } from '../model/types';
import { trialAnchors, type TrialAnchors } from './trial-anchors';
import { warpedPsth, type WarpedPsth } from './warped-psth';
import { warpSpikes } from './warp-spikes';
import { warpTemplate } from './warp-template';

export interface WarpedResponse {
  readonly unitId: string;
  readonly labels: readonly string[];
  /** Template anchor positions, s after the first anchor (median over valid trials). */
  readonly template: Float64Array;
  /** Trials left out: an anchor missing or out of order. */
  readonly invalidTrials: number;
  readonly groups: readonly { readonly label: string; readonly nTrials: number; readonly psth: WarpedPsth }[];
}

/**
 * Time-warped PSTH of one unit: anchors per trial (trialAnchors), one
 * template over all valid trials (warpTemplate), then per group of trials
 * (all, or by condition) the warped raster and its exposure-corrected rates
 * (warpSpikes, warpedPsth). The window runs from preS before the first anchor
 * to postS after the last, in template time. Groups without valid trials are
 * dropped; a session with no valid trial gives no groups and a NaN template.
 */
export function warpedResponse(
  recording: Recording,
  unitIndex: number,
  labels: readonly string[],
  o: { readonly binMs: number; readonly preS: number; readonly postS: number; readonly groupBy: 'none' | 'condition' },
): WarpedResponse {
  const unit = recording.units[unitIndex];
  if (!unit) throw new Error(`warpedResponse: no unit at index ${unitIndex}`);
  const a = trialAnchors(recording, labels);
  const template = warpTemplate(a);
  let invalid = 0;
  for (const v of a.valid) if (!v) invalid++;
  const conditions = o.groupBy === 'condition' ? [...new Set(recording.trials.condition)].sort() : [null];
  const groups = [];
  for (const c of conditions) {
    const valid = Uint8Array.from(a.valid, (v, r) => (v && (c === null || recording.trials.condition[r] === c) ? 1 : 0));
    const n = valid.reduce((s, v) => s + v, 0);
    if (n === 0) continue;
    const sub: TrialAnchors = { ...a, valid };
    const raster = warpSpikes(unit.spikeTimes, sub, template, o.preS, o.postS);
    groups.push({ label: c === null ? 'all' : c === '' ? '(none)' : c, nTrials: n, psth: warpedPsth(raster, sub, template, o.binMs) });
  }
  return { unitId: unit.id, labels: [...labels], template, invalidTrials: invalid, groups };
}
