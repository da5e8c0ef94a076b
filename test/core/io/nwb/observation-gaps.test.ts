// Units observed for only part of the session (core/io/nwb/observation-gaps.ts). Cases worked
// by hand: which pulses and trials fall outside each unit's observation intervals.
import { describe, expect, it } from 'vitest';
import { observationGapWarning, observationGaps } from '../../../../core/io/nwb/observation-gaps';
import { emptyEvents, emptyPulses, emptyTrials } from '../../../../core/model/empty';
import type { Recording, Unit } from '../../../../core/model/types';

const unit = (id: string, observedIntervals?: number[]): Unit => ({
  id,
  spikeTimes: new Float64Array(0),
  meta: {},
  ...(observedIntervals ? { observedIntervals: Float64Array.from(observedIntervals) } : {}),
});

function recording(units: Unit[], pulses: number[], trials: [number, number][], events: number[] = []): Recording {
  return {
    units,
    pulses: { ...emptyPulses(), onset: Float64Array.from(pulses) },
    events: { ...emptyEvents(), time: Float64Array.from(events), label: events.map(() => 'reward'), trial: new Float64Array(events.length).fill(NaN), kind: events.map(() => '') },
    trials: { ...emptyTrials(), trial: Float64Array.from(trials, (_, i) => i + 1), start: Float64Array.from(trials, (x) => x[0]), stop: Float64Array.from(trials, (x) => x[1]), condition: trials.map(() => '') },
    span: [0, 100],
    spanSource: 'observation-intervals',
    waveformSampleRateHz: NaN,
  };
}

describe('observationGaps', () => {
  const trials: [number, number][] = [[0, 10], [20, 30], [40, 50], [55, 65]];
  const pulses = [80, 85, 90, 95];

  it('counts pulses outside every interval and trials not inside one interval', () => {
    const rec = recording(
      [
        unit('a', [0, 100]), // everything observed
        unit('b', [0, 60, 70, 100]), // trial [55, 65] straddles the gap
        unit('c', [0, 87]), // pulses 90, 95 after the end
        unit('d'), // no intervals: nothing to say
        unit('e', [5, 45, 84, 100]), // trial [0, 10] starts before 5, [40, 50] ends after 45, [55, 65] in no interval; pulse 80 in the gap
      ],
      pulses,
      trials,
    );
    expect(observationGaps(rec)).toEqual([
      { unit: 'b', pulses: 0, trials: 1 },
      { unit: 'c', pulses: 2, trials: 0 },
      { unit: 'e', pulses: 1, trials: 3 },
    ]);
  });

  it('without trials, looks at the events; an interval edge counts as observed', () => {
    const rec = recording([unit('a', [10, 20]), unit('b', [0, 100])], [], [], [10, 15, 20, 25]);
    expect(observationGaps(rec)).toEqual([{ unit: 'a', pulses: 0, trials: 1 }]);
  });

  it('one warning naming the counts and the first unit; none without gaps', () => {
    expect(observationGapWarning([], 'x.nwb')).toEqual([]);
    const [w] = observationGapWarning([{ unit: 'c', pulses: 2, trials: 0 }, { unit: 'e', pulses: 1, trials: 2 }], 'x.nwb (/units/obs_intervals)');
    expect(w.code).toBe('partly-observed-units');
    expect(w.count).toBe(2);
    expect(w.file).toBe('x.nwb (/units/obs_intervals)');
    expect(w.message).toMatch(/^2 unit\(s\) were not observed during part of the light block or task \(obs_intervals: 2 miss laser pulses, 1 miss trials or events; e\.g\. unit c: 2 pulses, 0 trials or events outside\)\. tagbench counts/);
  });
});
