import type { Recording, Warning } from '../../model/types';

/** Per unit with observation intervals: laser pulses and trials outside them. */
export interface ObservationGap {
  readonly unit: string;
  /** Pulses whose onset lies in no observed interval. */
  readonly pulses: number;
  /** Trials ([start, stop]) not inside one observed interval; without trials, events outside them. */
  readonly trials: number;
}

/**
 * Units observed for only part of the task or light block (NWB
 * obs_intervals): for each unit with observation intervals, the laser pulses
 * whose onset falls outside every interval, and the trials not lying inside
 * one interval (a session without trials: the events outside every
 * interval). Units without gaps are left out. Intervals must be sorted and
 * not overlapping (as the units-table reader leaves them); pulses, trials and
 * events sorted by time (as buildRecording leaves them). One forward walk per
 * unit and list.
 */
export function observationGaps(rec: Recording): ObservationGap[] {
  const out: ObservationGap[] = [];
  const useTrials = rec.trials.start.length > 0;
  for (const u of rec.units) {
    const iv = u.observedIntervals;
    if (!iv) continue;
    const pulses = outside(iv, rec.pulses.onset, rec.pulses.onset);
    const trials = useTrials ? outside(iv, rec.trials.start, rec.trials.stop) : outside(iv, rec.events.time, rec.events.time);
    if (pulses || trials) out.push({ unit: u.id, pulses, trials });
  }
  return out;
}

/** Items [a[i], b[i]] (sorted by a) not inside one interval of iv = [s0, e0, s1, e1, ...]. */
function outside(iv: Float64Array, a: Float64Array, b: Float64Array): number {
  let k = 0;
  let n = 0;
  for (let i = 0; i < a.length; i++) {
    while (k < iv.length && iv[k + 1] < a[i]) k += 2;
    if (!(k < iv.length && iv[k] <= a[i] && b[i] <= iv[k + 1])) n++;
  }
  return n;
}

/** The run.json warning for units with gaps (none without). */
export function observationGapWarning(gaps: readonly ObservationGap[], file: string): Warning[] {
  if (gaps.length === 0) return [];
  const p = gaps.filter((g) => g.pulses > 0).length;
  const t = gaps.filter((g) => g.trials > 0).length;
  const parts = [p ? `${p} miss laser pulses` : '', t ? `${t} miss trials or events` : ''].filter(Boolean).join(', ');
  const first = gaps[0];
  return [
    {
      code: 'partly-observed-units',
      file,
      count: gaps.length,
      message:
        `${gaps.length} unit(s) were not observed during part of the light block or task (obs_intervals: ${parts}; e.g. unit ${first.unit}: ${first.pulses} pulses, ${first.trials} trials or events outside). ` +
        'tagbench counts their unobserved time as time without spikes, so their light reliability, rates and ramp and jump measures are diluted: judge these units by hand, or analyse the observed part as its own session.',
    },
  ];
}
