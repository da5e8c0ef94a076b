import type { RandomAccessFile, SessionSource } from '../../core/io/session-source';
import type { SessionFileInput } from './api';

/** Chunk size of streamed reads, bytes. */
export const STREAM_CHUNK_BYTES = 4 * 1024 * 1024;

interface FileReaderSyncLike {
  readAsArrayBuffer(blob: Blob): ArrayBuffer;
}

/**
 * A SessionSource (core/io/session-source.ts) over Blobs: Files picked in the
 * browser, files read through the desktop bridge, or the bundled demo's
 * fetched files. Streams in STREAM_CHUNK_BYTES chunks; random access (for a
 * raw voltage file) uses FileReaderSync, which exists in workers only.
 */
export function createBlobSessionSource(name: string, files: readonly SessionFileInput[]): SessionSource {
  const byName = new Map(files.map((f) => [f.name, f.blob]));
  const get = (file: string): Blob => {
    const b = byName.get(file);
    if (!b) throw new Error(`${file} is not part of the session`);
    return b;
  };
  const Reader = (globalThis as unknown as { FileReaderSync?: new () => FileReaderSyncLike }).FileReaderSync;
  const source: SessionSource = {
    name,
    list: async () => [...byName.keys()],
    async *stream(file) {
      const b = get(file);
      for (let off = 0; off < b.size; off += STREAM_CHUNK_BYTES) yield new Uint8Array(await b.slice(off, off + STREAM_CHUNK_BYTES).arrayBuffer());
    },
    readAll: async (file) => new Uint8Array(await get(file).arrayBuffer()),
  };
  if (Reader) {
    source.openRandomAccess = async (file): Promise<RandomAccessFile> => {
      const b = get(file);
      const reader = new Reader();
      return { size: b.size, read: (offset, length) => new Uint8Array(reader.readAsArrayBuffer(b.slice(offset, offset + length))) };
    };
  }
  return source;
}
