import { describe, expect, it } from 'vitest';
import { assignTrains } from '../../../core/io/assign-trains';
import { detectLaserPulses } from '../../../core/io/detect-laser-pulses';

/**
 * Hand-made traces with known onsets (the check is the construction itself:
 * pulses are written at chosen samples, so onsets and widths are exact).
 */
function trace(fs: number, seconds: number, pulses: [number, number][], amp = 5, noise = 0): Float64Array {
  const x = new Float64Array(Math.round(fs * seconds));
  let seed = 7;
  for (let i = 0; i < x.length; i++) {
    seed = (seed * 1103515245 + 12345) >>> 0;
    x[i] = noise * (seed / 2 ** 32 - 0.5);
  }
  for (const [onS, widthS] of pulses) {
    const a = Math.round(onS * fs);
    const b = a + Math.round(widthS * fs);
    for (let i = a; i < b; i++) x[i] += amp;
  }
  return x;
}

describe('detectLaserPulses', () => {
  it('finds onsets and widths of a TTL trace to the sample', () => {
    const fs = 10_000;
    const pulses: [number, number][] = [[0.5, 0.005], [1.5, 0.005], [2.0, 0.01]];
    const d = detectLaserPulses(trace(fs, 3, pulses), { sampleRateHz: fs });
    expect(Array.from(d.onsetS)).toEqual([0.5, 1.5, 2.0]);
    expect(Array.from(d.durationS).map((w) => Math.round(w * fs))).toEqual([50, 50, 100]);
    expect(d.highThreshold).toBeCloseTo(3, 12);
    expect(d.lowThreshold).toBeCloseTo(2, 12);
  });

  it('hysteresis keeps a noisy analog pulse whole', () => {
    const fs = 20_000;
    // noise of +-0.6 around each level: crosses a single 50 % threshold inside the pulse, never both 40/60 % levels
    const x = trace(fs, 1, [[0.2, 0.005], [0.6, 0.005]], 5, 1.2);
    // dips inside the pulses down to 45 % of the amplitude
    x[Math.round(0.2 * fs) + 30] = 2.3;
    x[Math.round(0.6 * fs) + 50] = 2.3;
    const d = detectLaserPulses(x, { sampleRateHz: fs, highThreshold: 3, lowThreshold: 2 });
    expect(d.onsetS.length).toBe(2);
    expect(d.onsetS[0]).toBeCloseTo(0.2, 3);
    expect(d.onsetS[1]).toBeCloseTo(0.6, 3);
    const single = detectLaserPulses(x, { sampleRateHz: fs, highThreshold: 2.5, lowThreshold: 2.5 });
    expect(single.onsetS.length).toBeGreaterThan(2); // without hysteresis the dips split the pulses
  });

  it('drops glitches shorter than the minimum width and reports an unterminated pulse', () => {
    const fs = 10_000;
    const x = trace(fs, 1, [[0.1, 0.0002], [0.3, 0.005], [0.999, 0.01]]);
    const d = detectLaserPulses(x, { sampleRateHz: fs, minWidthS: 0.001, startS: 100 });
    expect(Array.from(d.onsetS)).toEqual([100.3, 100.999]);
    expect(d.dropped).toBe(1);
    expect(d.unterminated).toBe(1);
  });

  it('a flat trace has no pulses', () => {
    const d = detectLaserPulses(new Float64Array(1000), { sampleRateHz: 1000 });
    expect(d.onsetS.length).toBe(0);
  });

  it('trains at 10 and 20 Hz after single pulses are grouped with their frequency', () => {
    const fs = 10_000;
    const p: [number, number][] = [];
    for (let k = 0; k < 5; k++) p.push([1 + k * 1.0, 0.005]); // singles at 1 Hz
    for (let k = 0; k < 10; k++) p.push([10 + k * 0.1, 0.005]); // 10 Hz train
    for (let k = 0; k < 10; k++) p.push([15 + k * 0.05, 0.005]); // 20 Hz train
    const d = detectLaserPulses(trace(fs, 20, p), { sampleRateHz: fs });
    expect(d.onsetS.length).toBe(25);
    const { train, frequencyHz } = assignTrains(d.onsetS);
    expect(new Set(train).size).toBe(5 + 2);
    expect(frequencyHz[4]).toBeNaN();
    expect(frequencyHz[5]).toBeCloseTo(10, 9);
    expect(frequencyHz[24]).toBeCloseTo(20, 9);
    expect(train[5]).toBe(train[14]);
    expect(train[15]).toBe(train[24]);
    expect(train[14]).not.toBe(train[15]);
  });
});
