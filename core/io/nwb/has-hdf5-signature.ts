/** The HDF5 format signature, "\x89HDF\r\n\x1a\n". */
const SIGNATURE = [0x89, 0x48, 0x44, 0x46, 0x0d, 0x0a, 0x1a, 0x0a];

/**
 * True when a file of `size` bytes carries the HDF5 signature at offset 0 or
 * at a power-of-two offset >= 512 (the HDF5 File Format Specification, "Format
 * Signature": a user block of 512, 1024, 2048, ... bytes may precede it).
 * `read8(offset)` gives the 8 bytes at `offset` (fewer at the end of a file).
 * Used before a file is handed to the HDF5 library, so "not an HDF5 file" is
 * said plainly (Node: file reads; browser worker: the picked file's bytes).
 */
export function hasHdf5Signature(size: number, read8: (offset: number) => Uint8Array): boolean {
  for (let offset = 0; offset + 8 <= size; offset = offset === 0 ? 512 : offset * 2) {
    const b = read8(offset);
    if (b.length >= 8 && SIGNATURE.every((v, i) => b[i] === v)) return true;
  }
  return false;
}
