/**
 * The threaded SHA-256 of the Node edge against node:crypto's one-shot
 * digest of the same bytes (reference: OpenSSL via node:crypto), for sizes
 * around the inline limit and the slot size, any chunking, and several
 * hashes open at once; plus the FIPS 180-4 "abc" example vector.
 */
import { createHash } from 'node:crypto';
import { afterAll, describe, expect, it } from 'vitest';
import { createWorkerSha256 } from '../../../core/node/create-worker-sha256';

const ref = (b: Uint8Array) => createHash('sha256').update(b).digest('hex');
function bytes(n: number, seed: number): Uint8Array {
  const b = new Uint8Array(n);
  let s = seed >>> 0;
  for (let i = 0; i < n; i++) b[i] = (s = (Math.imul(s, 1103515245) + 12345) >>> 0) >>> 24;
  return b;
}

describe('createWorkerSha256', () => {
  const hasher = createWorkerSha256();
  afterAll(() => hasher.close());

  it('FIPS 180-4 example "abc" and the empty input', () => {
    const h = hasher.createHash();
    h.update(new TextEncoder().encode('abc'));
    expect(h.digestHex()).toBe('ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad');
    expect(hasher.createHash().digestHex()).toBe('e3b0c44298fc1c149afbf4c8996fb92427ae41e4649b934ca495991b7852b855');
  });

  it('equals node:crypto for sizes around the inline limit and the slot size, any chunking', () => {
    const M = 1 << 20;
    for (const n of [1, M - 1, M, M + 1, 3 * M + 17, 9 * M + 5]) {
      const b = bytes(n, n);
      for (const chunk of [n, 4 * M, M, 65_537, 333_333]) {
        const h = hasher.createHash();
        for (let o = 0; o < n; o += chunk) h.update(b.subarray(o, o + chunk));
        expect(h.digestHex()).toBe(ref(b));
      }
    }
  });

  it('keeps several hashes apart when their updates interleave, and the caller may reuse its buffer', () => {
    const a = bytes(5_000_000, 1);
    const b = bytes(2_500_000, 2);
    const ha = hasher.createHash();
    const hb = hasher.createHash();
    const buf = new Uint8Array(1 << 18); // reused between updates, as the file reader reuses its chunk
    for (let o = 0; o < a.length; o += buf.length) {
      const pa = a.subarray(o, o + buf.length);
      buf.set(pa);
      ha.update(buf.subarray(0, pa.length));
      if (o < b.length) {
        const pb = b.subarray(o, o + buf.length);
        buf.set(pb);
        hb.update(buf.subarray(0, pb.length));
      }
    }
    expect(hb.digestHex()).toBe(ref(b));
    expect(ha.digestHex()).toBe(ref(a));
  });

  it('refuses use after the digest', () => {
    const h = hasher.createHash();
    h.digestHex();
    expect(() => h.update(new Uint8Array(1))).toThrow(/update after digest/);
    expect(() => h.digestHex()).toThrow(/digest called twice/);
  });
});
