import type { Parameters } from '../defaults';
import type { Recording } from '../model/types';
import { benjaminiHochberg } from '../stats/benjamini-hochberg';
import { eventWindowCounts } from './event-window-counts';
import { formatP } from './format-p';
import { jumpUnit, type JumpUnitResult } from './jump-unit';
import { referenceProfile, type ReferenceProfile, type ReferenceProfileScratch } from './reference-profile';
import { selectEvents } from './select-events';

/** Results for one jump kind across units. */
export interface JumpKindResult {
  /** The kind as given in events.csv ("" when the column is absent). */
  readonly kind: string;
  readonly nEvents: number;
  /** Events that got a matched control (a trial and reference trials covering their windows). */
  readonly nControlled: number;
  /** Reference samples the rank-sum test compares the events with (0: signed-rank, no control). */
  readonly nReferenceSamples: number;
  readonly units: JumpUnitResult[];
  readonly q: Float64Array;
  /** excited | suppressed | none. */
  readonly verdict: string[];
  /** transient | partial | step | unclear ("" when verdict is none). */
  readonly shape: string[];
  readonly reason: string[];
  /** True when the events carry a numeric size. */
  readonly hasSize: boolean;
}

export interface JumpClassification {
  readonly kinds: JumpKindResult[];
  /** Reference trials used as matched control. */
  readonly nReferenceTrials: number;
  readonly note: string;
  /** PSTH bin start (s) and width for the figures. */
  readonly psthStartS: number;
  readonly psthBinS: number;
}

/**
 * Jump answers of every unit, per kind (issue 5):
 * - rates in [preStartS, preEndS), [postStartS, postEndS) and [lateStartS,
 *   lateEndS) around each `event`, grouped by the event's kind;
 * - matched control: reference trials = trials of controlCondition holding no
 *   jump event; for each jump, the change the reference trials show over the
 *   same windows at the same time-in-trial (jump time - its trial's start) is
 *   subtracted from the jump's change (1 ms grid) for the effect sizes
 *   (delta, late delta, PSTH). Jumps outside any trial, or when there are no
 *   reference trials, are not controlled (their change is used as is; the
 *   count is in the summary);
 * - test (jumpUnit): each reference trial lends one sample, its changes over
 *   the windows at the time-in-trial of one of the kind's controlled jumps
 *   (reference trial r takes jump r mod n in event order, or the next one its
 *   length covers; a trial covering none lends nothing), so the samples have
 *   the jumps' time-in-trial distribution; the events' changes are compared
 *   with them by a two-sided rank-sum test (without samples: signed-rank of
 *   the events' changes). BH across units per kind; verdict excited /
 *   suppressed when q < alpha and the test's direction agrees with the sign of
 *   the controlled mean change (delta), else none (a disagreement is said in
 *   the reason);
 * - shape of an answer: "step" when the late change is significant in the
 *   same direction and not significantly smaller than the answer; "partial"
 *   when it is significant but smaller; "transient" when the answer decays
 *   significantly and the late change is not significant in the same
 *   direction; "unclear" otherwise (within-unit tests at alpha, uncorrected);
 * - latency, peak (Hz and z) from the control-subtracted event-averaged PSTH;
 * - Spearman of the controlled answer against a numeric jump size read from
 *   the trial covariate sizeCovariate (of each jump's trial), when present.
 */
export function classifyJumps(recording: Recording, params: Parameters['jump']): JumpClassification {
  const all = selectEvents(recording, params.event, null);
  const { trials } = recording;
  const binS = params.psthBinS;
  const psthStartS = Math.min(params.preStartS, params.postStartS);
  const psthEndS = Math.max(params.postEndS, params.lateEndS);
  const nPsth = Math.max(1, Math.round((psthEndS - psthStartS) / binS));
  if (all.times.length === 0) {
    return { kinds: [], nReferenceTrials: 0, note: all.note, psthStartS, psthBinS: binS };
  }
  // Reference trials: the control condition, without any jump event.
  const jumpTrials = new Set<number>();
  for (let i = 0; i < all.trialRows.length; i++) if (all.trialRows[i] >= 0) jumpTrials.add(all.trialRows[i]);
  const refStarts: number[] = [];
  const refStops: number[] = [];
  if (params.controlCondition !== '') {
    for (let r = 0; r < trials.trial.length; r++) {
      if (trials.condition[r] !== params.controlCondition || jumpTrials.has(r)) continue;
      const stop = Number.isFinite(trials.stop[r]) ? trials.stop[r] : r + 1 < trials.start.length ? trials.start[r + 1] : NaN;
      if (!(stop > trials.start[r])) continue;
      refStarts.push(trials.start[r]);
      refStops.push(stop);
    }
  }
  // Time-in-trial of each jump.
  const tau = Float64Array.from(all.times, (t, i) => (all.trialRows[i] >= 0 ? t - trials.start[all.trialRows[i]] : NaN));
  let maxTau = 0;
  for (const v of tau) if (v > maxTau) maxTau = v;
  const profileLength = maxTau + Math.max(params.postEndS, params.lateEndS, params.preEndS) + 0.01;
  const sizeCol = params.sizeCovariate !== '' ? trials.covariates[params.sizeCovariate] : undefined;
  const sizeAll = Float64Array.from(all.trialRows, (r) => (sizeCol instanceof Float64Array && r >= 0 ? sizeCol[r] : NaN));

  const kindNames = [...new Set(all.kinds)].sort();
  const groups = kindNames.map((k) => all.kinds.flatMap((kk, i) => (kk === k ? [i] : [])));
  // Reference samples of each kind: reference trial r at the time-in-trial of jump r mod n (or
  // the next jump whose windows the trial covers), as an absolute time.
  const reach0 = Math.min(params.preStartS, params.postStartS, params.lateStartS);
  const reach1 = Math.max(params.preEndS, params.postEndS, params.lateEndS);
  const refTimes = groups.map((idx) => {
    const taus = idx.map((i) => tau[i]).filter((v) => v === v && v + reach0 >= 0);
    const out: number[] = [];
    if (taus.length === 0) return Float64Array.of();
    for (let r = 0; r < refStarts.length; r++) {
      const len = refStops[r] - refStarts[r];
      for (let k = 0; k < taus.length; k++) {
        const ta = taus[(r + k) % taus.length];
        if (ta + reach1 <= len) {
          out.push(refStarts[r] + ta);
          break;
        }
      }
    }
    return Float64Array.from(out);
  });
  const nUnits = recording.units.length;
  const perKindUnits: JumpUnitResult[][] = kindNames.map(() => []);
  const controlledCount = new Array<number>(kindNames.length).fill(0);
  const preLen = params.preEndS - params.preStartS;
  const postLen = params.postEndS - params.postStartS;
  const lateLen = params.lateEndS - params.lateStartS;

  // Buffers reused across units (jumpUnit keeps only the PSTH, which is new per unit).
  const scratch: ReferenceProfileScratch = { count: new Float64Array(0), cover: new Float64Array(0), integral: new Float64Array(0) };
  const buffers = groups.map((idx, g) => {
    const n = idx.length;
    return {
      pre: new Float64Array(n), post: new Float64Array(n), late: new Float64Array(n),
      cPost: new Float64Array(n), cLate: new Float64Array(n), size: Float64Array.from(idx, (i) => sizeAll[i]),
      refPre: new Float64Array(refTimes[g].length), refPost: new Float64Array(refTimes[g].length), refLate: new Float64Array(refTimes[g].length),
    };
  });
  const counts = new Float64Array(nPsth);
  // Window edges relative to each jump: pre, post (answer), late.
  const edges = Float64Array.of(params.preStartS, params.preEndS, params.postStartS, params.postEndS, params.lateStartS, params.lateEndS);
  const inWindows = new Float64Array(3);
  const jumpOpts = { minEvents: params.minEvents, exactMaxN: params.exactMaxN, zThreshold: params.zThreshold, runBins: params.latencyRunBins, shapeTestsBelowP: params.alpha };

  for (let u = 0; u < nUnits; u++) {
    const st = recording.units[u].spikeTimes;
    const rateHz = st.length > 1 ? (st.length - 1) / (st[st.length - 1] - st[0]) : 0;
    const profile: ReferenceProfile | null = refStarts.length > 0 ? referenceProfile(st, refStarts, refStops, profileLength, 0.001, scratch) : null;
    for (let g = 0; g < groups.length; g++) {
      const idx = groups[g];
      const n = idx.length;
      const { pre, post, late, cPost, cLate, size, refPre, refPost, refLate } = buffers[g];
      // the reference samples' window rates (no PSTH: nBins 0)
      const rt = refTimes[g];
      let rh = 0;
      for (let k = 0; k < rt.length; k++) {
        rh = eventWindowCounts(st, rt[k], edges, inWindows, psthStartS, binS, 0, counts, rh, rateHz);
        refPre[k] = inWindows[0] / preLen;
        refPost[k] = inWindows[1] / postLen;
        refLate[k] = inWindows[2] / lateLen;
      }
      cPost.fill(0);
      cLate.fill(0);
      const psth = new Float64Array(nPsth);
      counts.fill(0);
      let controlled = 0;
      let hint = 0;
      for (let e = 0; e < n; e++) {
        const i = idx[e];
        const t = all.times[i];
        // Spikes in the three windows and the event-averaged PSTH counts, one walk (eventWindowCounts).
        hint = eventWindowCounts(st, t, edges, inWindows, psthStartS, binS, nPsth, counts, hint, rateHz);
        pre[e] = inWindows[0] / preLen;
        post[e] = inWindows[1] / postLen;
        late[e] = inWindows[2] / lateLen;
        const ta = tau[i];
        if (profile && ta === ta) {
          const rPre = profile.meanRate(ta + params.preStartS, ta + params.preEndS);
          const rPost = profile.meanRate(ta + params.postStartS, ta + params.postEndS);
          const rLate = profile.meanRate(ta + params.lateStartS, ta + params.lateEndS);
          if (rPre === rPre && rPost === rPost && rLate === rLate) {
            cPost[e] = rPost - rPre;
            cLate[e] = rLate - rPre;
            controlled++;
            profile.addBins(ta + psthStartS, binS, nPsth, -1 / n, psth);
          }
        }
      }
      for (let j = 0; j < nPsth; j++) psth[j] += counts[j] / (binS * n);
      if (u === 0) controlledCount[g] = controlled;
      perKindUnits[g].push(jumpUnit({ pre, post, late, controlPost: cPost, controlLate: cLate, refPre, refPost, refLate, psth, psthStartS, binS, size }, params, jumpOpts));
    }
  }

  const kinds: JumpKindResult[] = kindNames.map((kind, g) => {
    const units = perKindUnits[g];
    const q = benjaminiHochberg(Float64Array.from(units, (r) => r.p));
    const verdict: string[] = [];
    const shape: string[] = [];
    const reason: string[] = [];
    const a = params.alpha;
    units.forEach((r, u) => {
      if (!(r.p === r.p)) {
        verdict.push('none');
        shape.push('');
        reason.push(r.nEvents < params.minEvents ? `only ${r.nEvents} events (fewer than ${params.minEvents})` : 'no spikes around the events');
        return;
      }
      const stats =
        r.test === 'rank-sum'
          ? `rank-sum of ${r.nEvents} events vs ${r.nReference} reference-trial samples p ${formatP(r.p)}, q ${formatP(q[u])}`
          : `signed-rank on ${r.nEvents} events (no matched control) p ${formatP(r.p)}, q ${formatP(q[u])}`;
      if (q[u] < a && r.direction !== 0 && r.direction !== Math.sign(r.deltaHz)) {
        verdict.push('none');
        shape.push('');
        reason.push(`${stats} < ${a}, but the ranks point ${r.direction > 0 ? 'up' : 'down'} while the controlled mean change is ${r.deltaHz >= 0 ? '+' : ''}${r.deltaHz.toPrecision(3)} Hz: no call`);
        return;
      }
      if (q[u] < a && r.direction !== 0) {
        const up = r.direction > 0;
        verdict.push(up ? 'excited' : 'suppressed');
        const lateSame = r.lateP < a && r.lateDirection === r.direction;
        const decays = r.decayP < a && r.decayDirection === r.direction;
        const sh = lateSame ? (decays ? 'partial' : 'step') : decays ? 'transient' : 'unclear';
        shape.push(sh);
        reason.push(
          `${r.deltaHz >= 0 ? '+' : ''}${r.deltaHz.toPrecision(3)} Hz after the jump: ${stats} < ${a}; ${sh} (late change ${r.lateDeltaHz.toPrecision(3)} Hz, p ${formatP(r.lateP)}; decay p ${formatP(r.decayP)})`,
        );
      } else {
        verdict.push('none');
        shape.push('');
        reason.push(`${stats} >= ${a}`);
      }
    });
    const hasSize = groups[g].some((i) => sizeAll[i] === sizeAll[i]);
    return { kind, nEvents: groups[g].length, nControlled: controlledCount[g], nReferenceSamples: refTimes[g].length, units, q, verdict, shape, reason, hasSize };
  });
  return { kinds, nReferenceTrials: refStarts.length, note: all.note, psthStartS, psthBinS: binS };
}
