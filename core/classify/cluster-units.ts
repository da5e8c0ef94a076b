import type { Parameters } from '../defaults';
import type { Recording } from '../model/types';
import { kMeansRestarts } from '../stats/k-means-restarts';
import { pcaScores } from '../stats/pca-scores';
import { pairwiseDistances } from '../stats/pairwise-distances';
import { silhouette } from '../stats/silhouette';
import { responseFeatures, type FeatureSegment } from './response-features';

export interface ClusterClass {
  /** 1-based cluster number (clusters numbered by decreasing size). */
  readonly cluster: number;
  readonly size: number;
  /** Mean and standard error of the members' z-scored responses, one value per feature. */
  readonly mean: number[];
  readonly sem: number[];
}

export interface UnitClusters {
  /** 1-based cluster per unit, NaN when the unit was not clustered (silent, or too few units). */
  readonly cluster: Float64Array;
  /** Scores on the first two principal components (NaN when not clustered). */
  readonly pc1: Float64Array;
  readonly pc2: Float64Array;
  /** Silhouette width of each unit in the chosen partition. */
  readonly silhouette: Float64Array;
  readonly k: number;
  /** Mean silhouette per k tried. */
  readonly silhouetteByK: { k: number; mean: number }[];
  /** Fraction of variance per kept component. */
  readonly explainedVariance: number[];
  readonly segments: FeatureSegment[];
  readonly classes: ClusterClass[];
  readonly unitsUsed: number;
  /** Why no clustering was done, or "" when it was. */
  readonly note: string;
  /**
   * Strength of the chosen partition by its mean silhouette (Kaufman &
   * Rousseeuw 1990 guideline, from memory): > 0.7 strong, > 0.5 reasonable,
   * > 0.25 weak, otherwise none (the clusters then split a continuum or noise).
   */
  readonly structure: 'strong' | 'reasonable' | 'weak' | 'none' | '';
}

/**
 * Population clusters (issue 5): each unit's trial-averaged responses
 * (responseFeatures) are z-scored across their own bins (mean 0, SD 1, so
 * clusters group response shapes, not rates); PCA (ml-pca, centred) keeps
 * up to `components` components; k-means (restarts per k, seeded) for k in
 * [kMin, kMax] (capped at units - 1); the k with the largest mean silhouette
 * wins (ties: the smaller k). Units with a flat or empty response are not
 * clustered. Class averages are the mean z-scored responses of each cluster.
 */
export function clusterUnits(recording: Recording, params: Parameters): UnitClusters {
  const cp = params.cluster;
  const n = recording.units.length;
  const f = responseFeatures(recording, params);
  const cluster = new Float64Array(n).fill(NaN);
  const pc1 = new Float64Array(n).fill(NaN);
  const pc2 = new Float64Array(n).fill(NaN);
  const sil = new Float64Array(n).fill(NaN);
  const empty = (note: string, used = 0): UnitClusters => ({
    cluster, pc1, pc2, silhouette: sil, k: 0, silhouetteByK: [], explainedVariance: [], segments: f.segments, classes: [], unitsUsed: used, note,
    structure: '',
  });
  if (f.dim < 2) return empty('no events to build responses from');
  const rows: number[][] = [];
  const unitOf: number[] = [];
  for (let u = 0; u < n; u++) {
    const o = u * f.dim;
    let m = 0;
    for (let b = 0; b < f.dim; b++) m += f.rates[o + b];
    m /= f.dim;
    let v = 0;
    for (let b = 0; b < f.dim; b++) v += (f.rates[o + b] - m) ** 2;
    const sd = Math.sqrt(v / (f.dim - 1));
    if (!(sd > 0)) continue;
    rows.push(Array.from({ length: f.dim }, (_, b) => (f.rates[o + b] - m) / sd));
    unitOf.push(u);
  }
  const nUsed = rows.length;
  if (nUsed < Math.max(cp.minUnits, cp.kMin + 1)) return empty(`only ${nUsed} units with a response (need ${Math.max(cp.minUnits, cp.kMin + 1)})`, nUsed);
  // Eigen-decomposition of the dim x dim covariance: same components as the SVD, far cheaper for many units
  // (pcaScores: ml-pca's covariance-matrix PCA to the last bit, on flat arrays).
  const flat = new Float64Array(nUsed * f.dim);
  for (let i = 0; i < nUsed; i++) flat.set(rows[i], i * f.dim);
  const pca = pcaScores(flat, f.dim);
  const ev = pca.explainedVariance;
  const nComp = Math.max(1, Math.min(cp.components, f.dim, nUsed - 1, ev.filter((x) => x > 1e-12).length));
  const pts = pca.scores(nComp);
  // Pairwise distances once for every k (4 n^2 bytes; skipped for very large populations).
  const distances = nUsed <= 4000 ? pairwiseDistances(pts, nComp) : undefined;
  const byK: { k: number; mean: number }[] = [];
  let best: { k: number; mean: number; labels: Int32Array; widths: Float64Array } | null = null;
  for (let k = cp.kMin; k <= Math.min(cp.kMax, nUsed - 1); k++) {
    let fit;
    try {
      fit = kMeansRestarts(pts, nComp, k, cp.restarts, cp.seed);
    } catch {
      continue; // every restart left a cluster empty (e.g. duplicate points): k not usable
    }
    const s = silhouette(pts, nComp, fit.labels, distances);
    byK.push({ k, mean: s.mean });
    if (!best || s.mean > best.mean + 1e-12) best = { k, mean: s.mean, labels: fit.labels, widths: s.widths };
  }
  if (!best) return empty('k-means found no usable partition', nUsed);
  const classes: ClusterClass[] = [];
  for (let c = 0; c < best.k; c++) {
    const members: number[][] = [];
    for (let i = 0; i < nUsed; i++) if (best.labels[i] === c) members.push(rows[i]);
    const mean = Array.from({ length: f.dim }, (_, b) => members.reduce((s, r) => s + r[b], 0) / members.length);
    const sem = Array.from({ length: f.dim }, (_, b) => {
      if (members.length < 2) return NaN;
      const v = members.reduce((s, r) => s + (r[b] - mean[b]) ** 2, 0) / (members.length - 1);
      return Math.sqrt(v / members.length);
    });
    classes.push({ cluster: c + 1, size: members.length, mean, sem });
  }
  for (let i = 0; i < nUsed; i++) {
    const u = unitOf[i];
    cluster[u] = best.labels[i] + 1;
    pc1[u] = pts[i * nComp];
    pc2[u] = nComp > 1 ? pts[i * nComp + 1] : NaN;
    sil[u] = best.widths[i];
  }
  return {
    cluster, pc1, pc2, silhouette: sil, k: best.k, silhouetteByK: byK,
    explainedVariance: ev.slice(0, nComp), segments: f.segments, classes, unitsUsed: nUsed, note: '',
    structure: best.mean > 0.7 ? 'strong' : best.mean > 0.5 ? 'reasonable' : best.mean > 0.25 ? 'weak' : 'none',
  };
}
