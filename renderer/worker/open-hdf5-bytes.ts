/**
 * Opens an HDF5 (NWB) file from its bytes in the analysis worker, as the core
 * Hdf5File interface (core/io/nwb/hdf5-access.ts), so the worker reads NWB
 * files picked through the browser's file input, dropped on the Start screen
 * or read through the desktop bridge with the same core NWB reader as the
 * headless command.
 *
 * h5wasm's browser build (the module and its WebAssembly, loaded on first use
 * as a separate chunk, so folder sessions never load it) keeps files on an
 * in-memory file system: the bytes are written there (FS.writeFile) under a
 * private folder, opened read-only, and removed again by close(). The whole
 * file is held in the worker's memory while it is open (the file's size plus
 * what HDF5 reads from it); a session of several gigabytes of raw voltage
 * needs the desktop app or the headless command, which read from disk.
 *
 * Errors are InputError paragraphs naming the file: no HDF5 signature (checked
 * first, as on Node: core/io/nwb/has-hdf5-signature.ts), or the HDF5
 * library's own complaint in one line.
 */
import type * as H5wasm from 'h5wasm';
import { InputError } from '../../core/errors';
import type { OpenHdf5File } from '../../core/io/nwb/hdf5-access';
import { hasHdf5Signature } from '../../core/io/nwb/has-hdf5-signature';
import { hdf5ErrorSummary } from '../../core/io/nwb/hdf5-error-summary';
import { wrapH5wasmFile } from '../../core/io/nwb/wrap-h5wasm-file';

type H5Module = typeof H5wasm;

let loading: Promise<H5Module> | null = null;

/** h5wasm, loaded once per worker; HDF5 errors become exceptions instead of console output. */
function loadH5wasm(): Promise<H5Module> {
  loading ??= import('h5wasm').then(async (h5) => {
    const mod = await h5.ready;
    mod.activate_throwing_error_handler();
    return h5;
  });
  return loading;
}

let opened = 0;

export async function openHdf5Bytes(bytes: Uint8Array, name: string): Promise<OpenHdf5File> {
  if (!hasHdf5Signature(bytes.length, (offset) => bytes.subarray(offset, offset + 8))) {
    throw new InputError({
      file: name,
      problem: 'this is not an HDF5 file (no HDF5 signature), so it cannot be an NWB 2.x file',
      fix: 'give an NWB 2.x file (HDF5), or a session folder',
    });
  }
  const h5 = await loadH5wasm();
  const FS = h5.FS!;
  const dir = `/tagbench-${++opened}`;
  const path = `${dir}/file.h5`;
  FS.mkdir(dir);
  const cleanUp = () => {
    try {
      FS.unlink(path);
    } catch {
      /* not written */
    }
    try {
      FS.rmdir(dir);
    } catch {
      /* already gone */
    }
  };
  let file: H5wasm.File;
  try {
    FS.writeFile(path, bytes);
    file = new h5.File(path, 'r');
  } catch (e) {
    cleanUp();
    throw new InputError({ file: name, problem: `the HDF5 library could not open the file (${hdf5ErrorSummary(e)})`, fix: 'check that the file is complete and not damaged' });
  }
  const wrapped = wrapH5wasmFile(h5, file, name);
  return {
    kind: (p) => wrapped.kind(p),
    keys: (p) => wrapped.keys(p),
    attrNames: (p) => wrapped.attrNames(p),
    attr: (p, n) => wrapped.attr(p, n),
    info: (p) => wrapped.info(p),
    read: (p, a, b) => wrapped.read(p, a, b),
    close() {
      wrapped.close();
      cleanUp();
    },
  };
}
