import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { decodeUtf8 } from '../../../core/io/decode-utf8';

// Reference: the WHATWG Encoding Standard's UTF-8 decoder in replacement mode, as implemented by Node's TextDecoder.
const ref = new TextDecoder('utf-8', { fatal: false, ignoreBOM: true });

describe('decodeUtf8', () => {
  it('decodes valid text like TextDecoder', () => {
    fc.assert(fc.property(fc.string({ unit: 'binary', maxLength: 300 }), (s) => {
      const b = new TextEncoder().encode(s);
      expect(decodeUtf8(b)).toBe(ref.decode(b));
    }));
  });
  it('replaces invalid and truncated sequences like TextDecoder', () => {
    fc.assert(fc.property(fc.uint8Array({ maxLength: 64 }), (b) => {
      expect(decodeUtf8(b)).toBe(ref.decode(b));
    }), { numRuns: 2000 });
    for (const bad of [[0xc3], [0xe2, 0x82], [0xf0, 0x9f, 0x98], [0xed, 0xa0, 0x80], [0xc0, 0xaf], [0xf4, 0x90, 0x80, 0x80], [0x80, 0x41]]) {
      const b = Uint8Array.from(bad);
      expect(decodeUtf8(b)).toBe(ref.decode(b));
    }
  });
  it('decodes a sub-range and long ASCII', () => {
    const b = new TextEncoder().encode('xxunitéyy');
    expect(decodeUtf8(b, 2, 8)).toBe('unité');
    const long = 'a'.repeat(10000);
    expect(decodeUtf8(new TextEncoder().encode(long))).toBe(long);
  });
});
