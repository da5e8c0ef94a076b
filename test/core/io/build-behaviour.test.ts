/**
 * Sampled behavioural variables (behaviour.csv): import, sorting, and every
 * error a user can make, each a one-paragraph InputError naming file, row,
 * column and value (DESIGN.md section 8).
 */
import { describe, expect, it } from 'vitest';
import { InputError } from '../../../core/errors';
import { buildBehaviour } from '../../../core/io/build-behaviour';
import { importSession } from '../../../core/io/import-session';
import { memorySource } from '../../helpers/memory-source';

const SPIKES = 'unit,time\n1,0.5\n2,1.5\n1,2.5\n';

async function errorOf(files: Record<string, string>): Promise<string> {
  try {
    await importSession(memorySource({ 'spikes.csv': SPIKES, ...files }));
  } catch (e) {
    expect(e).toBeInstanceOf(InputError);
    return (e as Error).message;
  }
  throw new Error('expected an InputError');
}

describe('behaviour.csv', () => {
  it('reads time plus one numeric column per variable, in file order', async () => {
    const r = await importSession(memorySource({ 'spikes.csv': SPIKES, 'behaviour.csv': 'time,position,progress\n0,0,0\n0.5,10.5,0.25\n1.25,30,1\n' }));
    const b = r.recording.behaviour!;
    expect(Array.from(b.time)).toEqual([0, 0.5, 1.25]);
    expect([...b.variables.keys()]).toEqual(['position', 'progress']);
    expect(Array.from(b.variables.get('position')!)).toEqual([0, 10.5, 30]);
    expect(r.inputs.map((i) => i.file)).toContain('behaviour.csv');
    expect(r.warnings).toEqual([]);
  });

  it('sorts rows given out of order (stable) and says so', async () => {
    const r = await importSession(memorySource({ 'spikes.csv': SPIKES, 'behaviour.tsv': 'time\tx\n2\t20\n0\t0\n1\t10\n' }));
    expect(Array.from(r.recording.behaviour!.time)).toEqual([0, 1, 2]);
    expect(Array.from(r.recording.behaviour!.variables.get('x')!)).toEqual([0, 10, 20]);
    expect(r.warnings.map((w) => w.code)).toEqual(['unsorted-behaviour']);
  });

  it('honours session.json: file name, time column, time unit, and null to skip', async () => {
    const manifest = JSON.stringify({ behaviour: { file: 'tracking/pos.csv', columns: { time: 't_ms' }, time_unit: 'ms' } });
    const r = await importSession(memorySource({ 'spikes.csv': SPIKES, 'session.json': manifest, 'tracking/pos.csv': 't_ms,pos\n0,1\n500,2\n' }));
    expect(Array.from(r.recording.behaviour!.time)).toEqual([0, 0.5]);
    const skipped = await importSession(memorySource({ 'spikes.csv': SPIKES, 'session.json': '{"behaviour": null}', 'behaviour.csv': 'time,x\n0,0\n1,1\n' }));
    expect(skipped.recording.behaviour).toBeUndefined();
  });

  it('names file, row, column and value for each error', async () => {
    expect(await errorOf({ 'behaviour.csv': 'time,x\n0,0\n1,abc\n' })).toMatch(/^behaviour\.csv, row 3, column "x": the value is not a number \(value "abc"\)/);
    expect(await errorOf({ 'behaviour.csv': 'time,x\n0,0\n1,\n2,3\n' })).toMatch(/^behaviour\.csv, row 3, column "x": the value is empty/);
    expect(await errorOf({ 'behaviour.csv': 'time,x\n0,0\n1,inf\n' })).toMatch(/row 3, column "x".*not a finite number/);
    expect(await errorOf({ 'behaviour.csv': 'time,x\n0,0\nnan,1\n' })).toMatch(/^behaviour\.csv, row 3, column "time": time is not a finite number/);
    expect(await errorOf({ 'behaviour.csv': 'time,x\n0,0\n1,1\n0,2\n' })).toMatch(/^behaviour\.csv, row 4, column "time": two samples share this time \(also row 2\)/);
    expect(await errorOf({ 'behaviour.csv': 'time\n0\n1\n' })).toMatch(/behaviour\.csv: has no variable column besides "time"/);
    expect(await errorOf({ 'behaviour.csv': 'time,x\n0,0\n' })).toMatch(/holds 1 sample\(s\); a sampled variable needs at least two/);
    expect(await errorOf({ 'behaviour.csv': 'x,position\n0,0\n1,1\n' })).toMatch(/behaviour\.csv.*time/);
    // Milliseconds labelled as seconds: no overlap with the 2.5 s recording.
    expect(await errorOf({ 'behaviour.csv': 'time,x\n1000,0\n2000,1\n' })).toMatch(/do not overlap the recording \[0, 2\.5\] s; this looks like milliseconds labelled as seconds/);
    expect(await errorOf({ 'session.json': '{"behaviour": {"columns": {"position": "p"}}}', 'behaviour.csv': 'time,x\n0,0\n1,1\n' })).toMatch(/behaviour\.columns\.position.*unknown key/);
  });

  it('buildBehaviour (any reader): a text column names its first bad cell; binary readers name the element', () => {
    const rowOf = (i: number) => i + 2;
    expect(() => buildBehaviour({ file: 'b.csv', rowOf, columns: { time: 'time' }, time: Float64Array.from([0, 1, 2]), variables: new Map([['x', ['1', 'n/a', '3']]]) })).toThrow(
      /^b\.csv, row 3, column "x": the value is not a finite number \(a behavioural variable needs a number in every row\) \(value "n\/a"\)/,
    );
    expect(() => buildBehaviour({ file: 'b.npy', columns: { time: 'time' }, time: Float64Array.from([0, 1, 1]), variables: new Map([['x', Float64Array.from([1, 2, 3])]]) })).toThrow(
      /^b\.npy, element 2 \(0-based\), column "time": two samples share this time/,
    );
  });
});
