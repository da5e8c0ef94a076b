import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { encodeNpy } from '../../../../core/io/encode-npy';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { InputError } from '../../../../core/errors';
import { findKernelEntry } from '../../../../core/kernels/kernel-library';
import { predictTraceDirect } from '../../../../core/kernels/predict-trace-direct';
import { createPredictCommand } from '../../../../core/node/commands/predict';
import { captureIo, memoryLoader } from '../../../helpers/memory-session';
import { makeRecording } from '../../../helpers/recording';

const rec = makeRecording({
  units: [
    { id: 'u1', spikes: [0.1234, 0.5, 0.51, 1.7, 2.2] },
    { id: 'u2', spikes: [0.3, 1.0] },
  ],
  span: [0, 3],
});
const cmd = createPredictCommand(memoryLoader(rec));
const dir = mkdtempSync(join(tmpdir(), 'tagbench-predict-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

const readCsv = (f: string) => {
  const [head, ...rows] = readFileSync(f, 'utf8').trim().split('\n');
  return { head: head.split(','), rows: rows.map((r) => r.split(',').map(Number)) };
};

describe('tagbench predict', () => {
  it('writes the library kernel prediction of one unit, equal to direct summation', async () => {
    const out = join(dir, 'u1.csv');
    const io = captureIo();
    expect(await cmd.run(['demo', '--kernel', 'jGCaMP8f', '--unit', 'u1', '--rate', '100', '--out', out], io)).toBe(0);
    const { head, rows } = readCsv(out);
    expect(head).toEqual(['time_s', 'predicted']);
    expect(rows.length).toBe(301);
    const e = findKernelEntry('jGCaMP8f')!;
    const direct = predictTraceDirect(rec.units[0].spikeTimes, { kind: 'double-exponential', tauRiseS: e.tauRiseS, tauDecayS: e.tauDecayS, peakDff: 0.41 }, { startS: 0, rateHz: 100, length: 301 });
    // CSV keeps 6 significant digits: each value within 5e-6 of itself relative.
    rows.forEach((r, k) => expect(Math.abs(r[1] - direct[k])).toBeLessThanOrEqual(5e-6 * Math.abs(direct[k]) + 1e-15));
    expect(io.err.join('')).toMatch(/jGCaMP8f \(verified\).*dF\/F/);
  });
  it('population = mean of units; all = one column per unit; custom kernels', async () => {
    const pop = join(dir, 'pop.csv');
    const all = join(dir, 'all.csv');
    await cmd.run(['demo', '--kernel', 'double:20,200', '--rate', '50', '--out', pop], captureIo());
    await cmd.run(['demo', '--kernel', 'double:20,200', '--unit', 'all', '--rate', '50', '--out', all], captureIo());
    const p = readCsv(pop);
    const a = readCsv(all);
    expect(a.head).toEqual(['time_s', 'predicted_u1', 'predicted_u2']);
    p.rows.forEach((r, k) => expect(r[1]).toBeCloseTo((a.rows[k][1] + a.rows[k][2]) / 2, 5));
    const io = captureIo();
    await cmd.run(['demo', '--kernel', 'alpha:50', '--unit', 'u2', '--out', join(dir, 'alpha.csv')], io);
    expect(io.err.join('')).toMatch(/units of one spike/);
  });
  it('reads a sampled kernel file and a measured trace, and reports the fit', async () => {
    const kfile = join(dir, 'kernel.csv');
    writeFileSync(kfile, `value\n${Array.from({ length: 20 }, (_, j) => Math.exp(-j / 5) - Math.exp(-j)).join('\n')}\n`);
    const mfile = join(dir, 'measured.csv');
    // Measured = 3 x the unit prediction + 0.5 (exactly), at 50 Hz from 0 to 3 s.
    const e = findKernelEntry('GCaMP6f')!;
    const grid = { startS: 0, rateHz: 50, length: 151 };
    const y = predictTraceDirect(rec.units[0].spikeTimes, { kind: 'double-exponential', tauRiseS: e.tauRiseS, tauDecayS: e.tauDecayS, peakDff: 1 }, grid);
    writeFileSync(mfile, `time,value\n${Array.from(y, (v, k) => `${k / 50},${3 * v + 0.5}`).join('\n')}\n`);
    const io = captureIo();
    const out = join(dir, 'fit.csv');
    await cmd.run(['demo', '--kernel', 'GCaMP6f', '--unit', 'u1', '--measured', mfile, '--search', '--out', out], io);
    const msg = io.err.join('');
    expect(msg).toMatch(/measured = 3 x predicted \+ 0\.5; r = 1/);
    expect(msg).toMatch(/grid search: best rise 18\.82 ms, decay 180\.5 ms/);
    expect(readCsv(out).head).toEqual(['time_s', 'predicted', 'measured', 'predicted_fitted']);
    await cmd.run(['demo', '--kernel-file', kfile, '--kernel-rate', '100', '--unit', 'u1', '--out', join(dir, 'k.csv')], captureIo());
    expect(readCsv(join(dir, 'k.csv')).rows.length).toBe(91);
  });
  it('writes event-locked averages of the prediction', async () => {
    const withEvents = { ...rec, events: { time: Float64Array.of(1, 2), label: ['reward', 'reward'], trial: Float64Array.of(NaN, NaN), kind: ['', ''] } };
    const c2 = createPredictCommand(memoryLoader(withEvents));
    const out = join(dir, 'trace10.csv');
    const al = join(dir, 'aligned.csv');
    const io = captureIo();
    await c2.run(['demo', '--kernel', 'double:20,200', '--unit', 'u1', '--rate', '10', '--event', 'reward', '--event-window', '-0.5,0.5', '--aligned-out', al, '--out', out], io);
    const trace = readCsv(out).rows;
    const { head, rows } = readCsv(al);
    expect(head).toEqual(['offset_s', 'n', 'predicted_mean', 'predicted_sem']);
    expect(rows.length).toBe(10);
    // Offset 0 is row 5; events at 1 s and 2 s are grid samples 10 and 20 of the 10 Hz trace.
    expect(rows[5][0]).toBe(0);
    expect(rows[5][1]).toBe(2);
    expect(rows[5][2]).toBeCloseTo((trace[10][1] + trace[20][1]) / 2, 5);
    expect(io.err.join('')).toMatch(/aligned on reward: 2 events/);
    await expect(c2.run(['demo', '--event', 'lick', '--aligned-out', al, '--out', out], captureIo())).rejects.toThrow(/no events with this label/);
    await expect(c2.run(['demo', '--event', 'reward', '--out', out], captureIo())).rejects.toThrow(/go together/);
  });
  it.each([
    [['demo', '--kernel', 'GCaMP99', '--out', 'x.csv'], /unknown kernel.*jGCaMP8f/],
    [['demo', '--kernel', 'double:200,20', '--out', 'x.csv'], /rise < decay/],
    [['demo', '--kernel', 'jGCaMP8m'], /ending in \.csv/],
    [['demo', '--kernel', 'jGCaMP8m', '--unit', 'nope', '--out', 'x.csv'], /no such unit/],
    [['demo', '--search', '--out', 'x.csv'], /needs a measured trace/],
    [['demo', '--measured', '/no/such/file.csv', '--out', 'x.csv'], /cannot read the file/],
    [['demo', '--rate', '-5', '--out', 'x.csv'], /positive/],
  ])('rejects bad input with a clear message: %s', async (argv, msg) => {
    await expect(cmd.run([...argv], captureIo())).rejects.toThrow(InputError);
    await expect(cmd.run([...argv], captureIo())).rejects.toThrow(msg);
  });
  it('names the option that gives the sample rate of a trace or kernel without times', async () => {
    const m1 = join(dir, 'one-d.npy');
    writeFileSync(m1, encodeNpy(Float64Array.from({ length: 50 }, (_, k) => Math.sin(k))));
    await expect(cmd.run(['demo', '--kernel', 'GCaMP6f', '--measured', m1, '--out', join(dir, 'm.csv')], captureIo())).rejects.toThrow(
      /one-d\.npy: a 1-D \.npy file has no times\. Give --measured-rate HZ \(and --measured-start S\), or save an N x 2 array/,
    );
    const k1 = join(dir, 'kernel.csv');
    writeFileSync(k1, 'value\n0\n1\n0.5\n');
    await expect(cmd.run(['demo', '--kernel-file', k1, '--out', join(dir, 'k.csv')], captureIo())).rejects.toThrow(/kernel\.csv: no "time" column and no sample rate\. Add a time column in seconds, or give --kernel-rate HZ/);
  });
});
