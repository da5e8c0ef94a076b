/** Tables of one ziggurat sampler (see zigguratTables). */
export interface Ziggurat {
  /** Layers (a power of 2). */
  readonly n: number;
  /** Accept position j (24-bit integer) of layer i at once when j < k[i]. */
  readonly k: Float64Array;
  /** x = j * w[i]: the layer's width over 2^24. */
  readonly w: Float64Array;
  /** f at each layer's edge (f[0] = f(0) = 1). */
  readonly f: Float64Array;
  /** Right edge of the base strip's rectangle (the tail starts there). */
  readonly r: number;
}

const M = 16777216; // 2^24 positions per layer

/**
 * Ziggurat sampler tables (Marsaglia & Tsang 2000, "The Ziggurat Method for
 * Generating Random Variables", J Stat Softw 5(8); the construction of their
 * code, with 24-bit positions): `exponential`, 256 layers of f(x) = exp(-x),
 * r = 7.697117470131051, v = 0.003949659822581553; `normal` (one half, the sign
 * drawn apart), 128 layers of f(x) = exp(-x^2 / 2), r = 3.442619855896652,
 * v = 0.00991256303533647. r and v are the roots of the layers' closing
 * condition solved with SciPy (test/fixtures/random/ziggurat.json; the paper
 * prints them to 12-18 digits); the test rebuilds the edges from the fixture.
 * Built once, on first use.
 */
export function zigguratTables(): { exponential: Ziggurat; normal: Ziggurat } {
  if (!cache) {
    cache = {
      exponential: build(256, 7.697117470131051, 0.003949659822581553, (x) => Math.exp(-x), (y) => -Math.log(y), Math.exp(-7.697117470131051)),
      normal: build(128, 3.442619855896652, 0.00991256303533647, (x) => Math.exp(-0.5 * x * x), (y) => Math.sqrt(-2 * Math.log(y)), Math.exp(-0.5 * 3.442619855896652 * 3.442619855896652)),
    };
  }
  return cache;
}

let cache: { exponential: Ziggurat; normal: Ziggurat } | undefined;

function build(n: number, r: number, v: number, f: (x: number) => number, finv: (y: number) => number, fr: number): Ziggurat {
  const k = new Float64Array(n);
  const w = new Float64Array(n);
  const fx = new Float64Array(n);
  // Layer 0: the base strip, as a rectangle of width q = v / f(r) (beyond r: the tail).
  const q = v / fr;
  k[0] = (r / q) * M;
  k[1] = 0;
  w[0] = q / M;
  w[n - 1] = r / M;
  fx[0] = 1;
  fx[n - 1] = fr;
  let x = r;
  let prev = r;
  for (let i = n - 2; i >= 1; i--) {
    x = finv(v / x + f(x));
    k[i + 1] = (x / prev) * M;
    prev = x;
    fx[i] = f(x);
    w[i] = x / M;
  }
  return { n, k, w, f: fx, r };
}
