/**
 * eventWindowCounts (one walk per event) against what it replaces in the
 * jump test: lowerBound(t + b) - lowerBound(t + a) per window and
 * addWindowCounts for the PSTH (both checked in test/core/align). Identical
 * counts on random trains with bursts, spikes placed exactly on window and
 * bin edges, overlapping and empty windows, windows reaching outside the
 * PSTH, non-finite event times, and any hint.
 */
import { describe, expect, it } from 'vitest';
import { addWindowCounts } from '../../../core/align/add-window-counts';
import { lowerBound } from '../../../core/align/lower-bound';
import { eventWindowCounts } from '../../../core/classify/event-window-counts';
import { Rng } from '../../../core/random/rng';

function reference(st: Float64Array, t: number, edges: number[], psthStartS: number, binS: number, nBins: number, psth: Float64Array): number[] {
  const out = [0, 0, 0];
  for (let w = 0; w < 3; w++) {
    const a = t + edges[2 * w];
    const b = t + edges[2 * w + 1];
    out[w] = b > a ? lowerBound(st, b) - lowerBound(st, a) : 0;
  }
  if (Number.isFinite(t)) addWindowCounts(st, t + psthStartS, binS, nBins, psth, 0);
  return out;
}

describe('eventWindowCounts', () => {
  it('equals one search per window edge and addWindowCounts, for any hint', () => {
    const rng = new Rng(404);
    const layouts: { edges: number[]; psthStartS: number; binS: number; nBins: number }[] = [
      { edges: [-0.3, 0, 0, 0.3, 0.5, 1], psthStartS: -0.3, binS: 0.01, nBins: 130 }, // the defaults
      { edges: [-0.5, -0.1, -0.2, 0.4, 0.3, 0.3], psthStartS: -0.2, binS: 0.05, nBins: 8 }, // overlapping, one empty, windows outside the PSTH
      { edges: [0.2, 0.1, -1, 2, 0, 0.001], psthStartS: -1, binS: 0.1, nBins: 30 }, // an inverted window (counts 0)
    ];
    for (let rep = 0; rep < 30; rep++) {
      const rate = [0.5, 5, 60][rep % 3];
      const L = layouts[rep % layouts.length];
      const events = Float64Array.from({ length: 40 }, (_, k) => 3 + 4 * k + rng.uniform()).sort();
      const spikes: number[] = [];
      for (let x = rng.exponential() / rate; x < 170; x += rng.exponential() / rate) {
        spikes.push(x);
        if (rng.uniform() < 0.05) spikes.push(x, x + 0.0005); // duplicates and bursts
      }
      // spikes exactly on window edges and PSTH bin edges of some events
      for (let k = 0; k < events.length; k += 3) {
        for (const e of L.edges) spikes.push(events[k] + e);
        for (let j = 0; j <= L.nBins; j += 7) spikes.push(events[k] + L.psthStartS + j * L.binS);
      }
      const st = Float64Array.from(spikes).sort();
      if (rep % 5 === 4) events[10] = NaN;
      if (rep % 7 === 6) events[20] = Infinity;
      const psth = new Float64Array(L.nBins);
      const psthRef = new Float64Array(L.nBins);
      const got = new Float64Array(3);
      let hint = rep % 2 ? 0 : st.length; // a hint past every answer gallops back
      for (const t of events) {
        const want = reference(st, t, L.edges, L.psthStartS, L.binS, L.nBins, psthRef);
        hint = eventWindowCounts(st, t, L.edges, got, L.psthStartS, L.binS, L.nBins, psth, hint, rep % 3 === 0 ? NaN : rate * [1, 0.01, 50][rep % 3]);
        expect(Array.from(got), `rep ${rep} t ${t}`).toEqual(want);
      }
      expect(Array.from(psth), `rep ${rep} psth`).toEqual(Array.from(psthRef));
    }
  });
  it('counts nothing for an empty train', () => {
    const got = Float64Array.of(9, 9, 9);
    const psth = new Float64Array(4);
    eventWindowCounts(new Float64Array(0), 1, [-1, 0, 0, 1, 1, 2], got, -1, 0.5, 4, psth, 0);
    expect(Array.from(got)).toEqual([0, 0, 0]);
    expect(Array.from(psth)).toEqual([0, 0, 0, 0]);
  });
});
