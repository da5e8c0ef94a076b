import { describe, expect, it } from 'vitest';
import { InputError } from '../../../core/errors';
import { buildRecording, type RecordingTables, type SpikeColumns } from '../../../core/io/build-recording';

const rowOf = (i: number) => i + 2; // header on line 1
function spikes(units: string[], times: number[]): SpikeColumns {
  const ids: string[] = [];
  const code = new Map<string, number>();
  const unit = Int32Array.from(units, (u) => {
    let c = code.get(u);
    if (c === undefined) {
      code.set(u, (c = ids.length));
      ids.push(u);
    }
    return c;
  });
  return { file: 'spikes.csv', rowOf, columns: { unit: 'unit', time: 'time' }, unitIds: ids, unit, time: Float64Array.from(times) };
}
const base = (s: SpikeColumns, extra: Partial<RecordingTables> = {}): RecordingTables => ({ spikes: s, toleranceS: 1, ...extra });
function message(f: () => unknown): string {
  try {
    f();
  } catch (e) {
    expect(e).toBeInstanceOf(InputError);
    return (e as Error).message;
  }
  throw new Error('expected an InputError');
}

describe('buildRecording', () => {
  it('groups, sorts and orders units naturally; span from the inputs', () => {
    const { recording, warnings } = buildRecording(base(spikes(['10', '2', '2', 'a', '10'], [5, 3, 1, 2, 4])));
    expect(recording.units.map((u) => u.id)).toEqual(['2', '10', 'a']);
    expect(Array.from(recording.units[0].spikeTimes)).toEqual([1, 3]);
    expect(Array.from(recording.units[1].spikeTimes)).toEqual([4, 5]);
    expect(recording.span).toEqual([0, 5]);
    expect(recording.spanSource).toBe('inputs');
    expect(warnings).toEqual([expect.objectContaining({ code: 'unsorted-spikes', count: 2 })]);
  });

  it('counts duplicate spike times and units without spikes', () => {
    const s = spikes(['1', '1', '1'], [1, 1, 2]);
    const { recording, warnings } = buildRecording(
      base(s, { unitInfo: { file: 'unit_info.csv', rowOf, columns: { unit: 'unit' }, ids: ['0', '1'], meta: { depth: Float64Array.from([100, NaN]), label: ['good', 'mua'] } } }),
    );
    expect(recording.units.map((u) => u.id)).toEqual(['0', '1']);
    expect(recording.units[0].spikeTimes.length).toBe(0);
    expect(recording.units[0].meta).toEqual({ depth: 100, label: 'good' });
    expect(recording.units[1].meta).toEqual({ label: 'mua' });
    expect(warnings.map((w) => [w.code, w.count])).toEqual([
      ['duplicate-spike-times', 1],
      ['units-without-spikes', 1],
    ]);
  });

  it('infers trains and their frequency from inter-pulse intervals', () => {
    // singles at 1 s spacing, then a 10 Hz train of 4 pulses, then a 20 Hz train of 3
    const onset = [1, 2, 3, 10, 10.1, 10.2, 10.3, 20, 20.05, 20.1];
    const { recording } = buildRecording(
      base(spikes(['1'], [30]), { pulses: { file: 'pulses.csv', rowOf, columns: { onset: 'onset' }, onset: Float64Array.from(onset) } }),
    );
    expect(Array.from(recording.pulses.train)).toEqual([0, 1, 2, 3, 3, 3, 3, 4, 4, 4]);
    const f = Array.from(recording.pulses.frequencyHz);
    expect(f.slice(0, 3).every(Number.isNaN)).toBe(true);
    for (const x of f.slice(3, 7)) expect(x).toBeCloseTo(10, 9);
    for (const x of f.slice(7)) expect(x).toBeCloseTo(20, 9);
  });

  it('sorts events and trials and keeps covariates aligned', () => {
    const { recording } = buildRecording(
      base(spikes(['1'], [30]), {
        events: { file: 'events.csv', rowOf, columns: { time: 'time', label: 'event', trial: 'trial' }, time: Float64Array.from([5, 1]), label: ['reward', 'tone'], trial: Float64Array.from([2, 1]) },
        trials: {
          file: 'trials.csv', rowOf, columns: { trial: 'trial', start: 'start', stop: 'stop' },
          trial: Float64Array.from([2, 1]), start: Float64Array.from([4, 0]), stop: Float64Array.from([6, 3]),
          condition: ['probe', 'standard'], covariates: { speed: Float64Array.from([2.5, 1.5]), cue: ['b', 'a'] },
        },
      }),
    );
    expect(recording.events.label).toEqual(['tone', 'reward']);
    expect(Array.from(recording.events.trial)).toEqual([1, 2]);
    expect(recording.trials.condition).toEqual(['standard', 'probe']);
    expect(Array.from(recording.trials.covariates.speed as Float64Array)).toEqual([1.5, 2.5]);
    expect(recording.trials.covariates.cue).toEqual(['a', 'b']);
  });

  it.each([
    ['NaN time', base(spikes(['1', '1'], [1, NaN])), /spikes\.csv, row 3, column "time": time is not a finite number/],
    ['infinite time', base(spikes(['1'], [Infinity])), /row 2, column "time": time is not a finite number/],
    ['negative time', base(spikes(['1', '1'], [1, -0.5])), /row 3, column "time": time is negative/],
    ['empty table', base(spikes([], [])), /spikes\.csv: the spike table has no rows/],
    ['empty unit id', base(spikes(['1', ''], [1, 2])), /spikes\.csv, row 3, column "unit": the unit id is empty/],
    [
      'unknown unit',
      base(spikes(['1', '7'], [1, 2]), { unitInfo: { file: 'unit_info.csv', rowOf, columns: { unit: 'unit' }, ids: ['1'], meta: {} } }),
      /spikes\.csv, row 3, column "unit": unit "7" has spikes but is not listed in unit_info\.csv/,
    ],
    [
      'ms labelled as seconds (span from inputs)',
      base(spikes(['1', '1'], [1000, 3_600_000]), { events: { file: 'events.csv', rowOf, columns: { time: 'time', label: 'event' }, time: Float64Array.from([3500]), label: ['reward'] } }),
      /spikes\.csv, row 3, column "time": times run to 3600000 s, but events\.csv by 3500 s; this looks like milliseconds labelled as seconds/,
    ],
    [
      'beyond an explicit span',
      base(spikes(['1', '1'], [1, 102]), { span: { startS: 0, stopS: 100, source: 'manifest', file: 'session.json' } }),
      /row 3, column "time": time 102 s lies beyond the recording span \[0, 100\] s set by session\.json/,
    ],
    [
      'ms labelled as seconds (explicit span)',
      base(spikes(['1'], [90_000]), { span: { startS: 0, stopS: 100, source: 'manifest', file: 'session.json' } }),
      /looks like milliseconds labelled as seconds/,
    ],
    [
      'pulse outside the recording',
      base(spikes(['1'], [50]), {
        span: { startS: 10, stopS: 100, source: 'manifest', file: 'session.json' },
        pulses: { file: 'pulses.csv', rowOf, columns: { onset: 'onset' }, onset: Float64Array.from([20, 8.5]) },
      }),
      /pulses\.csv, row 3, column "onset": time lies before the recording span/,
    ],
    [
      'pulse ends after the recording',
      base(spikes(['1'], [50]), {
        span: { startS: 0, stopS: 100, source: 'manifest', file: 'session.json' },
        pulses: { file: 'pulses.csv', rowOf, columns: { onset: 'onset', duration: 'duration' }, onset: Float64Array.from([100.5]), duration: Float64Array.from([0.6]) },
      }),
      /pulses\.csv, row 2, column "onset": this laser pulse lies outside the recording \[0, 100\] s/,
    ],
    [
      'event trial unknown to trials',
      base(spikes(['1'], [50]), {
        events: { file: 'events.csv', rowOf, columns: { time: 'time', label: 'event', trial: 'trial' }, time: Float64Array.from([1]), label: ['reward'], trial: Float64Array.from([9]) },
        trials: { file: 'trials.csv', rowOf, columns: { trial: 'trial', start: 'start', stop: 'stop' }, trial: Float64Array.from([1]), start: Float64Array.from([0]), stop: Float64Array.from([2]) },
      }),
      /events\.csv, row 2, column "trial": trial 9 is not in trials\.csv/,
    ],
    [
      'binary file names the element',
      { spikes: { ...spikes(['1', '1'], [1, NaN]), file: 'spikes.npy', rowOf: undefined }, toleranceS: 1 } as RecordingTables,
      /spikes\.npy, element 1 \(0-based\), column "time"/,
    ],
  ])('%s', (_name, tables, re) => {
    expect(message(() => buildRecording(tables))).toMatch(re);
  });

  it('accepts times within the tolerance of an explicit span', () => {
    const { recording } = buildRecording(base(spikes(['1'], [100.5]), { span: { startS: null, stopS: 100, source: 'manifest', file: 'session.json' } }));
    expect(recording.span).toEqual([0, 100]);
    expect(recording.spanSource).toBe('manifest');
  });

  it('accepts spikes running long after a short light block when unit rates are plausible in seconds, with a warning', () => {
    // 3 units at 0.5, 2 and 5 Hz over 3600 s (regular trains), pulses only in the first 10 s: ratio 360 > 300
    const ids: string[] = [];
    const times: number[] = [];
    [0.5, 2, 5].forEach((hz, u) => {
      for (let t = 0.1 + u * 0.01; t < 3600; t += 1 / hz) {
        ids.push(String(u + 1));
        times.push(t);
      }
    });
    const pulses = { file: 'pulses.csv', rowOf, columns: { onset: 'onset' }, onset: Float64Array.from([1, 3, 5, 7, 9.99]) };
    const { recording, warnings } = buildRecording(base(spikes(ids, times), { pulses }));
    expect(recording.span[1]).toBeCloseTo(times.reduce((a, b) => Math.max(a, b)), 9);
    const w = warnings.find((x) => x.code === 'inputs-end-early')!;
    // median rate 2 Hz (the middle unit; spikes / (last spike - 0))
    expect(w.message).toMatch(/^spike times run to 3599\.\d+ s but pulses\.csv by 9\.99 s; accepted as seconds because the units' median rate over that span \(2 Hz\) is plausible/);
    // the same spikes in milliseconds (x1000): median 0.002 Hz, refused (the hint follows the ratio to the pulses)
    expect(message(() => buildRecording(base(spikes(ids, times.map((t) => t * 1000)), { pulses })))).toMatch(/times run to 3599920 s, but pulses\.csv by 9\.99 s; this looks like .* labelled as seconds/);
  });
});

describe('buildRecording: sharedMemory option', () => {
  // unsorted rows, a duplicate time, a unit listed without spikes (unit-info row "0"), and a one-spike unit
  const s = spikes(['2', '1', '2', '1', '3', '2'], [5, 1, 3, 1, 0, 4]);
  const tables = base(s, { unitInfo: { file: 'unit_info.csv', rowOf, columns: { unit: 'unit' }, ids: ['0', '1', '2', '3'], meta: {} } });

  it('puts every unit on one SharedArrayBuffer; values and warnings equal the default path', () => {
    const plain = buildRecording(tables);
    const shared = buildRecording(tables, { sharedMemory: true });
    const buffers = new Set(shared.recording.units.map((u) => u.spikeTimes.buffer));
    expect(buffers.size).toBe(1);
    const [buf] = buffers;
    expect(buf).toBeInstanceOf(SharedArrayBuffer);
    expect(buf.byteLength).toBe(6 * 8); // exactly the spikes, no more
    expect(shared.recording.units.map((u) => [u.id, Array.from(u.spikeTimes)])).toEqual([
      ['0', []],
      ['1', [1, 1]],
      ['2', [3, 4, 5]],
      ['3', [0]],
    ]);
    expect(shared.recording.units.map((u) => Array.from(u.spikeTimes))).toEqual(plain.recording.units.map((u) => Array.from(u.spikeTimes)));
    expect(shared.warnings).toEqual(plain.warnings);
    expect(shared.recording.span).toEqual(plain.recording.span);
  });

  it('is off by default and when false: plain ArrayBuffer', () => {
    for (const r of [buildRecording(tables), buildRecording(tables, { sharedMemory: false })]) {
      for (const u of r.recording.units) expect(u.spikeTimes.buffer).toBeInstanceOf(ArrayBuffer);
    }
  });

  it('survives structured cloning as shared memory (what posting to a worker does): the clone sees later writes', () => {
    const r = buildRecording(tables, { sharedMemory: true });
    const st = r.recording.units[2].spikeTimes;
    const clone = structuredClone(st);
    expect(clone.buffer).toBeInstanceOf(SharedArrayBuffer);
    expect(Array.from(clone)).toEqual([3, 4, 5]);
    const before = st[0];
    st[0] = 99; // shared, not copied: the clone sees it
    expect(clone[0]).toBe(99);
    st[0] = before;
  });
});
