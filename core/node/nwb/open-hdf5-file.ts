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
 * The caller must close() the handle (try/finally).
 */
import { closeSync, openSync, readSync, statSync } from 'node:fs';
import { basename } from 'node:path';
import type { Dataset, Entity, File as H5File, Group, Metadata } from 'h5wasm';
import { InputError } from '../../errors';
import type { H5AttrValue, H5Class, H5Data, H5DatasetInfo, H5Numeric, Hdf5File } from '../../io/nwb/hdf5-access';

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

/** The HDF5 format signature, "\x89HDF\r\n\x1a\n". */
const SIGNATURE = [0x89, 0x48, 0x44, 0x46, 0x0d, 0x0a, 0x1a, 0x0a];

/** True when the file carries the HDF5 signature at 0 or at a power-of-two offset >= 512. */
export function hasHdf5Signature(path: string): boolean {
  const size = statSync(path).size;
  const fd = openSync(path, 'r');
  try {
    const buf = Buffer.alloc(8);
    for (let offset = 0; offset + 8 <= size; offset = offset === 0 ? 512 : offset * 2) {
      if (readSync(fd, buf, 0, 8, offset) === 8 && SIGNATURE.every((b, i) => buf[i] === b)) return true;
    }
    return false;
  } finally {
    closeSync(fd);
  }
}

/** An open HDF5 file: the core interface plus close(). */
export interface OpenHdf5File extends Hdf5File {
  close(): void;
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
    throw new InputError({ file: name, problem: `the HDF5 library could not open the file (${firstLine(e)})`, fix: 'check that the file is complete and not damaged' });
  }
  return new H5wasmFile(h5, file, name);
}

function firstLine(e: unknown): string {
  const text = String(e instanceof Error ? e.message : e);
  const minor = /minor: ([^\n]+)/g;
  let last = '';
  for (let m = minor.exec(text); m; m = minor.exec(text)) last = m[1].trim();
  return last || text.split('\n')[0].slice(0, 120);
}

class H5wasmFile implements OpenHdf5File {
  constructor(
    private readonly h5: H5Module,
    private readonly file: H5File,
    private readonly name: string,
  ) {}

  private fail(path: string, e: unknown): never {
    throw new InputError({ file: this.name, problem: `the HDF5 library could not read ${path} (${firstLine(e)})`, fix: 'check that the file is complete and not damaged' });
  }

  private entity(path: string): Entity | null {
    try {
      return this.file.get(path);
    } catch {
      return null;
    }
  }

  kind(path: string): 'group' | 'dataset' | null {
    const e = this.entity(path);
    if (e instanceof this.h5.Group) return 'group';
    if (e instanceof this.h5.Dataset) return 'dataset';
    return null;
  }

  keys(groupPath: string): readonly string[] {
    const e = this.entity(groupPath);
    if (!(e instanceof this.h5.Group)) return [];
    return [...(e as Group).keys()].sort();
  }

  attrNames(path: string): readonly string[] {
    const e = this.entity(path);
    if (!e || !('attrs' in e)) return [];
    try {
      return Object.keys((e as Group).attrs);
    } catch (err) {
      return this.fail(path, err);
    }
  }

  attr(path: string, name: string): H5AttrValue | undefined {
    const e = this.entity(path);
    if (!e || !('attrs' in e)) return undefined;
    const holder = e as Group;
    let attrs;
    try {
      attrs = holder.attrs;
    } catch (err) {
      return this.fail(path, err);
    }
    const a = attrs[name];
    if (!a) return undefined;
    try {
      if (a.metadata.type === 7) {
        const v = a.value as unknown;
        const ref = Array.isArray(v) ? v[0] : v;
        if (!ref) return undefined;
        const target = this.file.dereference(ref as never) as { path?: string } | null;
        return target?.path ? { refPath: target.path } : undefined;
      }
      const v = a.value;
      if (v === null) return undefined;
      if (a.metadata.type === 8 && a.metadata.enum_type && isBoolEnum(a.metadata)) {
        return typeof v === 'number' ? v !== 0 : v as H5AttrValue;
      }
      if (Array.isArray(v)) return v.map((x) => String(x));
      return v as H5AttrValue;
    } catch (err) {
      return this.fail(`${path} attribute ${name}`, err);
    }
  }

  private dataset(path: string): Dataset {
    const e = this.entity(path);
    if (!(e instanceof this.h5.Dataset)) throw new InputError({ file: this.name, problem: `${path} is not a dataset` });
    return e as Dataset;
  }

  info(datasetPath: string): H5DatasetInfo {
    const d = this.dataset(datasetPath);
    let m: Metadata;
    try {
      m = d.metadata;
    } catch (err) {
      return this.fail(datasetPath, err);
    }
    return { shape: m.shape ?? [], elementClass: classOf(m), elementBytes: m.size };
  }

  read(datasetPath: string, start?: number, stop?: number): H5Data {
    const d = this.dataset(datasetPath);
    const info = this.info(datasetPath);
    const rows = info.shape.length === 0 ? 1 : info.shape[0];
    const a = Math.max(0, Math.min(rows, start ?? 0));
    const b = Math.max(a, Math.min(rows, stop ?? rows));
    const rowSize = info.shape.slice(1).reduce((p, n) => p * n, 1);
    if (b - a === 0 || rowSize === 0) return emptyOf(info);
    let raw: unknown;
    try {
      if (info.shape.length === 0) raw = d.value;
      else if (a === 0 && b === rows) raw = d.value;
      else raw = d.slice([[a, b], ...info.shape.slice(1).map(() => [] as [])]);
    } catch (err) {
      return this.fail(datasetPath, err);
    }
    if (info.elementClass === 'reference') {
      const refs = (Array.isArray(raw) ? raw : [raw]) as unknown[];
      return refs.map((r) => {
        try {
          const t = this.file.dereference(r as never) as { path?: string } | null;
          return t?.path ?? '';
        } catch {
          return '';
        }
      });
    }
    if (info.elementClass === 'string') {
      if (Array.isArray(raw)) return raw.map((x) => String(x));
      return [String(raw)];
    }
    if (ArrayBuffer.isView(raw)) return raw as H5Numeric;
    if (typeof raw === 'number') return Float64Array.of(raw);
    if (typeof raw === 'bigint') return BigInt64Array.of(raw);
    if (typeof raw === 'boolean') return Uint8Array.of(raw ? 1 : 0);
    if (Array.isArray(raw)) return raw.map((x) => String(x));
    return [String(raw)];
  }

  close(): void {
    try {
      this.file.close();
    } catch {
      /* already closed */
    }
  }
}

function isBoolEnum(m: Metadata): boolean {
  const members = Object.keys(m.enum_type?.members ?? {});
  return members.length === 2 && members.includes('TRUE') && members.includes('FALSE');
}

function classOf(m: Metadata): H5Class {
  switch (m.type) {
    case 0:
      return m.signed ? 'int' : 'uint';
    case 1:
      return 'float';
    case 3:
      return 'string';
    case 7:
      return 'reference';
    case 6:
      return 'compound';
    case 8:
      return isBoolEnum(m) ? 'bool' : m.signed ? 'int' : 'uint';
    default:
      return 'other';
  }
}

function emptyOf(info: H5DatasetInfo): H5Data {
  switch (info.elementClass) {
    case 'float':
      return info.elementBytes === 4 ? new Float32Array(0) : new Float64Array(0);
    case 'int':
      return info.elementBytes === 8 ? new BigInt64Array(0) : new Int32Array(0);
    case 'uint':
    case 'bool':
      return info.elementBytes === 8 ? new BigUint64Array(0) : new Uint32Array(0);
    default:
      return [];
  }
}
