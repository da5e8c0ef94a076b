import type { Recording } from './types';

/** What a session holds, in numbers a person checks after import. */
export interface RecordingSummary {
  readonly units: number;
  readonly spikes: number;
  /** Recording span, s, and where it came from. */
  readonly spanS: readonly [number, number];
  readonly spanSource: Recording['spanSource'];
  readonly pulses: number;
  /** Trains of two or more pulses, by nominal frequency (Hz; NaN = unknown), sorted by frequency. */
  readonly trainsByFrequency: readonly { frequencyHz: number; trains: number; pulses: number }[];
  /** Pulses that are not part of a train of two or more. */
  readonly singlePulses: number;
  /** First and last pulse onset, s (NaN without pulses). */
  readonly lightBlockS: readonly [number, number];
  /** Event counts per label, in order of first appearance. */
  readonly eventsByLabel: readonly { label: string; count: number; kinds: readonly string[] }[];
  /** Trial counts per condition ("" shown as "(none)"), in order of first appearance. */
  readonly trialsByCondition: readonly { condition: string; count: number }[];
  readonly hasWaveforms: boolean;
  readonly hasRaw: boolean;
}

/**
 * Counts what a recording holds, for the Session overview. One pass over each
 * table. Edge cases: an empty table gives empty lists; a train id shared by a
 * single pulse counts as a single pulse.
 */
export function summariseRecording(rec: Recording): RecordingSummary {
  let spikes = 0;
  for (const u of rec.units) spikes += u.spikeTimes.length;

  const trainSize = new Map<number, number>();
  for (let i = 0; i < rec.pulses.train.length; i++) trainSize.set(rec.pulses.train[i], (trainSize.get(rec.pulses.train[i]) ?? 0) + 1);
  const byFreq = new Map<string, { frequencyHz: number; trains: Set<number>; pulses: number }>();
  let single = 0;
  for (let i = 0; i < rec.pulses.onset.length; i++) {
    const t = rec.pulses.train[i];
    if ((trainSize.get(t) ?? 0) < 2) {
      single++;
      continue;
    }
    const f = rec.pulses.frequencyHz[i];
    const key = Number.isNaN(f) ? 'NaN' : String(f);
    if (!byFreq.has(key)) byFreq.set(key, { frequencyHz: f, trains: new Set(), pulses: 0 });
    const e = byFreq.get(key)!;
    e.trains.add(t);
    e.pulses++;
  }
  const trainsByFrequency = [...byFreq.values()]
    .map((e) => ({ frequencyHz: e.frequencyHz, trains: e.trains.size, pulses: e.pulses }))
    .sort((a, b) => (Number.isNaN(a.frequencyHz) ? 1 : Number.isNaN(b.frequencyHz) ? -1 : a.frequencyHz - b.frequencyHz));

  const ev = new Map<string, { count: number; kinds: Set<string> }>();
  for (let i = 0; i < rec.events.time.length; i++) {
    const l = rec.events.label[i];
    if (!ev.has(l)) ev.set(l, { count: 0, kinds: new Set() });
    const e = ev.get(l)!;
    e.count++;
    if (rec.events.kind[i]) e.kinds.add(rec.events.kind[i]);
  }
  const tr = new Map<string, number>();
  for (const c of rec.trials.condition) tr.set(c || '(none)', (tr.get(c || '(none)') ?? 0) + 1);

  const n = rec.pulses.onset.length;
  return {
    units: rec.units.length,
    spikes,
    spanS: [rec.span[0], rec.span[1]],
    spanSource: rec.spanSource,
    pulses: n,
    trainsByFrequency,
    singlePulses: single,
    lightBlockS: n > 0 ? [rec.pulses.onset[0], rec.pulses.onset[n - 1]] : [NaN, NaN],
    eventsByLabel: [...ev].map(([label, e]) => ({ label, count: e.count, kinds: [...e.kinds].sort() })),
    trialsByCondition: [...tr].map(([condition, count]) => ({ condition, count })),
    hasWaveforms: rec.units.some((u) => u.waveformMean !== undefined),
    hasRaw: rec.raw !== undefined,
  };
}
