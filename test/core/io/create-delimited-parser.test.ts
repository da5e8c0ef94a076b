import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { InputError } from '../../../core/errors';
import { createDelimitedParser, type ColumnSpec, type DelimitedTable } from '../../../core/io/create-delimited-parser';

const enc = (s: string) => new TextEncoder().encode(s);
const SPIKE_COLS: ColumnSpec[] = [
  { name: 'unit', kind: 'code', required: true },
  { name: 'time', kind: 'number', required: true },
];

function parse(text: string | Uint8Array, columns: ColumnSpec[] = SPIKE_COLS, chunk = 0, keepExtra = false): DelimitedTable {
  const bytes = typeof text === 'string' ? enc(text) : text;
  const p = createDelimitedParser({ file: 'spikes.csv', columns, keepExtra });
  if (chunk <= 0) p.push(bytes);
  else for (let i = 0; i < bytes.length; i += chunk) p.push(bytes.slice(i, i + chunk));
  return p.finish();
}
const units = (t: DelimitedTable) => {
  const c = t.codes.get('unit')!;
  return Array.from(c.codes, (k) => c.dictionary[k]);
};
const times = (t: DelimitedTable) => Array.from(t.numbers.get('time')!);
function errorOf(f: () => unknown): string {
  try {
    f();
  } catch (e) {
    expect(e).toBeInstanceOf(InputError);
    return (e as Error).message;
  }
  throw new Error('expected an InputError');
}

describe('createDelimitedParser', () => {
  it('reads comma, tab and semicolon files alike, with BOM and CRLF', () => {
    for (const text of [
      'unit,time\n1,0.5\n2,1.25\n',
      '\uFEFFunit\ttime\r\n1\t0.5\r\n2\t1.25\r\n',
      'unit;time\n1;0,5\n2;1,25',
      '"unit","time"\n"1","0.5"\n"2", 1.25 \n',
    ]) {
      const t = parse(text);
      expect(units(t)).toEqual(['1', '2']);
      expect(times(t)).toEqual([0.5, 1.25]);
    }
    expect(parse('unit\ttime\n1\t2\n').delimiter).toBe('\t');
    expect(parse('unit;time\n1;2\n').delimiter).toBe(';');
  });

  it('gives the same result for every chunking (1..17 bytes and whole)', () => {
    const text = '\uFEFFunit,time,"note, with comma"\r\n7,1e-3,"say ""hi"""\r\n\r\nA 3,2.5,"two\nlines"\n007,-0,x\n12345678901,12.000000000000001,\n';
    const cols: ColumnSpec[] = [...SPIKE_COLS, { name: 'note, with comma', kind: 'text', required: true }];
    const whole = parse(text, cols);
    expect(units(whole)).toEqual(['7', 'A 3', '007', '12345678901']);
    expect(times(whole)).toEqual([1e-3, 2.5, -0, 12.000000000000001]);
    expect(whole.texts.get('note, with comma')).toEqual(['say "hi"', 'two\nlines', 'x', '']);
    // header line 1, row 2, blank line 3, rows at lines 4 (two lines long), 6, 7
    expect([0, 1, 2, 3].map((i) => whole.rowOf(i))).toEqual([2, 4, 6, 7]);
    for (let k = 1; k <= 17; k++) {
      const t = parse(text, cols, k);
      expect(units(t)).toEqual(units(whole));
      expect(times(t)).toEqual(times(whole));
      expect(t.texts.get('note, with comma')).toEqual(whole.texts.get('note, with comma'));
      expect([0, 1, 2, 3].map((i) => t.rowOf(i))).toEqual([2, 4, 6, 7]);
    }
  });

  it('parses numbers exactly as Number() does (fast path and fallback)', () => {
    // Reference: ECMAScript Number() string conversion (correctly rounded, IEEE 754).
    fc.assert(
      fc.property(fc.array(fc.double({ noNaN: true, noDefaultInfinity: true }), { minLength: 1, maxLength: 20 }), (xs) => {
        const text = `unit,time\n${xs.map((x) => `1,${String(x)}`).join('\n')}\n`;
        expect(times(parse(text))).toEqual(xs.map((x) => Number(String(x))));
      }),
    );
    const forms = ['1.5E+3', '.5', '5.', '-2e-5', '0.1', '123456789012345678', '1e-320', '+7', '0000.25'];
    expect(times(parse(`unit,time\n${forms.map((f) => `1,${f}`).join('\n')}`))).toEqual(forms.map(Number));
  });

  it('reads nan and inf spellings for the validator to judge, and allows empty optional cells', () => {
    const cols: ColumnSpec[] = [...SPIKE_COLS, { name: 'power', kind: 'number', required: false, allowEmpty: true }];
    const t = parse('unit,time,power\n1,NaN,\n1,inf,2\n1,-Infinity,3\n', cols);
    expect(times(t)).toEqual([NaN, Infinity, -Infinity]);
    expect(Array.from(t.numbers.get('power')!)).toEqual([NaN, 2, 3]);
  });

  it('keeps extra columns, numeric when every cell is a number', () => {
    const t = parse('unit,time,speed,cue\n1,1,2.5,a\n1,2,,b\n', SPIKE_COLS, 0, true);
    expect(Array.from(t.extra.get('speed') as Float64Array)).toEqual([2.5, NaN]);
    expect(t.extra.get('cue')).toEqual(['a', 'b']);
  });

  it('lists columns it ignores', () => {
    expect(parse('unit,time,amplitude\n1,1,30\n').ignored).toEqual(['amplitude']);
  });

  it('interns ids consistently across fast and slow paths', () => {
    const t = parse('unit,time\n5,1\n"5",2\n 5 ,3\n05,4\n');
    expect(units(t)).toEqual(['5', '5', '5', '05']);
    expect(t.codes.get('unit')!.dictionary).toEqual(['5', '05']);
  });

  it('skips blank lines and tolerates a missing final newline', () => {
    const t = parse('\nunit,time\n\n1,1\n  \n2,2');
    expect(times(t)).toEqual([1, 2]);
    expect([t.rowOf(0), t.rowOf(1)]).toEqual([4, 6]);
  });

  it.each([
    ['', /spikes\.csv: the file is empty/],
    ['\uFEFF\n\n', /spikes\.csv: the file is empty/],
    ['unit,t\n1,2\n', /spikes\.csv, row 1, column "time": required column "time" is missing; the header has: unit, t/],
    ['unit time\n1 2\n', /the header was read as one column "unit time"/],
    ['unit,time\n1,2\n1,abc\n', /spikes\.csv, row 3, column "time": the value is not a number \(value "abc"\)/],
    ['unit,time\n1,\n', /row 2, column "time": the value is empty/],
    ['unit,time\n1,2,3\n', /row 2: this row has more fields than the header's 2/],
    ['unit,time,x\n1,2\n', /row 2: this row has 2 field\(s\) but the header has 3/],
    ['unit,time\n1,"2\n', /row 2, column "time": a quoted value is not closed/],
    ['unit,time\n"1"x,2\n', /row 2, column "unit": text follows a closing quote/],
    ['unit,time,unit\n1,2,3\n', /row 1, column "unit": the header names column "unit" twice/],
    ['unit,time\n1,1.2.3\n', /row 2, column "time": the value is not a number \(value "1.2.3"\)/],
  ])('error for %j', (text, re) => {
    expect(errorOf(() => parse(text))).toMatch(re);
    expect(errorOf(() => parse(text, SPIKE_COLS, 1))).toMatch(re);
  });

  it('joins column blocks of large files in order (200,003 rows, odd chunks)', () => {
    const n = 200_003;
    const parts = ['unit,time\n'];
    for (let i = 0; i < n; i++) parts.push(`${i % 7},${i}.5\n`);
    const t = parse(parts.join(''), SPIKE_COLS, 65_537);
    expect(t.rowCount).toBe(n);
    const tm = t.numbers.get('time')!;
    const c = t.codes.get('unit')!;
    for (const i of [0, 65_535, 65_536, 131_072, n - 1]) {
      expect(tm[i]).toBe(i + 0.5);
      expect(c.dictionary[c.codes[i]]).toBe(String(i % 7));
    }
    expect(t.rowOf(n - 1)).toBe(n + 1);
  });

  it('hands columns over as row blocks equal to the joined columns, for every chunking', () => {
    // the import path of the spike table (pieces: true) against the general path (joined arrays)
    const PIECE_COLS: ColumnSpec[] = SPIKE_COLS.map((c) => ({ ...c, pieces: true }));
    const flat = (t: DelimitedTable) => {
      const u = t.pieces.get('unit')!;
      const tm = t.pieces.get('time')!.numbers!;
      expect(u.codes!.map((b) => b.length)).toEqual(tm.map((b) => b.length));
      return { units: u.codes!.flatMap((b) => Array.from(b, (k) => u.dictionary![k])), times: tm.flatMap((b) => Array.from(b)) };
    };
    const n = 140_000; // three blocks of 65,536 rows, the last partial
    const parts = ['\uFEFFunit,time\r\n'];
    for (let i = 0; i < n; i++) parts.push(i % 1000 === 0 ? `"${i % 13}",${i}.25\r\n\r\n` : `${i % 13},${i * 3}e-3\r\n`);
    const bytes = enc(parts.join(''));
    const whole = parse(bytes);
    for (const chunk of [0, 1 << 20, 65_537, 4093]) {
      const t = parse(bytes, PIECE_COLS, chunk);
      expect(t.numbers.size + t.codes.size).toBe(0);
      expect(flat(t)).toEqual({ units: units(whole), times: times(whole) });
      expect(t.rowOf(n - 1)).toBe(whole.rowOf(n - 1));
    }
    // small files, every chunking: CRLF, quotes, BOM, a chunk boundary inside a number
    const text = '\uFEFF"unit",time\r\n"7",1.000000000000001\r\n\r\n8,2.5e-3\r\n"7",  3\r\n';
    const small = parse(text);
    for (let k = 1; k <= 12; k++) expect(flat(parse(text, PIECE_COLS, k))).toEqual({ units: units(small), times: times(small) });
    const empty = parse('unit,time\n', PIECE_COLS);
    expect(empty.pieces.get('time')!.numbers).toEqual([]);
  });

  it('keeps codes exact past 65,536 distinct ids (2-byte blocks widen to 4 bytes)', () => {
    const n = 150_000; // ids 0..69,999 then repeats; the 65,537th id arrives inside the second block
    const parts = ['unit,time\n'];
    for (let i = 0; i < n; i++) parts.push(`${i < 70_000 ? i : i % 977},${i}\n`);
    const bytes = enc(parts.join(''));
    const PIECE_COLS: ColumnSpec[] = SPIKE_COLS.map((c) => ({ ...c, pieces: true }));
    const want = Array.from({ length: n }, (_, i) => String(i < 70_000 ? i : i % 977));
    expect(units(parse(bytes, SPIKE_COLS, 100_003))).toEqual(want);
    const p = parse(bytes, PIECE_COLS, 100_003).pieces.get('unit')!;
    expect(p.codes!.map((b) => b.constructor.name)).toEqual(['Uint16Array', 'Int32Array', 'Int32Array']);
    expect(p.codes!.flatMap((b) => Array.from(b, (k) => p.dictionary![k]))).toEqual(want);
  });

  it('the [id, number] record fast path gives what the general path gives, byte for byte (fast-check)', () => {
    // Records mix the plain form the fast path takes with every form it must hand to the general
    // path: quotes, spaces, CRLF and lone CR, blank lines, leading zeros and long ids, new ids,
    // exponents, 16+ digit numbers, signs, empty and bad cells; chunk cuts anywhere.
    const idArb = fc.oneof(fc.nat(40).map(String), fc.constantFrom('0', '007', '1234567890', '"5"', ' 6', 'a', '-3', ''));
    const numArb = fc.oneof(
      fc.double({ noNaN: true, noDefaultInfinity: true }).map(String),
      fc.integer({ min: 0, max: 10 ** 6 }).map((k) => (k / 1000).toFixed(3)),
      fc.constantFrom('-0', '+7', '.5', '5.', '1e3', '0.000000000000000000000001', '12345678901234567', '1.5 ', '"2"', 'nan', '-inf', '', 'x', '1.2.3', '-', '3,4'),
    );
    const endArb = fc.constantFrom('\n', '\n', '\n', '\r\n', '\n\n', '\r');
    const rowsArb = fc.array(fc.tuple(idArb, numArb, endArb), { minLength: 1, maxLength: 60 });
    const both = (bytes: Uint8Array, chunk: number, fast: boolean) => {
      const p = createDelimitedParser({ file: 'spikes.csv', columns: PIECES, pairFastPath: fast });
      try {
        if (chunk <= 0) p.push(bytes);
        else for (let i = 0; i < bytes.length; i += chunk) p.push(bytes.slice(i, i + chunk));
        const t = p.finish();
        const u = t.pieces.get('unit')!;
        const tm = t.pieces.get('time')!.numbers!;
        return {
          units: u.codes!.flatMap((b) => Array.from(b, (k) => u.dictionary![k])),
          codes: u.codes!.flatMap((b) => Array.from(b)),
          times: tm.flatMap((b) => Array.from(b)),
          rows: Array.from({ length: t.rowCount }, (_, i) => t.rowOf(i)),
        };
      } catch (e) {
        expect(e).toBeInstanceOf(InputError);
        return { error: (e as Error).message };
      }
    };
    const PIECES: ColumnSpec[] = SPIKE_COLS.map((c) => ({ ...c, pieces: true }));
    fc.assert(
      fc.property(rowsArb, fc.integer({ min: 0, max: 23 }), (rows, chunk) => {
        const text = 'unit,time\n' + rows.map(([u, t, e]) => `${u},${t}${e}`).join('');
        const bytes = enc(text);
        const general = both(bytes, chunk, false);
        expect(both(bytes, chunk, true)).toEqual(general);
        expect(both(bytes, 0, true)).toEqual(both(bytes, 0, false));
      }),
      { numRuns: 400, seed: 20261202 },
    );
  });

  it('the fast path across block and chunk edges: 140,000 plain rows with a few odd ones', () => {
    const PIECES: ColumnSpec[] = SPIKE_COLS.map((c) => ({ ...c, pieces: true }));
    const parts = ['unit,time\n'];
    for (let i = 0; i < 140_000; i++) parts.push(i % 9973 === 0 ? `"${i % 50}", ${i}e-3\r\n\n` : `${i % 50},${(i / 7).toFixed(6)}\n`);
    const bytes = enc(parts.join(''));
    const read = (fast: boolean, chunk: number) => {
      const p = createDelimitedParser({ file: 'spikes.csv', columns: PIECES, pairFastPath: fast });
      for (let i = 0; i < bytes.length; i += chunk) p.push(bytes.subarray(i, i + chunk));
      const t = p.finish();
      return { t, times: t.pieces.get('time')!.numbers!.flatMap((b) => Array.from(b)), codes: t.pieces.get('unit')!.codes!.flatMap((b) => Array.from(b)) };
    };
    const g = read(false, 1 << 20);
    expect(g.times.length).toBe(140_000);
    expect(g.times[65_535]).toBe(Number((65_535 / 7).toFixed(6)));
    for (const chunk of [4093, 65_537, 1 << 22]) {
      const f = read(true, chunk);
      expect(f.times).toEqual(g.times);
      expect(f.codes).toEqual(g.codes);
      for (const i of [0, 9972, 9973, 9974, 65_535, 65_536, 139_999]) expect(f.t.rowOf(i)).toBe(g.t.rowOf(i));
    }
  });

  it('header-only file gives zero rows', () => {
    expect(parse('unit,time\n').rowCount).toBe(0);
  });

  it('decodes UTF-8 ids', () => {
    const t = parse('unit,time\nμ-1,1\n"unité 2",2\n');
    expect(units(t)).toEqual(['μ-1', 'unité 2']);
  });
});
