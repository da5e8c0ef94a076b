import { lowerBound } from '../align/lower-bound';
import type { Parameters } from '../defaults';
import { InputError } from '../errors';
import type { Recording } from '../model/types';
import { benjaminiHochberg } from '../stats/benjamini-hochberg';
import { formatP } from './format-p';
import { progressOccupancy } from './progress-occupancy';
import { progressRampUnit, type ProgressRampUnitResult } from './progress-ramp-unit';
import { progressSpikeCounts } from './progress-spike-counts';
import { rampPlan } from './ramp-plan';

export interface ProgressRampClassification {
  /** The behavioural variable (a column of behaviour.csv). */
  readonly variable: string;
  /** up | down | flat per unit, with the reason. */
  readonly verdict: string[];
  readonly reason: string[];
  readonly q: Float64Array;
  readonly units: ProgressRampUnitResult[];
  /** Range of the variable that was binned, its source, bin centres and width. */
  readonly range: readonly [number, number];
  readonly rangeSource: 'percentiles' | 'parameters';
  readonly centres: Float64Array;
  readonly binWidth: number;
  /** Ramp windows (trials) and the time they spent inside the range, s. */
  readonly nWindows: number;
  readonly occupiedS: number;
  /** How the trials were chosen, or why there is no test. */
  readonly note: string;
}

const PARAMS = 'analysis parameters (session.json "parameters" or --config)';

/**
 * The ramp over a sampled behavioural variable (issue 5: "expressed over a
 * numeric progress covariate"), when ramp.progressVariable names a column of
 * behaviour.csv; null when it is "" (the default).
 *
 * Windows: the ramp windows of the time ramp (rampPlan: the fixed window
 * before each `event` in trials of the reference condition, or each trial's
 * stretch from anchorEvent to event). The variable's range [progressMin,
 * progressMax] (default: the 1st and 99th percentiles, NumPy's linear
 * definition, of the samples inside the windows) is cut into progressBins
 * equal bins; per trial, spikes and time are assigned to bins by the
 * variable's interpolated value (progressSpikeCounts, progressOccupancy);
 * progressRampUnit tests the per-trial occupancy-weighted slopes (signed
 * rank) and fits the Poisson GLM; BH across units; verdict up/down when
 * q < alpha (direction from the signed-rank statistic), flat otherwise.
 *
 * Errors (InputError): the variable is named but the session has no
 * behavioural samples or no such variable; fewer than 2 bins; a range whose
 * minimum is not below its maximum.
 */
export function classifyProgressRamps(recording: Recording, params: Parameters['ramp']): ProgressRampClassification | null {
  const name = params.progressVariable;
  if (name === '') return null;
  const b = recording.behaviour;
  if (!b) {
    throw new InputError({ file: PARAMS, column: 'ramp.progressVariable', value: name, problem: 'names a behavioural variable, but the session has no behavioural samples', fix: 'add behaviour.csv (columns time and one per variable) to the session folder, or set ramp.progressVariable to ""' });
  }
  const values = b.variables.get(name);
  if (!values) {
    throw new InputError({ file: PARAMS, column: 'ramp.progressVariable', value: name, problem: `is not a column of the behavioural samples (they hold: ${[...b.variables.keys()].join(', ')})`, fix: 'use one of those names (they are case-sensitive)' });
  }
  const nBins = params.progressBins;
  if (!Number.isInteger(nBins) || nBins < 2) {
    throw new InputError({ file: PARAMS, column: 'ramp.progressBins', value: String(nBins), problem: 'expected a whole number of bins, at least 2' });
  }

  // Windows of the time ramp.
  const plan = rampPlan(recording, params, params.condition);
  const starts: number[] = [];
  const stops: number[] = [];
  if (plan.mode === 'fixed') {
    for (const a of plan.times) {
      starts.push(a + params.windowStartS);
      stops.push(a + params.windowEndS);
    }
  } else if (plan.anchors) {
    const A = plan.anchors;
    for (let r = 0; r < A.trials; r++) {
      if (!A.valid[r]) continue;
      starts.push(A.times[r * 2]);
      stops.push(A.times[r * 2 + 1]);
    }
  }
  const nW = starts.length;

  // Range: given, or percentiles of the samples inside the windows.
  let lo = params.progressMin;
  let hi = params.progressMax;
  const rangeSource = lo !== null && hi !== null ? 'parameters' : 'percentiles';
  if (lo === null || hi === null) {
    const inside: number[] = [];
    const order = Int32Array.from({ length: nW }, (_, k) => k).sort((x, y) => starts[x] - starts[y]);
    let i = 0;
    for (const k of order) {
      while (i > 0 && b.time[i - 1] >= starts[k]) i--;
      while (i < b.time.length && b.time[i] < starts[k]) i++;
      for (let s = i; s < b.time.length && b.time[s] < stops[k]; s++) inside.push(values[s]);
    }
    const sorted = Float64Array.from(inside).sort();
    if (lo === null) lo = percentile(sorted, 1);
    if (hi === null) hi = percentile(sorted, 99);
  }
  const flat = (note: string): ProgressRampClassification => ({
    variable: name,
    verdict: recording.units.map(() => 'flat'),
    reason: recording.units.map(() => note),
    q: new Float64Array(recording.units.length).fill(NaN),
    units: [],
    range: [lo ?? NaN, hi ?? NaN],
    rangeSource,
    centres: new Float64Array(0),
    binWidth: NaN,
    nWindows: nW,
    occupiedS: 0,
    note,
  });
  if (nW === 0) return flat(plan.note);
  if (!(lo! < hi!)) {
    if (rangeSource === 'parameters') {
      throw new InputError({ file: PARAMS, column: 'ramp.progressMin', value: `${lo} to ${hi}`, problem: 'the range of the progress variable must have its minimum below its maximum' });
    }
    return flat(`"${name}" does not vary inside the ramp windows (range ${lo} to ${hi})`);
  }
  const width = (hi! - lo!) / nBins;
  const centres = Float64Array.from({ length: nBins }, (_, j) => lo! + (j + 0.5) * width);
  const occupancy = progressOccupancy(b.time, values, starts, stops, lo!, width, nBins);
  let occupiedS = 0;
  for (const v of occupancy) occupiedS += v;
  if (!(occupiedS > 0)) return flat(`the behavioural samples do not cover the ramp windows`);

  const nUnits = recording.units.length;
  const counts = new Float64Array(nW * nBins);
  const sampleStarts = Int32Array.from(starts, (a) => lowerBound(b.time, a));
  const units: ProgressRampUnitResult[] = [];
  const p = new Float64Array(nUnits);
  for (let u = 0; u < nUnits; u++) {
    progressSpikeCounts(recording.units[u].spikeTimes, b.time, values, starts, stops, lo!, width, nBins, counts, sampleStarts);
    const r = progressRampUnit(counts, occupancy, nW, centres, params.minTrials, params.exactMaxN);
    units.push(r);
    p[u] = r.p;
  }
  const q = benjaminiHochberg(p);
  const verdict: string[] = [];
  const reason: string[] = [];
  const unit = `Hz per unit of ${name}`;
  for (let u = 0; u < nUnits; u++) {
    const r = units[u];
    if (!(r.p === r.p)) {
      verdict.push('flat');
      reason.push(r.nTrials < params.minTrials ? `only ${r.nTrials} trials with a slope over "${name}" (fewer than ${params.minTrials})` : `no spikes in the windows inside the range of "${name}"`);
      continue;
    }
    const disp = r.glmDispersion > 1.5 ? `; counts overdispersed (Pearson X2/df ${r.glmDispersion.toFixed(2)}), GLM p too small, not used` : '';
    const stats = `signed-rank on ${r.nNonZero} per-trial slopes p ${formatP(r.p)}, q ${formatP(q[u])}`;
    if (q[u] < params.alpha && r.direction !== 0) {
      const up = r.direction > 0;
      verdict.push(up ? 'up' : 'down');
      reason.push(`${up ? 'rises' : 'falls'} with "${name}" (slope ${r.slopeHzPerUnit >= 0 ? '+' : ''}${r.slopeHzPerUnit.toPrecision(3)} ${unit}): ${stats} < ${params.alpha}${disp}`);
    } else {
      verdict.push('flat');
      reason.push(`${stats} >= ${params.alpha}${disp}`);
    }
  }
  return { variable: name, verdict, reason, q, units, range: [lo!, hi!], rangeSource, centres, binWidth: width, nWindows: nW, occupiedS, note: plan.note };
}

/** Percentile (0-100) of sorted values, NumPy's default linear interpolation; NaN when empty. */
function percentile(sorted: Float64Array, pct: number): number {
  const n = sorted.length;
  if (n === 0) return NaN;
  const pos = ((n - 1) * pct) / 100;
  const i = Math.floor(pos);
  const f = pos - i;
  return i + 1 < n ? sorted[i] + f * (sorted[i + 1] - sorted[i]) : sorted[i];
}
