/**
 * Splits CSV text into records of string cells (RFC 4180: fields separated
 * by `delimiter`, records by LF or CRLF; a field in double quotes may hold
 * delimiters, quotes written twice, and line breaks). A UTF-8 BOM is dropped;
 * a final line break does not make an empty record. Used to read back tables
 * tagbench wrote itself (units.csv of a run); user inputs go through the
 * streaming importer (core/io), which validates and converts types.
 * Throws on a quote that is never closed.
 */
export function parseCsvRecords(text: string, delimiter = ','): string[][] {
  const out: string[][] = [];
  let i = text.charCodeAt(0) === 0xfeff ? 1 : 0;
  const n = text.length;
  if (i >= n) return out;
  let record: string[] = [];
  let field = '';
  for (;;) {
    if (i < n && text[i] === '"') {
      // quoted field
      i++;
      for (;;) {
        const q = text.indexOf('"', i);
        if (q < 0) throw new Error('parseCsvRecords: a quoted field is never closed');
        field += text.slice(i, q);
        if (text[q + 1] === '"') {
          field += '"';
          i = q + 2;
        } else {
          i = q + 1;
          break;
        }
      }
    }
    // unquoted part (or what follows a closing quote) up to the next delimiter or line end
    let j = i;
    while (j < n && text[j] !== delimiter && text[j] !== '\n' && text[j] !== '\r') j++;
    field += text.slice(i, j);
    record.push(field);
    field = '';
    if (j >= n) {
      out.push(record);
      break;
    }
    if (text[j] === delimiter) {
      i = j + 1;
      continue;
    }
    // line end
    out.push(record);
    record = [];
    i = text[j] === '\r' && text[j + 1] === '\n' ? j + 2 : j + 1;
    if (i >= n) break;
  }
  return out;
}
