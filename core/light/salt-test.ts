import { selectKth } from './select-kth';

/** Result of SALT on one unit. */
export interface SaltResult {
  /** p = #(null >= test) / #null (no +1, as published); NaN when SALT cannot run. */
  readonly p: number;
  /**
   * Rank-calibrated p from the same distance matrix: every one of the J + 1
   * histograms gets the median of its distances to the other J; pCalibrated =
   * #(rows whose median >= the test row's) / (J + 1), >= 1 / (J + 1). NaN when SALT cannot run.
   */
  readonly pCalibrated: number;
  /** Information difference I = median(test-baseline distances) - median(null). */
  readonly informationDifference: number;
  /** Median distance between the test histogram and the baseline histograms. */
  readonly testDistance: number;
  /** Median of the null (all baseline-baseline distances). */
  readonly nullMedian: number;
  /** Number of null distances, J (J - 1) / 2. */
  readonly nullCount: number;
  /** Rows compared by pCalibrated, J + 1 (its resolution is 1 / rows). */
  readonly rows: number;
}

/** Reusable buffers and log tables for saltTest (sizes grow on demand). */
export interface SaltScratch {
  lnInt: Float64Array;
  xlnx: Float64Array;
  rowX: Float64Array;
  nullD: Float64Array;
  testD: Float64Array;
  /** Full (J + 1) x (J + 1) distance matrix and one row's copy for selection. */
  matrix: Float64Array;
  rowD: Float64Array;
}

/** Empty scratch space for saltTest. */
export function createSaltScratch(): SaltScratch {
  return { lnInt: new Float64Array(0), xlnx: new Float64Array(0), rowX: new Float64Array(0), nullD: new Float64Array(0), testD: new Float64Array(0), matrix: new Float64Array(0), rowD: new Float64Array(0) };
}

/**
 * SALT (Stimulus-Associated spike Latency Test; Kvitsiani et al. 2013, Nature
 * 498:363), as the authors' reference code computes it (REFERENCES.md):
 * row 0 of `counts` is the test histogram (first-spike latency class per
 * pulse in the test window: class 0 = no spike, class b = spike first in bin b),
 * rows 1..J the same histogram for each baseline window; every row counts the
 * same n pulses. Distances sqrt(2 JSDmod) between all pairs (modifiedJsDistance
 * on counts, with integer log tables: no logarithm per bin per pair); the null
 * is every baseline-baseline distance, the test value the median of the
 * test-baseline distances; p = #(null >= test) / #null.
 *
 * Edge cases: J < 2 or n = 0 gives NaN. Known property (REFERENCES.md pitfall):
 * the support restriction makes a test histogram concentrated in one class the
 * baseline never visits look identical to the baseline (distance 0, p = 1);
 * callers must not read p = 1 as "no answer" without looking at the counts.
 */
export function saltTest(counts: Int32Array, rows: number, classes: number, n: number, s: SaltScratch = createSaltScratch()): SaltResult {
  const J = rows - 1;
  if (J < 2 || n <= 0) return { p: NaN, pCalibrated: NaN, informationDifference: NaN, testDistance: NaN, nullMedian: NaN, nullCount: 0, rows: 0 };
  if (s.lnInt.length < 2 * n + 1) {
    s.lnInt = new Float64Array(2 * n + 1);
    s.xlnx = new Float64Array(n + 1);
    for (let k = 1; k <= 2 * n; k++) s.lnInt[k] = Math.log(k);
    for (let k = 1; k <= n; k++) s.xlnx[k] = k * s.lnInt[k];
  }
  // Tables are valid for any n up to their size: ln k does not depend on n.
  if (s.xlnx.length < n + 1) {
    s.xlnx = new Float64Array(n + 1);
    for (let k = 1; k <= n; k++) s.xlnx[k] = k * s.lnInt[k];
  }
  const nullCount = (J * (J - 1)) / 2;
  if (s.rowX.length < rows) s.rowX = new Float64Array(rows);
  if (s.nullD.length < nullCount) s.nullD = new Float64Array(nullCount);
  if (s.testD.length < J) s.testD = new Float64Array(J);
  const { lnInt, xlnx, rowX } = s;
  for (let r = 0; r < rows; r++) {
    let x = 0;
    const o = r * classes;
    for (let c = 0; c < classes; c++) x += xlnx[counts[o + c]];
    rowX[r] = x;
  }
  const lnN = lnInt[n];
  const dist = (ra: number, rb: number): number => {
    const oa = ra * classes;
    const ob = rb * classes;
    let sa = 0;
    let ta = 0;
    let sb = 0;
    let tb = 0;
    for (let c = 0; c < classes; c++) {
      const a = counts[oa + c];
      const b = counts[ob + c];
      const l = lnInt[a + b];
      if (a > 0) {
        sa += a + b;
        ta += a * l;
      }
      if (b > 0) {
        sb += a + b;
        tb += b * l;
      }
    }
    const klA = (rowX[ra] - ta) / n + lnInt[sa] - lnN;
    const klB = (rowX[rb] - tb) / n + lnInt[sb] - lnN;
    const d2 = klA + klB;
    return d2 > 0 ? Math.sqrt(d2) : 0;
  };
  // Every pair once (the matrix is symmetric; equal pairs give bit-equal values).
  const R = rows;
  if (s.matrix.length < R * R) s.matrix = new Float64Array(R * R);
  if (s.rowD.length < R) s.rowD = new Float64Array(R);
  const M = s.matrix;
  let k = 0;
  for (let a = 0; a < R; a++) {
    M[a * R + a] = 0;
    for (let b = a + 1; b < R; b++) {
      const d = dist(a, b);
      M[a * R + b] = d;
      M[b * R + a] = d;
      if (a === 0) s.testD[b - 1] = d;
      else s.nullD[k++] = d;
    }
  }
  // #(null >= test) by one pass; medians by selection (no full sort).
  const median = (x: Float64Array, len: number) => {
    if (len % 2) return selectKth(x, len, (len - 1) / 2);
    const hiV = selectKth(x, len, len / 2);
    let loV = -Infinity;
    for (let i = 0; i < len / 2; i++) if (x[i] > loV) loV = x[i];
    return (loV + hiV) / 2;
  };
  const testDistance = median(s.testD, J);
  let atLeast = 0;
  for (let i = 0; i < nullCount; i++) if (s.nullD[i] >= testDistance) atLeast++;
  const nullMedian = median(s.nullD, nullCount);
  // Rank calibration: the row medians of the full matrix (row 0's is testDistance).
  const rowD = s.rowD;
  let notBelow = 1;
  for (let a = 1; a < R; a++) {
    let m = 0;
    for (let b = 0; b < R; b++) if (b !== a) rowD[m++] = M[a * R + b];
    if (median(rowD, J) >= testDistance) notBelow++;
  }
  return { p: atLeast / nullCount, pCalibrated: notBelow / R, informationDifference: testDistance - nullMedian, testDistance, nullMedian, nullCount, rows: R };
}
