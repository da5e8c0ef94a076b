import { InputError } from '../errors';
import { createDelimitedParser } from '../io/create-delimited-parser';
import { npyToFloat64 } from '../io/npy-to-float64';
import { readNpy } from '../io/read-npy';

/** A measured trace or a sampled kernel read from a file. */
export interface Series {
  /** Sample times, s, strictly increasing. */
  readonly times: Float64Array;
  readonly values: Float64Array;
  /** The sample rate when samples are evenly spaced (given, or found within 1e-6 relative), else NaN. */
  readonly rateHz: number;
}

export interface ReadSeriesOptions {
  /** Sample rate for files without a time column (NPY 1-D, CSV without `timeColumn`), Hz. */
  readonly rateHz?: number;
  /** Time of the first sample when the rate is given, s (default 0). */
  readonly startS?: number;
  /** CSV column names (defaults "time" and "value"). */
  readonly timeColumn?: string;
  readonly valueColumn?: string;
  /** How the caller lets the user give the rate, for messages (e.g. "--measured-rate HZ"; default "the sample rate"). */
  readonly rateName?: string;
}

/**
 * Reads a photometry / imaging trace or a sampled kernel from CSV (or TSV)
 * bytes or a NumPy .npy file (core/io parsers):
 * - CSV: a value column (default "value"; a file with one column uses it),
 *   and a time column (default "time", s) unless a rate is given;
 * - NPY: 1-D values (needs the rate), or N x 2 rows of (time, value).
 * Times must be finite and strictly increasing; values may be NaN (gaps).
 * Problems are InputErrors naming the file, row and fix.
 */
export function readSeries(bytes: Uint8Array, file: string, o: ReadSeriesOptions = {}): Series {
  const rate = o.rateHz;
  if (rate !== undefined && !(rate > 0 && Number.isFinite(rate))) {
    throw new InputError({ file, problem: `the sample rate must be a positive number of Hz, got ${rate}` });
  }
  let times: Float64Array | null = null;
  let values: Float64Array;
  if (/\.npy$/i.test(file)) {
    const a = readNpy(bytes, file);
    const data = npyToFloat64(a, file);
    if (a.shape.length === 1) values = data;
    else if (a.shape.length === 2 && a.shape[1] === 2) {
      const n = a.shape[0];
      times = new Float64Array(n);
      values = new Float64Array(n);
      for (let i = 0; i < n; i++) {
        times[i] = data[2 * i];
        values[i] = data[2 * i + 1];
      }
    } else {
      throw new InputError({ file, value: `shape (${a.shape.join(', ')})`, problem: 'expected a 1-D array of values or an N x 2 array of (time, value) rows' });
    }
  } else {
    const valueName = o.valueColumn ?? 'value';
    const timeName = o.timeColumn ?? 'time';
    const probe = createDelimitedParser({ file, columns: [], keepExtra: true });
    probe.push(bytes);
    const t = probe.finish();
    const header = t.header;
    const vName = header.includes(valueName) ? valueName : header.length === 1 ? header[0] : header.length === 2 && header.includes(timeName) ? header.find((h) => h !== timeName)! : null;
    if (!vName) {
      throw new InputError({ file, row: 1, column: valueName, problem: `no "${valueName}" column (the header has: ${header.join(', ')})`, fix: 'name the value column "value", or pass the column name' });
    }
    const useTime = header.includes(timeName) && rate === undefined;
    const p = createDelimitedParser({
      file,
      columns: [
        { name: vName, kind: 'number', required: true, allowEmpty: true },
        ...(useTime ? [{ name: timeName, kind: 'number' as const, required: true }] : []),
      ],
    });
    p.push(bytes);
    const tab = p.finish();
    values = tab.numbers.get(vName)!;
    if (useTime) times = tab.numbers.get(timeName)!;
    if (!useTime && rate === undefined) {
      throw new InputError({ file, problem: `no "${timeName}" column and no sample rate`, fix: `add a time column in seconds, or give ${o.rateName ?? 'the sample rate'}` });
    }
    if (times) checkTimes(times, file, (i) => tab.rowOf(i));
  }
  if (!times) {
    if (rate === undefined) throw new InputError({ file, problem: 'a 1-D .npy file has no times', fix: `give ${o.rateName ?? 'the sample rate (and start time)'}, or save an N x 2 array of (time, value)` });
    const t0 = o.startS ?? 0;
    times = Float64Array.from({ length: values.length }, (_, i) => t0 + i / rate);
    return { times, values, rateHz: rate };
  }
  if (/\.npy$/i.test(file)) checkTimes(times, file, (i) => i);
  return { times, values, rateHz: rate ?? evenRate(times) };
}

function checkTimes(t: Float64Array, file: string, rowOf: (i: number) => number): void {
  for (let i = 0; i < t.length; i++) {
    if (!Number.isFinite(t[i])) throw new InputError({ file, row: rowOf(i), column: 'time', value: String(t[i]), problem: 'time is not a finite number' });
    if (i > 0 && !(t[i] > t[i - 1])) {
      throw new InputError({ file, row: rowOf(i), column: 'time', value: String(t[i]), problem: `times must increase strictly (previous ${t[i - 1]})`, fix: 'sort the samples by time and remove duplicates' });
    }
  }
}

/** 1 / (mean step) when every step is within 1e-6 relative of it, else NaN. */
function evenRate(t: Float64Array): number {
  if (t.length < 2) return NaN;
  const step = (t[t.length - 1] - t[0]) / (t.length - 1);
  for (let i = 1; i < t.length; i++) if (Math.abs(t[i] - t[i - 1] - step) > 1e-6 * step) return NaN;
  return 1 / step;
}
