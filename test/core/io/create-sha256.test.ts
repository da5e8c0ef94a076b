import { createHash } from 'node:crypto';
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { createSha256 } from '../../../core/io/create-sha256';

const hex = (bytes: Uint8Array, chunk = 0) => {
  const h = createSha256();
  if (chunk <= 0) h.update(bytes);
  else for (let i = 0; i < bytes.length; i += chunk) h.update(bytes.subarray(i, i + chunk));
  return h.digestHex();
};
const enc = (s: string) => new TextEncoder().encode(s);

describe('createSha256', () => {
  // Example vectors: NIST FIPS 180-4 / "SHA-256 examples" (NIST CSRC, cryptographic standards and guidelines, example values).
  it('"abc" (one block)', () => {
    expect(hex(enc('abc'))).toBe('ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad');
  });
  it('448-bit message (two blocks)', () => {
    expect(hex(enc('abcdbcdecdefdefgefghfghighijhijkijkljklmklmnlmnomnopnopq'))).toBe('248d6a61d20638b8e5c026930c3e6039a33ce45964ff2167f6ecedd419db06c1');
  });
  it('one million "a" in odd chunks', () => {
    expect(hex(new Uint8Array(1_000_000).fill(97), 999)).toBe('cdc76e5c9914fb9281a1c7e284d73e67f1809a48a497200e046d39ccc7112cd0');
  });
  it('empty message', () => {
    expect(hex(new Uint8Array(0))).toBe('e3b0c44298fc1c149afbf4c8996fb92427ae41e4649b934ca495991b7852b855');
  });
  it('matches node:crypto on random bytes and chunkings (reference library: OpenSSL via node:crypto)', () => {
    fc.assert(
      fc.property(fc.uint8Array({ maxLength: 300 }), fc.integer({ min: 0, max: 70 }), (bytes, chunk) => {
        expect(hex(bytes, chunk)).toBe(createHash('sha256').update(bytes).digest('hex'));
      }),
      { numRuns: 300 },
    );
  });
});
