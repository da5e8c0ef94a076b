/**
 * Decodes UTF-8 bytes [start, end) to a string. ASCII takes a fast path;
 * other text is decoded per RFC 3629, with U+FFFD for each invalid or
 * truncated sequence (as the WHATWG TextDecoder does in replacement mode).
 * Pure: core may not rely on a platform TextDecoder.
 */
export function decodeUtf8(b: Uint8Array, start = 0, end = b.length): string {
  let ascii = true;
  for (let i = start; i < end; i++) {
    if (b[i] >= 0x80) {
      ascii = false;
      break;
    }
  }
  if (ascii) {
    if (end - start < 4096) return String.fromCharCode.apply(null, b.subarray(start, end) as unknown as number[]);
    let s = '';
    for (let i = start; i < end; i += 4096) s += String.fromCharCode.apply(null, b.subarray(i, Math.min(end, i + 4096)) as unknown as number[]);
    return s;
  }
  const out: number[] = [];
  let s = '';
  let i = start;
  while (i < end) {
    const c = b[i];
    let cp = 0xfffd;
    let len = 1;
    if (c < 0x80) cp = c;
    else if (c >= 0xc2 && c <= 0xdf) {
      if (i + 1 < end && (b[i + 1] & 0xc0) === 0x80) {
        cp = ((c & 0x1f) << 6) | (b[i + 1] & 0x3f);
        len = 2;
      }
    } else if (c >= 0xe0 && c <= 0xef) {
      const lo = c === 0xe0 ? 0xa0 : 0x80;
      const hi = c === 0xed ? 0x9f : 0xbf;
      if (i + 2 < end && b[i + 1] >= lo && b[i + 1] <= hi && (b[i + 2] & 0xc0) === 0x80) {
        cp = ((c & 0x0f) << 12) | ((b[i + 1] & 0x3f) << 6) | (b[i + 2] & 0x3f);
        len = 3;
      } else if (i + 1 < end && b[i + 1] >= lo && b[i + 1] <= hi) len = 2;
    } else if (c >= 0xf0 && c <= 0xf4) {
      const lo = c === 0xf0 ? 0x90 : 0x80;
      const hi = c === 0xf4 ? 0x8f : 0xbf;
      if (i + 3 < end && b[i + 1] >= lo && b[i + 1] <= hi && (b[i + 2] & 0xc0) === 0x80 && (b[i + 3] & 0xc0) === 0x80) {
        cp = ((c & 0x07) << 18) | ((b[i + 1] & 0x3f) << 12) | ((b[i + 2] & 0x3f) << 6) | (b[i + 3] & 0x3f);
        len = 4;
      } else if (i + 1 < end && b[i + 1] >= lo && b[i + 1] <= hi) len = i + 2 < end && (b[i + 2] & 0xc0) === 0x80 ? 3 : 2;
    }
    if (cp > 0xffff) {
      cp -= 0x10000;
      out.push(0xd800 + (cp >> 10), 0xdc00 + (cp & 0x3ff));
    } else out.push(cp);
    i += len;
    if (out.length > 4096) {
      s += String.fromCharCode.apply(null, out);
      out.length = 0;
    }
  }
  return s + String.fromCharCode.apply(null, out);
}
