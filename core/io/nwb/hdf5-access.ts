/**
 * The small HDF5 access interface the NWB reader works against.
 *
 * core/io/nwb/ interprets NWB through this interface only, so the same logic
 * runs in Node (core/node/nwb/open-hdf5-file.ts, h5wasm on the real file
 * system, reading only the parts asked for) and in a browser worker (h5wasm on
 * its in-memory or worker file system), and in tests against a plain
 * in-memory fake.
 *
 * Paths are absolute HDF5 paths ("/units/spike_times"). Soft links are
 * followed. Numeric data come back as the typed array of the stored type;
 * 64-bit integers as BigInt64Array / BigUint64Array (convert with care).
 */

/** Numeric data as stored. */
export type H5Numeric =
  | Float64Array
  | Float32Array
  | Int8Array
  | Uint8Array
  | Int16Array
  | Uint16Array
  | Int32Array
  | Uint32Array
  | BigInt64Array
  | BigUint64Array;

/** What a dataset read gives: numbers as stored, text as strings. */
export type H5Data = H5Numeric | readonly string[];

/** An attribute's value. Object references are given as the path they point to. */
export type H5AttrValue = string | number | bigint | boolean | readonly string[] | H5Numeric | { readonly refPath: string };

/** Element class of a dataset. */
export type H5Class = 'float' | 'int' | 'uint' | 'string' | 'bool' | 'reference' | 'compound' | 'other';

/** Shape and element type of a dataset. */
export interface H5DatasetInfo {
  /** Dimensions; [] for a scalar dataset. */
  readonly shape: readonly number[];
  readonly elementClass: H5Class;
  /** Bytes per element. */
  readonly elementBytes: number;
}

/** Read access to one open HDF5 file. */
export interface Hdf5File {
  /** What is at a path: "group", "dataset", or null when nothing (or a broken link). */
  kind(path: string): 'group' | 'dataset' | null;
  /** Member names of a group, sorted by name. */
  keys(groupPath: string): readonly string[];
  /** Attribute names of a group or dataset. */
  attrNames(path: string): readonly string[];
  /** One attribute, or undefined when absent. */
  attr(path: string, name: string): H5AttrValue | undefined;
  /** Shape and type of a dataset. */
  info(datasetPath: string): H5DatasetInfo;
  /**
   * Rows [start, stop) along the first axis (default: all), flattened in
   * row-major order. A scalar dataset gives one element. Reference datasets
   * give the referenced paths as strings.
   */
  read(datasetPath: string, start?: number, stop?: number): H5Data;
}

/** An open HDF5 file: the read interface plus close() (callers close it in try/finally). */
export interface OpenHdf5File extends Hdf5File {
  close(): void;
}
