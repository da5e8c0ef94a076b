import { InputError } from '../errors';
import type { BehaviourSamples, Warning } from '../model/types';
import type { Located } from './build-recording';

/** The behaviour table as a reader hands it over (times in seconds, any order). */
export interface BehaviourColumns extends Located {
  readonly columns: { readonly time: string };
  readonly time: Float64Array;
  /**
   * Variable columns in file order: numbers (NaN = empty cell), or text when
   * some cell is not a number (an error, reported with its row).
   */
  readonly variables: ReadonlyMap<string, Float64Array | readonly string[]>;
}

/**
 * Checks and sorts sampled behavioural variables (README "Input formats",
 * behaviour.csv) into the immutable BehaviourSamples of the Recording.
 *
 * Errors (InputError naming file, row or element, column, value, fix): no
 * variable column besides time; fewer than two samples; a time that is NaN or
 * infinite; a variable cell that is empty, not a number or infinite; two
 * samples at the same time (after sorting; both rows named). Rows in any
 * order are sorted by time (stable), with a counted warning. Times may lie
 * outside the recording span (samples there are simply never used);
 * buildRecording checks that they overlap it at all.
 * Units: times in seconds (readers convert); variables in the file's units.
 */
export function buildBehaviour(b: BehaviourColumns): { samples: BehaviourSamples; warnings: Warning[] } {
  const n = b.time.length;
  const at = (i: number) => (b.rowOf ? { file: b.file, row: b.rowOf(i) } : { file: `${b.file}, element ${i} (0-based)` });
  if (b.variables.size === 0) {
    throw new InputError({ file: b.file, problem: `has no variable column besides "${b.columns.time}"`, fix: 'add one numeric column per behavioural variable (e.g. position, progress)' });
  }
  if (n < 2) {
    throw new InputError({ file: b.file, problem: `holds ${n} sample(s); a sampled variable needs at least two`, fix: 'export the behavioural samples of the whole session' });
  }
  for (let i = 0; i < n; i++) {
    if (!Number.isFinite(b.time[i])) {
      throw new InputError({ ...at(i), column: b.columns.time, value: String(b.time[i]), problem: 'time is not a finite number', fix: 'remove the row or give its time in seconds' });
    }
  }
  for (const [name, v] of b.variables) {
    if (!(v instanceof Float64Array)) {
      const i = v.findIndex((x) => x === '' || !Number.isFinite(Number(x)));
      throw new InputError({ ...at(Math.max(0, i)), column: name, value: v[Math.max(0, i)], problem: 'the value is not a finite number (a behavioural variable needs a number in every row)', fix: 'give a number, or drop the column (set "behaviour": null in session.json to ignore the file)' });
    }
    for (let i = 0; i < n; i++) {
      if (!Number.isFinite(v[i])) {
        throw new InputError({
          ...at(i),
          column: name,
          value: String(v[i]),
          problem: 'the value is empty or not a finite number',
          fix: 'fill gaps before export (e.g. interpolate lost tracking samples) or drop the row',
        });
      }
    }
  }
  // Sort by time (stable), then refuse repeated times.
  let sorted = true;
  for (let i = 1; i < n && sorted; i++) if (b.time[i] < b.time[i - 1]) sorted = false;
  const order = Int32Array.from({ length: n }, (_, i) => i);
  const warnings: Warning[] = [];
  if (!sorted) {
    order.set(Array.from(order).sort((x, y) => b.time[x] - b.time[y] || x - y));
    warnings.push({ code: 'unsorted-behaviour', file: b.file, count: 1, message: `${b.file}: rows were not in time order; they were sorted by time` });
  }
  const time = Float64Array.from(order, (i) => b.time[i]);
  for (let k = 1; k < n; k++) {
    if (time[k] === time[k - 1]) {
      const first = at(order[k - 1]);
      throw new InputError({
        ...at(order[k]),
        column: b.columns.time,
        value: String(time[k]),
        problem: `two samples share this time${'row' in first ? ` (also row ${first.row})` : ''}`,
        fix: 'keep one sample per time (a variable has one value at each moment)',
      });
    }
  }
  const variables = new Map<string, Float64Array>();
  for (const [name, v] of b.variables) variables.set(name, Float64Array.from(order, (i) => (v as Float64Array)[i]));
  return { samples: { time, variables }, warnings };
}
