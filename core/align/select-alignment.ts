import type { Recording } from '../model/types';
import { linkEventsToTrials } from './link-events-to-trials';
import type { AlignmentSet } from './types';

/** What to align on: events of one label (optionally one kind / condition), or laser pulse onsets. */
export type AlignmentSpec =
  | { readonly event: string; readonly kind?: string; readonly condition?: string }
  | { readonly pulses: true; readonly kind?: string; readonly condition?: string };

/**
 * The alignment rows for a raster or PSTH: every event with the given label
 * (or every laser pulse onset), linked to its trial (linkEventsToTrials: the
 * events' `trial` column when given, else the trial whose [start, stop) holds
 * it), with its kind and its trial's condition, filtered by kind and condition
 * when asked. Pulses get kind "single" or their train frequency ("10 Hz").
 * Events with non-finite times are dropped. An unknown label gives an empty
 * set (callers report it with the labels that exist).
 */
export function selectAlignment(recording: Recording, spec: AlignmentSpec): AlignmentSet {
  const { events, pulses, trials } = recording;
  let times: Float64Array;
  let trialRow: Int32Array;
  let kind: string[];
  if ('pulses' in spec) {
    times = pulses.onset;
    trialRow = linkEventsToTrials(times, null, trials);
    kind = Array.from(pulses.frequencyHz, (f) => (Number.isFinite(f) ? `${f} Hz` : 'single'));
  } else {
    const idx: number[] = [];
    for (let i = 0; i < events.time.length; i++) if (events.label[i] === spec.event && Number.isFinite(events.time[i])) idx.push(i);
    times = Float64Array.from(idx, (i) => events.time[i]);
    trialRow = linkEventsToTrials(times, Float64Array.from(idx, (i) => events.trial[i]), trials);
    kind = idx.map((i) => events.kind[i] ?? '');
  }
  const condition = Array.from(trialRow, (r) => (r >= 0 ? (trials.condition[r] ?? '') : ''));
  const keep: number[] = [];
  for (let i = 0; i < times.length; i++) {
    if (!Number.isFinite(times[i])) continue;
    if (spec.kind !== undefined && kind[i] !== spec.kind) continue;
    if (spec.condition !== undefined && condition[i] !== spec.condition) continue;
    keep.push(i);
  }
  // Sorted by time (events and pulses are sorted already; keep it guaranteed).
  keep.sort((a, b) => times[a] - times[b] || a - b);
  return {
    source: 'pulses' in spec ? 'pulses' : spec.event,
    times: Float64Array.from(keep, (i) => times[i]),
    trialRow: Int32Array.from(keep, (i) => trialRow[i]),
    kind: keep.map((i) => kind[i]),
    condition: keep.map((i) => condition[i]),
  };
}
