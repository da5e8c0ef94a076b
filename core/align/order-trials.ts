import { covariateColumn } from './covariate-column';
import type { Trials } from '../model/types';
import type { AlignmentSet, OrderBy } from './types';

/**
 * Display order of alignment rows: by time (the set's own order), by
 * condition (text order, then time), or by a trial covariate (numeric
 * ascending or text order, then time; rows without a value last). Returns a
 * permutation of 0..rows-1. A covariate the trial table lacks is an input
 * error naming trials.csv.
 */
export function orderTrials(set: AlignmentSet, trials: Trials, order: OrderBy): Int32Array {
  const n = set.times.length;
  const idx = Array.from({ length: n }, (_, i) => i);
  if (order.by === 'time') return Int32Array.from(idx);
  if (order.by === 'condition') {
    idx.sort((a, b) => cmpText(set.condition[a], set.condition[b]) || a - b);
    return Int32Array.from(idx);
  }
  const col = covariateColumn(trials, order.name);
  const key = (i: number): number | string => {
    const r = set.trialRow[i];
    if (r < 0) return NaN;
    return col instanceof Float64Array ? col[r] : col[r];
  };
  idx.sort((a, b) => {
    const ka = key(a);
    const kb = key(b);
    const na = typeof ka === 'number' ? !Number.isFinite(ka) : ka === '';
    const nb = typeof kb === 'number' ? !Number.isFinite(kb) : kb === '';
    if (na !== nb) return na ? 1 : -1;
    if (!na && ka !== kb) return typeof ka === 'number' ? (ka as number) - (kb as number) : cmpText(String(ka), String(kb));
    return a - b;
  });
  return Int32Array.from(idx);
}

function cmpText(a: string, b: string): number {
  return a < b ? -1 : a > b ? 1 : 0;
}
