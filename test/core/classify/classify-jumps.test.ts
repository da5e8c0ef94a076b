/**
 * Jump classification on simulated sessions (test/helpers/task-session.ts;
 * varied ISI shapes, rates, gains). Criteria (issue 5): clear jump answers
 * found in >= 90 % of units; units without an answer (flat, or ramping
 * through the jump) called at no more than the nominal rate; a lasting step
 * is not reported as a transient. Binomial slack: nominal 5 % + 3 SD.
 */
import { describe, expect, it } from 'vitest';
import { DEFAULTS } from '../../../core/defaults';
import { classifyJumps } from '../../../core/classify';
import { taskSession, type UnitModel } from '../../helpers/task-session';

const P = DEFAULTS.jump;
const shapes = [0.7, 1, 3];
const bound = (n: number) => n * 0.05 + 3 * Math.sqrt(n * 0.05 * 0.95);

describe('classifyJumps on simulated sessions', () => {
  const units: UnitModel[] = [];
  const truth: { forward: string; backward: string; kind: string }[] = [];
  for (let i = 0; i < 40; i++) {
    // Transient bursts to forward jumps, dips to backward jumps.
    units.push({ rateHz: [5, 10, 20][i % 3], shape: shapes[i % 3], jump: { forward: { amplitude: 2.5, form: 'transient', tauS: 0.12 }, backward: { amplitude: -0.8, form: 'transient', tauS: 0.2 } } });
    truth.push({ forward: 'excited', backward: 'suppressed', kind: 'transient' });
  }
  for (let i = 0; i < 30; i++) {
    units.push({ rateHz: [6, 12][i % 2], shape: shapes[i % 3], jump: { forward: { amplitude: 1.0, form: 'step' }, backward: { amplitude: 1.0, form: 'step' } } });
    truth.push({ forward: 'excited', backward: 'excited', kind: 'step' });
  }
  for (let i = 0; i < 40; i++) {
    units.push({ rateHz: [3, 8, 16, 30][i % 4], shape: shapes[i % 3], gainSd: i % 2 ? 0.3 : 0 });
    truth.push({ forward: 'none', backward: 'none', kind: 'flat' });
  }
  for (let i = 0; i < 40; i++) {
    // Strong ramps through the jump times, no answer to the jumps.
    units.push({ rateHz: [10, 20][i % 2], shape: shapes[i % 3], rampChange: i % 2 ? 2 : -0.7 });
    truth.push({ forward: 'none', backward: 'none', kind: 'ramp' });
  }
  const rec = taskSession({ nTrials: 400, probeFraction: 0.3, units, seed: 77, rewardJitterS: 0.3 });
  const r = classifyJumps(rec, P);
  const byKind = Object.fromEntries(r.kinds.map((k) => [k.kind, k]));

  it('groups jumps by kind and controls every jump with reference trials', () => {
    expect(r.kinds.map((k) => k.kind)).toEqual(['backward', 'forward']);
    for (const k of r.kinds) {
      expect(k.nEvents).toBeGreaterThan(40);
      expect(k.nControlled).toBe(k.nEvents);
    }
    expect(r.nReferenceTrials).toBeGreaterThan(200);
  });

  it('finds >= 90 % of clear jump answers with the right sign', () => {
    for (const kind of ['forward', 'backward'] as const) {
      const k = byKind[kind];
      const answers = truth.map((t, i) => [t[kind], k.verdict[i]] as const).filter(([t]) => t !== 'none');
      const found = answers.filter(([t, v]) => t === v).length;
      expect(found / answers.length).toBeGreaterThanOrEqual(0.9);
      expect(answers.some(([t, v]) => v !== 'none' && v !== t)).toBe(false);
    }
  });

  it('calls flat and ramping units at no more than the nominal rate (the matched control absorbs the ramp)', () => {
    for (const kind of ['forward', 'backward'] as const) {
      const k = byKind[kind];
      for (const group of ['flat', 'ramp']) {
        const idx = truth.flatMap((t, i) => (t.kind === group ? [i] : []));
        const calls = idx.filter((i) => k.verdict[i] !== 'none').length;
        expect(calls, `${group} units called for ${kind}`).toBeLessThanOrEqual(bound(idx.length));
        const small = idx.filter((i) => k.units[i].p < 0.05).length;
        expect(small, `${group} units with p < 0.05 for ${kind}`).toBeLessThanOrEqual(bound(idx.length));
      }
    }
  });

  it('does not report a lasting step as a transient, and reports transients as such', () => {
    for (const kind of ['forward', 'backward'] as const) {
      const k = byKind[kind];
      const steps = truth.flatMap((t, i) => (t.kind === 'step' && k.verdict[i] !== 'none' ? [i] : []));
      expect(steps.length).toBeGreaterThan(20);
      const asTransient = steps.filter((i) => k.shape[i] === 'transient').length;
      expect(asTransient).toBeLessThanOrEqual(bound(steps.length));
      expect(steps.filter((i) => k.shape[i] === 'step').length / steps.length).toBeGreaterThanOrEqual(0.8);
      for (const i of steps) expect(k.units[i].transience).toBeLessThan(0.5);
    }
    const f = byKind.forward;
    const tr = truth.flatMap((t, i) => (t.kind === 'transient' && f.verdict[i] === 'excited' ? [i] : []));
    expect(tr.filter((i) => f.shape[i] === 'transient').length / tr.length).toBeGreaterThanOrEqual(0.8);
    const ti = tr.map((i) => f.units[i].transience).sort((a, b) => a - b);
    expect(ti[Math.floor(ti.length / 2)]).toBeGreaterThan(0.7);
    expect(ti.filter((v) => v > 0.5).length / ti.length).toBeGreaterThanOrEqual(0.8);
  });

  it('measures latency and peak of a transient burst (latency 30 ms, decay 120 ms)', () => {
    const f = byKind.forward;
    const lat: number[] = [];
    for (let i = 0; i < 40; i++) {
      const u = f.units[i];
      expect(u.peakDeltaHz).toBeGreaterThan(0);
      expect(u.peakS).toBeGreaterThanOrEqual(0);
      expect(u.peakS).toBeLessThan(0.2);
      expect(u.peakZ).toBeGreaterThan(2);
      if (u.latencyS === u.latencyS) lat.push(u.latencyS);
    }
    expect(lat.length).toBeGreaterThan(30);
    lat.sort((a, b) => a - b);
    const median = lat[Math.floor(lat.length / 2)];
    // Simulated onset 30 ms; 10 ms PSTH bins: the median detected onset should lie within 0-80 ms.
    expect(median).toBeGreaterThanOrEqual(0);
    expect(median).toBeLessThanOrEqual(0.08);
    // Peak change in Hz roughly amplitude x rate at the peak bin (2.5 x rate, diluted by the bin): > rate.
    expect(f.units[1].peakDeltaHz).toBeGreaterThan(10);
  });

  it('relates the answer to a numeric jump size (Spearman)', () => {
    const units2: UnitModel[] = Array.from({ length: 10 }, () => ({ rateHz: 15, shape: 1, jump: { forward: { amplitude: 2, form: 'transient', bySize: true } } }));
    const rec2 = taskSession({ nTrials: 500, probeFraction: 0.4, units: units2, seed: 78 });
    const f2 = classifyJumps(rec2, P).kinds.find((k) => k.kind === 'forward')!;
    expect(f2.hasSize).toBe(true);
    for (const u of f2.units) {
      expect(u.sizeRho).toBeGreaterThan(0);
    }
    expect(f2.units.filter((u) => u.sizeP < 0.05).length).toBeGreaterThanOrEqual(8);
  });

  it('sessions without jump events give no kinds; too few events give none with the reason', () => {
    const rec3 = taskSession({ nTrials: 10, units: [{ rateHz: 5, shape: 1 }], seed: 79 });
    const r3 = classifyJumps(rec3, P);
    expect(r3.kinds).toEqual([]);
    expect(r3.note).toBe('no "jump" events');
    const rec4 = taskSession({ nTrials: 12, probeFraction: 0.3, units: [{ rateHz: 5, shape: 1 }], seed: 80 });
    const r4 = classifyJumps(rec4, P);
    for (const k of r4.kinds) {
      if (k.nEvents < P.minEvents) {
        expect(k.verdict[0]).toBe('none');
        expect(k.reason[0]).toContain(`only ${k.nEvents} events`);
      }
    }
  });
});
