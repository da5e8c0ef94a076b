import type { Recording, Trials } from '../../core/model/types';
import { emptyEvents, emptyPulses, emptyTrials } from '../../core/model/empty';

/** A small in-memory recording for tests (invented data). */
export function makeRecording(p: {
  units?: { id: string; spikes: number[] | Float64Array }[];
  events?: { time: number; label: string; trial?: number; kind?: string }[];
  trials?: { trial: number; start: number; stop: number; condition?: string; covariates?: Record<string, number | string> }[];
  pulses?: { onset: number; frequencyHz?: number; train?: number }[];
  span?: [number, number];
}): Recording {
  const ev = p.events ?? [];
  const tr = p.trials ?? [];
  const pu = p.pulses ?? [];
  let trials: Trials = emptyTrials();
  if (tr.length) {
    const names = new Set<string>();
    for (const t of tr) for (const k of Object.keys(t.covariates ?? {})) names.add(k);
    const covariates: Record<string, Float64Array | string[]> = {};
    for (const k of names) {
      const vals = tr.map((t) => t.covariates?.[k]);
      covariates[k] = vals.every((v) => v === undefined || typeof v === 'number')
        ? Float64Array.from(vals, (v) => (v === undefined ? NaN : (v as number)))
        : vals.map((v) => (v === undefined ? '' : String(v)));
    }
    trials = {
      trial: Float64Array.from(tr, (t) => t.trial),
      start: Float64Array.from(tr, (t) => t.start),
      stop: Float64Array.from(tr, (t) => t.stop),
      condition: tr.map((t) => t.condition ?? ''),
      covariates,
    };
  }
  return {
    units: (p.units ?? []).map((u) => ({ id: u.id, spikeTimes: Float64Array.from(u.spikes), meta: {} })),
    events: ev.length
      ? {
          time: Float64Array.from(ev, (e) => e.time),
          label: ev.map((e) => e.label),
          trial: Float64Array.from(ev, (e) => e.trial ?? NaN),
          kind: ev.map((e) => e.kind ?? ''),
        }
      : emptyEvents(),
    trials,
    pulses: pu.length
      ? {
          onset: Float64Array.from(pu, (x) => x.onset),
          duration: Float64Array.from(pu, () => 0.005),
          train: Int32Array.from(pu, (x, i) => x.train ?? i),
          frequencyHz: Float64Array.from(pu, (x) => x.frequencyHz ?? NaN),
          powerMw: Float64Array.from(pu, () => NaN),
        }
      : emptyPulses(),
    span: p.span ?? [0, 100],
    spanSource: 'inputs',
    waveformSampleRateHz: NaN,
  };
}
