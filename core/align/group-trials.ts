import type { Trials } from '../model/types';
import { covariateColumn } from './covariate-column';
import type { AlignmentSet, GroupBy, TrialGroup } from './types';

/**
 * Groups alignment rows for per-condition rasters and PSTHs:
 * - none: one group "all";
 * - condition / kind: one group per distinct value, in text order ("" shown
 *   as "(none)");
 * - covariate: a text covariate groups by value; a numeric one by bins,
 *   either explicit ascending edges (bins [e_i, e_i+1), the last closed) or
 *   nBins quantile bins (default 3; edges at the quantiles of the rows' values,
 *   linear interpolation as numpy.quantile's default); without edges, a
 *   numeric covariate with at most nBins distinct values groups by value
 *   ("sweep_s = 2.5"): quantile bins would merge or split such values
 *   arbitrarily (two values, three bins: one group). Rows without a value
 *   (no trial, NaN, outside the edges) are left out of every group.
 * `order` (a permutation from orderTrials) sets the row order inside groups;
 * default time order. Empty groups are dropped.
 */
export function groupTrials(set: AlignmentSet, trials: Trials, groupBy: GroupBy, order?: Int32Array): TrialGroup[] {
  const n = set.times.length;
  const perm = order ?? Int32Array.from({ length: n }, (_, i) => i);
  const keyOf = keyFunction(set, trials, groupBy);
  const buckets = new Map<string, number[]>();
  const labels: { label: string; sortKey: number | string }[] = [];
  for (let k = 0; k < perm.length; k++) {
    const i = perm[k];
    const key = keyOf(i);
    if (key === null) continue;
    let b = buckets.get(key.label);
    if (!b) {
      b = [];
      buckets.set(key.label, b);
      labels.push(key);
    }
    b.push(i);
  }
  labels.sort((a, b) =>
    typeof a.sortKey === 'number' && typeof b.sortKey === 'number' ? a.sortKey - b.sortKey : String(a.sortKey) < String(b.sortKey) ? -1 : String(a.sortKey) > String(b.sortKey) ? 1 : 0,
  );
  return labels.map(({ label }) => ({ label, rows: Int32Array.from(buckets.get(label)!) }));
}

type KeyFn = (i: number) => { label: string; sortKey: number | string } | null;

function keyFunction(set: AlignmentSet, trials: Trials, g: GroupBy): KeyFn {
  const text = (v: string) => ({ label: v === '' ? '(none)' : v, sortKey: v });
  switch (g.by) {
    case 'none':
      return () => ({ label: 'all', sortKey: 0 });
    case 'condition':
      return (i) => text(set.condition[i]);
    case 'kind':
      return (i) => text(set.kind[i]);
    case 'covariate': {
      const col = covariateColumn(trials, g.name);
      if (!(col instanceof Float64Array)) {
        return (i) => {
          const r = set.trialRow[i];
          return r < 0 || col[r] === '' ? null : text(col[r]);
        };
      }
      const value = (i: number) => (set.trialRow[i] >= 0 ? col[set.trialRow[i]] : NaN);
      const fmt = (x: number) => String(Number(x.toPrecision(4)));
      if (!g.edges) {
        const distinct = new Set<number>();
        for (let i = 0; i < set.times.length && distinct.size <= (g.nBins ?? 3); i++) if (Number.isFinite(value(i))) distinct.add(value(i));
        if (distinct.size <= (g.nBins ?? 3)) {
          return (i) => {
            const v = value(i);
            return Number.isFinite(v) ? { label: `${g.name} = ${String(v)}`, sortKey: v } : null;
          };
        }
      }
      const edges = g.edges ? [...g.edges] : quantileEdges(Array.from({ length: set.times.length }, (_, i) => value(i)), g.nBins ?? 3);
      if (g.edges) for (let k = 1; k < edges.length; k++) if (!(edges[k] > edges[k - 1])) throw new Error('groupTrials: covariate bin edges must increase strictly');
      return (i) => {
        const v = value(i);
        if (!Number.isFinite(v) || edges.length < 2 || v < edges[0] || v > edges[edges.length - 1]) return null;
        let b = 0;
        while (b < edges.length - 2 && v >= edges[b + 1]) b++;
        const last = b === edges.length - 2;
        return { label: `${g.name} [${fmt(edges[b])}, ${fmt(edges[b + 1])}${last ? ']' : ')'}`, sortKey: b };
      };
    }
  }
}

/** Edges at quantiles k/nBins of the finite values (numpy.quantile, linear); duplicates merged. */
function quantileEdges(values: number[], nBins: number): number[] {
  const v = values.filter(Number.isFinite).sort((a, b) => a - b);
  if (v.length === 0 || !(nBins >= 1)) return [];
  const q = (p: number) => {
    const h = (v.length - 1) * p;
    const lo = Math.floor(h);
    return lo + 1 < v.length ? v[lo] + (h - lo) * (v[lo + 1] - v[lo]) : v[lo];
  };
  const edges: number[] = [];
  for (let k = 0; k <= nBins; k++) {
    const e = q(k / nBins);
    if (edges.length === 0 || e > edges[edges.length - 1]) edges.push(e);
  }
  if (edges.length === 1) edges.push(edges[0]); // all values equal: one closed bin [x, x]
  return edges;
}
