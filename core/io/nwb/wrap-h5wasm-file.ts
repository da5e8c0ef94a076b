/**
 * Wraps a file opened with h5wasm as the core Hdf5File interface
 * (hdf5-access.ts), whichever h5wasm build opened it: the Node build on the
 * real file system (core/node/nwb/open-hdf5-file.ts) or the browser build on
 * its in-memory file system in the analysis worker
 * (renderer/worker/open-hdf5-bytes.ts). One translation of h5wasm's objects,
 * so both hosts read NWB identically.
 *
 * Core does not import h5wasm (scripts/check-imports.ts): the caller passes
 * the loaded module, and this file describes only the few members it uses
 * (structural types below, matching h5wasm 0.10's File, Group, Dataset,
 * Attribute and Metadata).
 *
 * Translation (h5wasm 0.10 behaviour): 64-bit integers come as BigInt typed
 * arrays; booleans are an enum type with members TRUE/FALSE (given as
 * booleans for attributes, 'bool' class for datasets); object references
 * (attributes and datasets) are resolved to the paths they point to; strings
 * come as JS strings. Errors raised by the HDF5 library while reading are
 * reported as one InputError paragraph naming the file and the object, with
 * the library's last "minor" message, never its trace.
 */
import { InputError } from '../../errors';
import { hdf5ErrorSummary } from './hdf5-error-summary';
import type { H5AttrValue, H5Class, H5Data, H5DatasetInfo, H5Numeric, OpenHdf5File } from './hdf5-access';

/** The parts of h5wasm's Metadata used here. */
export interface H5wasmMetadata {
  readonly type: number;
  readonly signed: boolean;
  readonly size: number;
  readonly shape: number[] | null;
  readonly enum_type?: { readonly members: Record<string, unknown> };
}

interface H5wasmAttribute {
  readonly metadata: H5wasmMetadata;
  readonly value: unknown;
}

interface H5wasmEntity {
  readonly attrs?: Record<string, H5wasmAttribute>;
}

/** The parts of an open h5wasm File used here. */
export interface H5wasmFileLike {
  get(path: string): unknown;
  dereference(ref: never): unknown;
  close(): unknown;
}

/** The parts of the h5wasm module used here (classes for instanceof). */
export interface H5wasmLike {
  readonly Group: abstract new (...args: never[]) => unknown;
  readonly Dataset: abstract new (...args: never[]) => unknown;
}

interface GroupLike extends H5wasmEntity {
  keys(): string[];
}

interface DatasetLike extends H5wasmEntity {
  readonly metadata: H5wasmMetadata;
  readonly value: unknown;
  slice(ranges: ([] | [number, number])[]): unknown;
}

/** Wraps `file` (opened with the module `h5`); `name` is the file name used in messages. */
export function wrapH5wasmFile(h5: H5wasmLike, file: H5wasmFileLike, name: string): OpenHdf5File {
  return new H5wasmFile(h5, file, name);
}

class H5wasmFile implements OpenHdf5File {
  constructor(
    private readonly h5: H5wasmLike,
    private readonly file: H5wasmFileLike,
    private readonly name: string,
  ) {}

  private fail(path: string, e: unknown): never {
    throw new InputError({ file: this.name, problem: `the HDF5 library could not read ${path} (${hdf5ErrorSummary(e)})`, fix: 'check that the file is complete and not damaged' });
  }

  private entity(path: string): unknown {
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
    return [...(e as GroupLike).keys()].sort();
  }

  attrNames(path: string): readonly string[] {
    const e = this.entity(path) as H5wasmEntity | null;
    if (!e || typeof e !== 'object' || !('attrs' in e)) return [];
    try {
      return Object.keys(e.attrs ?? {});
    } catch (err) {
      return this.fail(path, err);
    }
  }

  attr(path: string, name: string): H5AttrValue | undefined {
    const e = this.entity(path) as H5wasmEntity | null;
    if (!e || typeof e !== 'object' || !('attrs' in e)) return undefined;
    let attrs: Record<string, H5wasmAttribute>;
    try {
      attrs = e.attrs ?? {};
    } catch (err) {
      return this.fail(path, err);
    }
    const a = attrs[name];
    if (!a) return undefined;
    try {
      if (a.metadata.type === 7) {
        const v = a.value;
        const ref = Array.isArray(v) ? v[0] : v;
        if (!ref) return undefined;
        const target = this.file.dereference(ref as never) as { path?: string } | null;
        return target?.path ? { refPath: target.path } : undefined;
      }
      const v = a.value;
      if (v === null) return undefined;
      if (a.metadata.type === 8 && a.metadata.enum_type && isBoolEnum(a.metadata)) {
        return typeof v === 'number' ? v !== 0 : (v as H5AttrValue);
      }
      if (Array.isArray(v)) return v.map((x) => String(x));
      return v as H5AttrValue;
    } catch (err) {
      return this.fail(`${path} attribute ${name}`, err);
    }
  }

  private dataset(path: string): DatasetLike {
    const e = this.entity(path);
    if (!(e instanceof this.h5.Dataset)) throw new InputError({ file: this.name, problem: `${path} is not a dataset` });
    return e as DatasetLike;
  }

  info(datasetPath: string): H5DatasetInfo {
    const d = this.dataset(datasetPath);
    let m: H5wasmMetadata;
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

function isBoolEnum(m: H5wasmMetadata): boolean {
  const members = Object.keys(m.enum_type?.members ?? {});
  return members.length === 2 && members.includes('TRUE') && members.includes('FALSE');
}

function classOf(m: H5wasmMetadata): H5Class {
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
