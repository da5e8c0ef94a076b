import type { RandomAccessFile, SessionSource } from '../../core/io/session-source';

/** An in-memory SessionSource (as the browser's File objects would be), streaming in chunks of `chunk` bytes. */
export function memorySource(files: Record<string, string | Uint8Array>, chunk = 1 << 16, name = 'mem'): SessionSource {
  const bytes = new Map(Object.entries(files).map(([k, v]) => [k, typeof v === 'string' ? new TextEncoder().encode(v) : v]));
  const get = (f: string) => {
    const b = bytes.get(f);
    if (!b) throw new Error(`no file ${f}`);
    return b;
  };
  return {
    name,
    async list() {
      return [...bytes.keys()];
    },
    async *stream(f: string) {
      const b = get(f);
      for (let i = 0; i < b.length; i += chunk) yield b.slice(i, i + chunk);
    },
    async readAll(f: string) {
      return get(f).slice();
    },
    async openRandomAccess(f: string): Promise<RandomAccessFile> {
      const b = get(f);
      return { size: b.length, read: (o: number, n: number) => b.slice(o, o + n) };
    },
  };
}
