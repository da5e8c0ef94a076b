import type { Recording } from '../model/types';
import { eventTrialRows } from './event-trial-rows';

/** Events chosen for one analysis, sorted by time. */
export interface EventSelection {
  /** Event times, s. */
  readonly times: Float64Array;
  /** Index of each chosen event in recording.events. */
  readonly eventIndex: Int32Array;
  /** Trial-table row of each chosen event (-1 when the event lies in no trial). */
  readonly trialRows: Int32Array;
  /** Condition of each chosen event's trial ("" when unknown). */
  readonly conditions: readonly string[];
  /** Event kind ("" when not given). */
  readonly kinds: readonly string[];
  /** Why nothing was chosen, or how the condition rule was applied (for reason strings / run.json). */
  readonly note: string;
}

/**
 * Events labelled `label`, restricted to trials of `condition`:
 * - condition "" : every such event;
 * - no trial table, or a trial table without any condition labels: every
 *   such event (the note says so);
 * - otherwise only events whose trial has that condition (events outside
 *   any trial are left out).
 * `condition === null` keeps every event but still reports each event's
 * condition (used for per-condition analyses).
 */
export function selectEvents(recording: Recording, label: string, condition: string | null): EventSelection {
  const { events, trials } = recording;
  const rows = eventTrialRows(events, trials);
  const hasConditions = trials.condition.some((c) => c !== '');
  const idx: number[] = [];
  let labelled = 0;
  for (let e = 0; e < events.time.length; e++) {
    if (events.label[e] !== label) continue;
    labelled++;
    if (condition === null || condition === '' || !hasConditions) {
      idx.push(e);
      continue;
    }
    const r = rows[e];
    if (r >= 0 && trials.condition[r] === condition) idx.push(e);
  }
  let note: string;
  if (labelled === 0) note = `no "${label}" events`;
  else if (idx.length === 0) note = `no "${label}" events in trials of condition "${condition}"`;
  else if (condition === null || condition === '') note = `all ${idx.length} "${label}" events`;
  else if (trials.trial.length === 0) note = `no trial table: all ${idx.length} "${label}" events used`;
  else if (!hasConditions) note = `trials have no condition labels: all ${idx.length} "${label}" events used`;
  else note = `${idx.length} "${label}" events in trials of condition "${condition}"`;
  const eventIndex = Int32Array.from(idx);
  return {
    times: Float64Array.from(idx, (e) => events.time[e]),
    eventIndex,
    trialRows: Int32Array.from(idx, (e) => rows[e]),
    conditions: idx.map((e) => (rows[e] >= 0 ? trials.condition[rows[e]] : '')),
    kinds: idx.map((e) => events.kind[e]),
    note,
  };
}
