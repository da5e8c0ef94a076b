/**
 * Incremental SHA-256 (NIST FIPS 180-4, section 6.2) in pure TypeScript, so
 * the browser importer hashes input files with the same code as the CLI.
 * update() takes chunks of any size; digestHex() finishes and returns the
 * lowercase hex digest (call it once). Checked against the FIPS 180-4
 * example vectors ("abc", the 448-bit message, one million "a") and against
 * node:crypto on random inputs and chunkings.
 */
export interface Sha256 {
  update(bytes: Uint8Array): void;
  digestHex(): string;
}

const K = new Int32Array([
  0x428a2f98, 0x71374491, 0xb5c0fbcf, 0xe9b5dba5, 0x3956c25b, 0x59f111f1, 0x923f82a4, 0xab1c5ed5, 0xd807aa98, 0x12835b01, 0x243185be, 0x550c7dc3,
  0x72be5d74, 0x80deb1fe, 0x9bdc06a7, 0xc19bf174, 0xe49b69c1, 0xefbe4786, 0x0fc19dc6, 0x240ca1cc, 0x2de92c6f, 0x4a7484aa, 0x5cb0a9dc, 0x76f988da,
  0x983e5152, 0xa831c66d, 0xb00327c8, 0xbf597fc7, 0xc6e00bf3, 0xd5a79147, 0x06ca6351, 0x14292967, 0x27b70a85, 0x2e1b2138, 0x4d2c6dfc, 0x53380d13,
  0x650a7354, 0x766a0abb, 0x81c2c92e, 0x92722c85, 0xa2bfe8a1, 0xa81a664b, 0xc24b8b70, 0xc76c51a3, 0xd192e819, 0xd6990624, 0xf40e3585, 0x106aa070,
  0x19a4c116, 0x1e376c08, 0x2748774c, 0x34b0bcb5, 0x391c0cb3, 0x4ed8aa4a, 0x5b9cca4f, 0x682e6ff3, 0x748f82ee, 0x78a5636f, 0x84c87814, 0x8cc70208,
  0x90befffa, 0xa4506ceb, 0xbef9a3f7, 0xc67178f2,
]);

/**
 * Compresses every whole 64-byte block of b[off, end) into H (FIPS 180-4,
 * section 6.2.2). The working variables and the state stay in locals across
 * blocks; W holds the message schedule.
 */
function compressBlocks(H: Int32Array, W: Int32Array, b: Uint8Array, off: number, end: number): void {
  let h0 = H[0], h1 = H[1], h2 = H[2], h3 = H[3], h4 = H[4], h5 = H[5], h6 = H[6], h7 = H[7];
  for (; off + 64 <= end; off += 64) {
    for (let t = 0; t < 16; t++) {
      const i = off + 4 * t;
      W[t] = (b[i] << 24) | (b[i + 1] << 16) | (b[i + 2] << 8) | b[i + 3];
    }
    for (let t = 16; t < 64; t++) {
      const x = W[t - 15];
      const y = W[t - 2];
      const s0 = ((x >>> 7) | (x << 25)) ^ ((x >>> 18) | (x << 14)) ^ (x >>> 3);
      const s1 = ((y >>> 17) | (y << 15)) ^ ((y >>> 19) | (y << 13)) ^ (y >>> 10);
      W[t] = (((W[t - 16] + s0) | 0) + ((W[t - 7] + s1) | 0)) | 0;
    }
    let a = h0, bb = h1, c = h2, d = h3, e = h4, f = h5, g = h6, h = h7;
    for (let t = 0; t < 64; t++) {
      const S1 = ((e >>> 6) | (e << 26)) ^ ((e >>> 11) | (e << 21)) ^ ((e >>> 25) | (e << 7));
      const ch = (e & f) ^ (~e & g);
      const t1 = (((((h + S1) | 0) + ((ch + K[t]) | 0)) | 0) + W[t]) | 0;
      const S0 = ((a >>> 2) | (a << 30)) ^ ((a >>> 13) | (a << 19)) ^ ((a >>> 22) | (a << 10));
      const maj = (a & bb) ^ (a & c) ^ (bb & c);
      const t2 = (S0 + maj) | 0;
      h = g;
      g = f;
      f = e;
      e = (d + t1) | 0;
      d = c;
      c = bb;
      bb = a;
      a = (t1 + t2) | 0;
    }
    h0 = (h0 + a) | 0; h1 = (h1 + bb) | 0; h2 = (h2 + c) | 0; h3 = (h3 + d) | 0;
    h4 = (h4 + e) | 0; h5 = (h5 + f) | 0; h6 = (h6 + g) | 0; h7 = (h7 + h) | 0;
  }
  H[0] = h0; H[1] = h1; H[2] = h2; H[3] = h3; H[4] = h4; H[5] = h5; H[6] = h6; H[7] = h7;
}

export function createSha256(): Sha256 {
  const H = new Int32Array([0x6a09e667, 0xbb67ae85, 0x3c6ef372, 0xa54ff53a, 0x510e527f, 0x9b05688c, 0x1f83d9ab, 0x5be0cd19]);
  const W = new Int32Array(64);
  const block = new Uint8Array(64);
  let fill = 0;
  let total = 0; // bytes
  let done = false;

  return {
    update(bytes: Uint8Array): void {
      if (done) throw new Error('sha256: update after digest');
      let i = 0;
      const n = bytes.length;
      total += n;
      if (fill > 0) {
        const take = Math.min(64 - fill, n);
        block.set(bytes.subarray(0, take), fill);
        fill += take;
        i = take;
        if (fill < 64) return;
        compressBlocks(H, W, block, 0, 64);
        fill = 0;
      }
      const whole = n - ((n - i) % 64);
      compressBlocks(H, W, bytes, i, whole);
      i = whole;
      if (i < n) {
        block.set(bytes.subarray(i), 0);
        fill = n - i;
      }
    },
    digestHex(): string {
      if (done) throw new Error('sha256: digest called twice');
      done = true;
      const bits = total * 8;
      block[fill++] = 0x80;
      if (fill > 56) {
        block.fill(0, fill);
        compressBlocks(H, W, block, 0, 64);
        fill = 0;
      }
      block.fill(0, fill, 56);
      const hi = Math.floor(bits / 2 ** 32);
      const lo = bits >>> 0;
      block[56] = hi >>> 24; block[57] = hi >>> 16; block[58] = hi >>> 8; block[59] = hi;
      block[60] = lo >>> 24; block[61] = lo >>> 16; block[62] = lo >>> 8; block[63] = lo;
      compressBlocks(H, W, block, 0, 64);
      let s = '';
      for (let k = 0; k < 8; k++) s += (H[k] >>> 0).toString(16).padStart(8, '0');
      return s;
    },
  };
}
