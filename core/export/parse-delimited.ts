import { InputError } from '../errors';

/**
 * Parses delimited text (RFC 4180: quoted fields may hold the delimiter,
 * doubled quotes and line breaks; CRLF or LF line ends; a final line break is
 * optional) into rows of string fields. A byte-order mark is skipped. An
 * unterminated quote is an InputError naming the file and the line where the
 * field began. Blank lines are skipped.
 */
export function parseDelimited(text: string, delimiter: string, file: string): string[][] {
  const rows: string[][] = [];
  let row: string[] = [];
  let field = '';
  let i = text.charCodeAt(0) === 0xfeff ? 1 : 0;
  let line = 1;
  /** The current line has content (a character, a quote or a delimiter). */
  let rowStarted = false;
  /** The current field has content (an opening quote must come first). */
  let fieldStarted = false;
  const n = text.length;
  const endRow = () => {
    row.push(field);
    if (rowStarted) rows.push(row);
    row = [];
    field = '';
    rowStarted = false;
    fieldStarted = false;
  };
  while (i < n) {
    const ch = text[i];
    if (ch === '"' && !fieldStarted) {
      const startLine = line;
      fieldStarted = true;
      rowStarted = true;
      i++;
      for (;;) {
        if (i >= n) throw new InputError({ file, row: startLine, problem: 'a quoted field is never closed', fix: 'close the quote or remove it' });
        const c = text[i];
        if (c === '"') {
          if (text[i + 1] === '"') {
            field += '"';
            i += 2;
            continue;
          }
          i++;
          break;
        }
        if (c === '\n') line++;
        field += c;
        i++;
      }
      continue;
    }
    if (ch === delimiter) {
      row.push(field);
      field = '';
      fieldStarted = false;
      rowStarted = true;
      i++;
    } else if (ch === '\r' && text[i + 1] === '\n') {
      endRow();
      line++;
      i += 2;
    } else if (ch === '\n') {
      endRow();
      line++;
      i++;
    } else {
      field += ch;
      fieldStarted = true;
      rowStarted = true;
      i++;
    }
  }
  if (rowStarted) endRow();
  return rows;
}
