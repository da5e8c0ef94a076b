/**
 * Opens an HDF5 file on disk for reading through h5wasm and exposes it as the
 * core Hdf5File interface (core/io/nwb/hdf5-access.ts).
 *
 * h5wasm's Node build mounts the real file system (Emscripten NODERAWFS), so
 * the HDF5 library reads only the blocks it needs: opening a multi-gigabyte
 * NWB file to read its units and interval tables does not load the raw
 * voltage datasets (checked by bench/nwb-memory.ts).
 *
 * Before handing the file to HDF5 the first bytes are checked for the HDF5
 * signature (at offset 0, 512, 1024, 2048, ... as the HDF5 file format
 * specification allows for a user block), so "not an HDF5 file" is reported
 * plainly. Errors raised by the HDF5 library itself are caught and reported
 * as one paragraph naming the file, never with the library's trace.
 *
 * The h5wasm objects are translated by core/io/nwb/wrap-h5wasm-file.ts, which
 * the browser worker shares (renderer/worker/open-hdf5-bytes.ts).
 *
 * The caller must close() the handle (try/finally).
 */
import { closeSync, openSync, readSync, statSync } from 'node:fs';
import { basename } from 'node:path';
import type { File as H5File } from 'h5wasm';
import { InputError } from '../../errors';
import type { OpenHdf5File } from '../../io/nwb/hdf5-access';
import { hasHdf5Signature as signatureIn } from '../../io/nwb/has-hdf5-signature';
import { hdf5ErrorSummary } from '../../io/nwb/hdf5-error-summary';
import { wrapH5wasmFile } from '../../io/nwb/wrap-h5wasm-file';

export type { OpenHdf5File } from '../../io/nwb/hdf5-access';

type H5Module = typeof import('h5wasm');

let modulePromise: Promise<H5Module> | null = null;

/** Loads h5wasm once per process; HDF5 errors become exceptions instead of console output. */
async function loadH5wasm(): Promise<H5Module> {
  if (!modulePromise) {
    modulePromise = (async () => {
      const h5 = (await import('h5wasm/node')) as unknown as H5Module;
      const mod = await h5.ready;
      mod.activate_throwing_error_handler();
      return h5;
    })();
  }
  return modulePromise;
}

/** True when the file on disk carries the HDF5 signature at 0 or at a power-of-two offset >= 512. */
export function hasHdf5Signature(path: string): boolean {
  const size = statSync(path).size;
  const fd = openSync(path, 'r');
  try {
    return signatureIn(size, (offset) => {
      const buf = Buffer.alloc(8);
      const n = readSync(fd, buf, 0, 8, offset);
      return new Uint8Array(buf.buffer, buf.byteOffset, n);
    });
  } finally {
    closeSync(fd);
  }
}

/** Opens `path` read-only. Throws InputError when the file is missing or not HDF5. */
export async function openHdf5File(path: string): Promise<OpenHdf5File> {
  const name = basename(path);
  let isFile = false;
  try {
    isFile = statSync(path).isFile();
  } catch {
    /* reported below */
  }
  if (!isFile) throw new InputError({ file: name, problem: `the file ${path} does not exist or is not a regular file`, fix: 'check the path' });
  if (!hasHdf5Signature(path)) {
    throw new InputError({
      file: name,
      problem: 'this is not an HDF5 file (no HDF5 signature), so it cannot be an NWB 2.x file',
      fix: 'give an NWB 2.x file (HDF5), or a session folder',
    });
  }
  const h5 = await loadH5wasm();
  let file: H5File;
  try {
    file = new h5.File(path, 'r');
  } catch (e) {
    throw new InputError({ file: name, problem: `the HDF5 library could not open the file (${hdf5ErrorSummary(e)})`, fix: 'check that the file is complete and not damaged' });
  }
  return wrapH5wasmFile(h5, file, name);
}
