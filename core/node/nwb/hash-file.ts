/**
 * Size and SHA-256 (lowercase hex) of a file, read as a stream in 1 MiB
 * pieces so a multi-gigabyte NWB file is never held in memory.
 */
import { createHash } from 'node:crypto';
import { createReadStream, statSync } from 'node:fs';

export async function hashFile(path: string): Promise<{ bytes: number; sha256: string }> {
  const hash = createHash('sha256');
  await new Promise<void>((resolve, reject) => {
    createReadStream(path, { highWaterMark: 1 << 20 })
      .on('data', (chunk) => hash.update(chunk))
      .on('error', reject)
      .on('end', () => resolve());
  });
  return { bytes: statSync(path).size, sha256: hash.digest('hex') };
}
