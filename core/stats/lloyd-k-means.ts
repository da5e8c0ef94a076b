/**
 * One k-means run on typed arrays: k-means++ starts with greedy local trials
 * (Arthur & Vassilvitskii 2007; 2 + floor(ln k) candidates per centre, the
 * best by the summed squared distances) from a seeded XSadd generator
 * (Saito & Matsumoto's xorshift-add, 32-bit output / 2^8 * 2^-24), then
 * Lloyd's iterations (assign each point to the nearest centre, first one on
 * ties; move each centre to its members' mean, an empty cluster keeps its
 * centre) until no centre moves by more than `tolerance` (squared distance)
 * or maxIterations steps. Returns the labels of the last assignment.
 *
 * Why not the library: ml-kmeans 7.0.1 (kmeans(rows, k, {initialization:
 * 'kmeans++', seed, maxIterations, tolerance})) does exactly this with
 * arrays of arrays, a matrix object and a fresh array per distance; this
 * implementation repeats its arithmetic operation for operation on one flat
 * array, so for the same seed it returns the same labels (checked against
 * ml-kmeans in test/core/stats/lloyd-k-means.test.ts on many data sets, seeds
 * and k, Iris included) at a fraction of the cost. Like the library it
 * throws when k is not in [1, n], when the start probabilities do not sum to
 * 1 within 1e-8, or when no candidate centre has a finite potential.
 *
 * Input: points row-major (n x dim), k, integer seed.
 */
export function lloydKMeans(points: Float64Array, dim: number, k: number, seed: number, maxIterations = 100, tolerance = 1e-6): Int32Array {
  const n = Math.floor(points.length / dim);
  if (k <= 0 || k > n || !Number.isInteger(k)) throw new Error('K should be a positive integer smaller than the number of points');
  const centres = kMeansPlusPlus(points, dim, n, k, seed);
  const labels = new Int32Array(n);
  const next = new Float64Array(k * dim);
  const members = new Float64Array(k);
  const iterations = maxIterations === 0 ? Number.MAX_VALUE : maxIterations;
  let converged = false;
  for (let step = 0; !converged && step < iterations; step++) {
    // Assign: nearest centre, strictly smaller distance wins (first on ties).
    for (let i = 0; i < n; i++) {
      const o = i * dim;
      let best = -1;
      let bestD = Number.MAX_VALUE;
      for (let c = 0; c < k; c++) {
        const q = c * dim;
        let d = 0;
        for (let t = 0; t < dim; t++) {
          const x = points[o + t] - centres[q + t];
          d += x * x; // the same value as (p - c) * (p - c) computed twice
        }
        if (d < bestD) {
          bestD = d;
          best = c;
        }
      }
      if (best < 0) throw new Error('k-means: a point has no finite distance to any centre');
      labels[i] = best;
    }
    // Update: members' mean, summed in point order; an empty cluster keeps its centre.
    next.fill(0);
    members.fill(0);
    for (let i = 0; i < n; i++) {
      const c = labels[i];
      members[c]++;
      for (let t = 0; t < dim; t++) next[c * dim + t] += points[i * dim + t];
    }
    for (let c = 0; c < k; c++) {
      for (let t = 0; t < dim; t++) {
        if (members[c]) next[c * dim + t] /= members[c];
        else next[c * dim + t] = centres[c * dim + t];
      }
    }
    converged = true;
    for (let c = 0; c < k && converged; c++) {
      let d = 0;
      for (let t = 0; t < dim; t++) {
        const x = next[c * dim + t] - centres[c * dim + t];
        d += x * x;
      }
      if (d > tolerance) converged = false;
    }
    centres.set(next);
  }
  return labels;
}

/** k-means++ with greedy local trials (see lloydKMeans); returns k centres row-major. */
function kMeansPlusPlus(points: Float64Array, dim: number, n: number, k: number, seed: number): Float64Array {
  const random = xsadd(seed);
  const centres = new Float64Array(k * dim);
  const trials = 2 + Math.floor(Math.log(k));
  const sq = (i: number, a: ArrayLike<number>, ao: number) => {
    let d = 0;
    for (let t = 0; t < dim; t++) {
      const x = points[i * dim + t] - a[ao + t];
      d += x * x;
    }
    return d;
  };
  const first = Math.floor(random() * n);
  for (let t = 0; t < dim; t++) centres[t] = points[first * dim + t];
  let closest = new Float64Array(n);
  for (let i = 0; i < n; i++) closest[i] = sq(i, centres, 0);
  const cum = new Float64Array(n);
  const candidates = new Int32Array(trials);
  let trial = new Float64Array(n);
  let best = new Float64Array(n);
  for (let c = 1; c < k; c++) {
    // Probabilities closest / sum (the sum starts at the first element), cumulated.
    let total = closest[0];
    for (let i = 1; i < n; i++) total += closest[i];
    const scale = 1 / total;
    cum[0] = closest[0] * scale;
    for (let i = 1; i < n; i++) cum[i] = cum[i - 1] + closest[i] * scale;
    if (Math.abs(1 - cum[n - 1]) > 1e-8) throw new Error(`probabilities should sum to 1, but instead sums to ${cum[n - 1]}`);
    for (let j = 0; j < trials; j++) {
      const r = random();
      let idx = 0;
      while (idx < n && r > cum[idx]) idx++;
      if (idx >= n) throw new Error('k-means++: no start candidate drawn');
      candidates[j] = idx;
    }
    let bestIdx = -1;
    let bestPot = Infinity;
    let bestIsClosest = true;
    for (let j = 0; j < trials; j++) {
      const o = candidates[j] * dim;
      let pot = 0;
      for (let i = 0; i < n; i++) {
        // squared distance candidate -> point (the same value either way round)
        let d = 0;
        const oi = i * dim;
        for (let t = 0; t < dim; t++) {
          const x = points[o + t] - points[oi + t];
          d += x * x;
        }
        const v = Math.min(closest[i], d);
        trial[i] = v;
        pot += v;
      }
      if (pot < bestPot) {
        bestIdx = candidates[j];
        bestPot = pot;
        const swap = best;
        best = trial;
        trial = swap;
        bestIsClosest = false;
      }
    }
    if (bestIdx < 0) throw new Error('k-means++: no candidate centre with a finite potential');
    for (let t = 0; t < dim; t++) centres[c * dim + t] = points[bestIdx * dim + t];
    if (!bestIsClosest) {
      const swap = closest;
      closest = best;
      best = swap;
    }
  }
  return centres;
}

/** XSadd (Saito & Matsumoto), seeded as the ml-xsadd package seeds it: floats in [0, 1) with 24 random bits. */
function xsadd(seed: number): () => number {
  if (!Number.isInteger(seed)) throw new TypeError('seed must be an integer');
  const s = new Uint32Array(4);
  const mul = (a: number, b: number) => {
    a >>>= 0;
    b >>>= 0;
    const lo = a & 0xffff;
    const hi = a - lo;
    return (((hi * b) >>> 0) + lo * b) >>> 0;
  };
  const nextState = () => {
    let t = s[0];
    t ^= t << 15;
    t ^= t >>> 18;
    t ^= s[3] << 11;
    s[0] = s[1];
    s[1] = s[2];
    s[2] = s[3];
    s[3] = t;
  };
  s[0] = seed;
  for (let i = 1; i < 8; i++) s[i & 3] ^= (i + mul(1812433253, s[(i - 1) & 3] ^ ((s[(i - 1) & 3] >>> 30) >>> 0))) >>> 0;
  if (s[0] === 0 && s[1] === 0 && s[2] === 0 && s[3] === 0) s.set([88, 83, 65, 68]);
  for (let i = 0; i < 8; i++) nextState();
  return () => {
    nextState();
    return (((s[3] + s[2]) >>> 0) >>> 8) * (1 / 16777216);
  };
}
