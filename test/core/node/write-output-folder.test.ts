import { existsSync, mkdirSync, mkdtempSync, readdirSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { writeOutputFolder } from '../../../core/node/write-output-folder';

const root = mkdtempSync(join(tmpdir(), 'tagbench-wof-'));
afterAll(() => rmSync(root, { recursive: true, force: true }));
const RUN = JSON.stringify({ tool: 'tagbench', version: 'x' });
/** Every entry of the parent folder, so leftovers (".x.partial-...", ".x.previous-...") show. */
const siblings = () => readdirSync(root).sort();

describe('writeOutputFolder: all files or none, old-or-new at every moment', () => {
  it('writes text and bytes into a new folder and leaves no temporary sibling', () => {
    const out = join(root, 'a');
    writeOutputFolder(out, { 'run.json': RUN, 'x.bin': new Uint8Array([1, 2, 255]) });
    expect(readdirSync(out).sort()).toEqual(['run.json', 'x.bin']);
    expect(Array.from(readFileSync(join(out, 'x.bin')))).toEqual([1, 2, 255]);
    expect(siblings()).toEqual(['a']);
  });

  it('replaces its own earlier output (recognised by run.json) and an empty folder', () => {
    const out = join(root, 'a');
    writeOutputFolder(out, { 'run.json': RUN, 'units.csv': 'unit\n1\n' });
    expect(readdirSync(out).sort()).toEqual(['run.json', 'units.csv']); // x.bin of the old output is gone
    mkdirSync(join(root, 'empty'));
    writeOutputFolder(join(root, 'empty'), { 'run.json': RUN });
    expect(readdirSync(join(root, 'empty'))).toEqual(['run.json']);
    rmSync(join(root, 'empty'), { recursive: true });
    expect(siblings()).toEqual(['a']);
  });

  it('refuses a folder that is not a tagbench output, unless told any folder may be replaced', () => {
    const out = join(root, 'foreign');
    mkdirSync(out);
    writeFileSync(join(out, 'notes.txt'), 'keep');
    expect(() => writeOutputFolder(out, { 'run.json': RUN })).toThrow(/is not an earlier tagbench output/);
    writeFileSync(join(out, 'run.json'), '{"tool": "another program"}');
    expect(() => writeOutputFolder(out, { 'run.json': RUN })).toThrow(/is not an earlier tagbench output/);
    expect(readFileSync(join(out, 'notes.txt'), 'utf8')).toBe('keep');
    writeOutputFolder(out, { 'spikes.csv': 'unit,time\n' }, { replace: 'any' });
    expect(readdirSync(out)).toEqual(['spikes.csv']);
    rmSync(out, { recursive: true });
  });

  it('refuses an output inside the input folder, a missing parent and a file in the way', () => {
    const input = join(root, 'session');
    mkdirSync(input);
    expect(() => writeOutputFolder(join(input, 'out'), { 'run.json': RUN }, { inputDir: input })).toThrow(/inside the input session folder/);
    expect(() => writeOutputFolder(input, { 'run.json': RUN }, { inputDir: input })).toThrow(/inside the input session folder/);
    expect(() => writeOutputFolder(join(root, 'no', 'such'), { 'run.json': RUN })).toThrow(/parent folder .* does not exist/);
    writeFileSync(join(root, 'file'), 'x');
    expect(() => writeOutputFolder(join(root, 'file'), { 'run.json': RUN })).toThrow(/is a file, not a folder/);
    rmSync(input, { recursive: true });
    rmSync(join(root, 'file'));
  });

  it('on a failed write keeps the old output whole and removes the partial folder', () => {
    const out = join(root, 'a');
    const before = readFileSync(join(out, 'units.csv'), 'utf8');
    // a name inside a missing sub-folder cannot be written: the second file fails
    expect(() => writeOutputFolder(out, { 'run.json': RUN, 'sub/units.csv': 'x' })).toThrow();
    expect(readFileSync(join(out, 'units.csv'), 'utf8')).toBe(before);
    expect(siblings()).toEqual(['a']);
    expect(existsSync(join(out, 'sub'))).toBe(false);
  });
});
