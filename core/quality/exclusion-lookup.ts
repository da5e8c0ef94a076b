/**
 * A lookup table over sorted, non-overlapping intervals [startS[x], stopS[x])
 * (e.g. lightWindows) that tells, for a time t, where the merge pointer of
 * "is t inside an interval?" may start, or that t is inside none, without
 * walking the intervals: one table read per time instead of a merge step
 * whose branches the processor cannot predict.
 *
 * Cells: cell(t) = floor((t - startS[0]) * invCellS), non-decreasing in t
 * (subtraction, multiplication by a positive number and floor are monotone
 * in floating point), over [startS[0], stopS[last]]. A time inside interval
 * x has cell(startS[x]) <= cell(t) <= cell(stopS[x]), so a cell outside every
 * interval's [cell(start), cell(stop)] holds no time inside an interval:
 * first[c] = -1. Otherwise first[c] = the first interval with
 * cell(stop) >= c; every earlier interval ends before any time of cell c, so
 * a merge from first[c] (`while (stop[x] <= t) x++; inside = start[x] <= t`)
 * gives exactly the answer of a merge from 0.
 *
 * Size: about 64 cells per interval (at most 2^22), so with pulses' 10 ms
 * windows most cells are free of intervals. Empty intervals are skipped.
 */
export interface ExclusionLookup {
  /** First interval start, s, and cells per second. */
  readonly originS: number;
  readonly invCellS: number;
  /** Per cell: first interval index to merge from, or -1 (no interval in this cell). */
  readonly first: Int32Array;
}

export function exclusionLookup(startS: ArrayLike<number>, stopS: ArrayLike<number>): ExclusionLookup | null {
  const nx = startS.length;
  if (nx === 0) return null;
  const origin = startS[0];
  const end = stopS[nx - 1];
  if (!(end > origin) || !Number.isFinite(end - origin)) return null;
  const wanted = Math.min(1 << 22, 64 * nx);
  const inv = wanted / (end - origin);
  const cell = (t: number) => Math.floor((t - origin) * inv);
  const nCells = cell(end) + 1;
  const first = new Int32Array(nCells).fill(-1);
  let from = 0; // cells below `from` already have their first interval
  for (let x = 0; x < nx; x++) {
    const a = startS[x];
    const b = stopS[x];
    if (!(b > a)) continue;
    const ca = Math.max(0, cell(a));
    const cb = Math.min(nCells - 1, cell(b));
    for (let c = Math.max(ca, from); c <= cb; c++) first[c] = x;
    if (cb + 1 > from) from = cb + 1;
  }
  return { originS: origin, invCellS: inv, first };
}
