import { binCounts } from '../align/bin-counts';
import { trialAnchors, type TrialAnchors } from '../align/trial-anchors';
import { warpSpikes } from '../align/warp-spikes';
import { warpTemplate } from '../align/warp-template';
import { warpedPsth } from '../align/warped-psth';
import type { Parameters } from '../defaults';
import type { Recording } from '../model/types';
import { addWindowCounts } from '../align/add-window-counts';
import { selectEvents } from './select-events';

/**
 * Which trials and which window a ramp test uses, before any unit is
 * counted: either a fixed window around the ramp event, or (anchorEvent set)
 * the stretch from anchorEvent to the ramp event in each trial, time-warped
 * onto a template (alignment module: trialAnchors, warpTemplate, warpSpikes,
 * warpedPsth; the template is the median anchor-to-event duration).
 */
export interface RampPlan {
  readonly mode: 'fixed' | 'warped';
  readonly nTrials: number;
  /** Bin centres, s relative to the ramp event (template seconds when warped). */
  readonly centresS: Float64Array;
  /** Bin width, s (template seconds when warped), and the window's start (fixed mode), s. */
  readonly binS: number;
  readonly startS: number;
  /** Fixed mode: event times. */
  readonly times: Float64Array;
  /** Warped mode: the anchors (valid = trials used) and the template [0, duration]. */
  readonly anchors: TrialAnchors | null;
  readonly template: Float64Array | null;
  /** How the trials were chosen, or why there are none. */
  readonly note: string;
}

/**
 * Plans the ramp window for trials of `condition` (null = every trial; ""
 * or a trial table without conditions = every trial). In warped mode the
 * number of bins is round(duration / binS), at least 2, tiling the template
 * exactly; `template` may be given so that other conditions are warped onto
 * the reference condition's template (slopes then compare per reference second).
 */
export function rampPlan(recording: Recording, params: Parameters['ramp'], condition: string | null, template?: Float64Array): RampPlan {
  if (params.anchorEvent === '') {
    const sel = selectEvents(recording, params.event, condition);
    const nBins = Math.max(1, Math.round((params.windowEndS - params.windowStartS) / params.binS));
    return {
      mode: 'fixed',
      nTrials: sel.times.length,
      centresS: Float64Array.from({ length: nBins }, (_, j) => params.windowStartS + (j + 0.5) * params.binS),
      binS: params.binS,
      startS: params.windowStartS,
      times: sel.times,
      anchors: null,
      template: null,
      note: sel.note,
    };
  }
  const { trials } = recording;
  const empty = (note: string): RampPlan => ({
    mode: 'warped', nTrials: 0, centresS: new Float64Array(0), binS: params.binS, startS: NaN, times: new Float64Array(0), anchors: null, template: null, note,
  });
  if (trials.trial.length === 0) return empty(`the window from "${params.anchorEvent}" to "${params.event}" needs a trial table`);
  const a0 = trialAnchors(recording, [params.anchorEvent, params.event]);
  const hasConditions = trials.condition.some((c) => c !== '');
  const valid = Uint8Array.from(a0.valid, (v, r) => (v && (condition === null || condition === '' || !hasConditions || trials.condition[r] === condition) ? 1 : 0));
  const anchors: TrialAnchors = { ...a0, valid };
  let n = 0;
  for (const v of valid) n += v;
  const where = condition === null || condition === '' || !hasConditions ? '' : ` of condition "${condition}"`;
  if (n === 0) return empty(`no trials${where} with "${params.anchorEvent}" before "${params.event}"`);
  const tpl = template ?? warpTemplate(anchors);
  const duration = tpl[1];
  const nBins = Math.max(2, Math.round(duration / params.binS));
  const binS = duration / nBins;
  return {
    mode: 'warped',
    nTrials: n,
    centresS: Float64Array.from({ length: nBins }, (_, j) => (j + 0.5) * binS - duration),
    binS,
    startS: -duration,
    times: new Float64Array(0),
    anchors,
    template: tpl,
    note: `${n} trials${where}, "${params.anchorEvent}" to "${params.event}" time-warped onto ${duration.toPrecision(3)} s`,
  };
}

/**
 * Counts (trials x bins) of one unit under a plan, with the real exposure of
 * each bin when warped. A buffer of trials x bins may be passed for the
 * fixed window; the result then lives in it until the next call.
 */
export function rampCounts(spikeTimes: Float64Array, plan: RampPlan, buffer?: Float64Array): { counts: Float64Array; exposureS?: Float64Array } {
  if (plan.mode === 'fixed') {
    const nBins = plan.centresS.length;
    if (!buffer || buffer.length !== plan.times.length * nBins) {
      return { counts: binCounts(spikeTimes, plan.times, plan.startS, plan.binS, nBins) };
    }
    // Same counts as binCounts, written into the caller's buffer (no allocation per unit).
    buffer.fill(0);
    let hint = 0;
    for (let k = 0; k < plan.times.length; k++) {
      const a = plan.times[k];
      if (Number.isFinite(a)) hint = addWindowCounts(spikeTimes, a + plan.startS, plan.binS, nBins, buffer, k * nBins, hint);
    }
    return { counts: buffer };
  }
  if (!plan.anchors || !plan.template) return { counts: new Float64Array(0) };
  const raster = warpSpikes(spikeTimes, plan.anchors, plan.template, 0, 0);
  const w = warpedPsth(raster, plan.anchors, plan.template, plan.binS * 1000);
  return { counts: w.counts, exposureS: w.exposureS };
}
