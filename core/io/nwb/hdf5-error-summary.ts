/**
 * One line from an error raised by the HDF5 library (through h5wasm's
 * throwing error handler): the last "minor: ..." line of its error stack,
 * which names the most specific cause ("file signature not found",
 * "address of object past end of allocation"), or else the first line of the
 * message, at most 120 characters. Used inside InputError paragraphs, which
 * never show the library's whole stack.
 */
export function hdf5ErrorSummary(e: unknown): string {
  const text = String(e instanceof Error ? e.message : e);
  const minor = /minor: ([^\n]+)/g;
  let last = '';
  for (let m = minor.exec(text); m; m = minor.exec(text)) last = m[1].trim();
  return last || text.split('\n')[0].slice(0, 120);
}
