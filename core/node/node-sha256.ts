/**
 * SHA-256 through node:crypto (OpenSSL), with the Sha256 interface of
 * core/io/create-sha256.ts, for the Node edge. Same digests (checked in
 * test/core/io/create-sha256.test.ts), usually faster.
 */
import { createHash } from 'node:crypto';
import type { Sha256 } from '../io/create-sha256';

export function nodeSha256(): Sha256 {
  const h = createHash('sha256');
  return {
    update: (bytes: Uint8Array) => void h.update(bytes),
    digestHex: () => h.digest('hex'),
  };
}
