/**
 * A session folder as the importer sees it, whatever holds it: the Node edge
 * implements it over the file system (core/node/create-fs-session-source.ts),
 * the renderer over File objects from <input type=file webkitdirectory>.
 * Names are relative to the folder, "/"-separated. The importer only reads.
 */
export interface SessionSource {
  /** Display name of the session (the folder's base name). */
  readonly name: string;
  /** Every file name in the folder (relative; subfolders as "sub/name"). */
  list(): Promise<readonly string[]>;
  /** The file's bytes in order, in chunks of any size. */
  stream(file: string): AsyncIterable<Uint8Array>;
  /** The whole file (used for .npy arrays, which are read whole). */
  readAll(file: string): Promise<Uint8Array>;
  /** Random access for large binary files (raw voltage), when the host can offer it synchronously. */
  openRandomAccess?(file: string): Promise<RandomAccessFile>;
}

/** Synchronous reads by offset (Node: fs.readSync; browser worker: FileReaderSync). */
export interface RandomAccessFile {
  readonly size: number;
  /** Up to `length` bytes from `offset` (fewer at the end of the file). */
  read(offset: number, length: number): Uint8Array;
  /**
   * Optional: fills `into` from `offset` (fewer bytes at the end of the file)
   * and returns the count, so a reader can reuse one buffer (no allocation per read).
   */
  readInto?(offset: number, into: Uint8Array): number;
  /** Optional: releases the file (Node: closes the descriptor). No read may follow. */
  close?(): void;
}
