/**
 * Streaming parser for delimited text (CSV, TSV, semicolon-separated), fed
 * Uint8Array chunks of any size and parsing bytes directly (no whole-file
 * string): numeric columns go straight into growable Float64Arrays, id
 * columns are interned to Int32 codes plus a dictionary.
 *
 * Format (RFC 4180, relaxed as spreadsheets write it):
 *  - optional UTF-8 byte-order mark; lines end in LF or CRLF;
 *  - delimiter detected from the header line: the most frequent of tab,
 *    comma, semicolon outside quotes (comma when none occurs);
 *  - fields may be quoted with "..." ("" is a quote; delimiters and line
 *    breaks inside quotes are data); spaces around unquoted values are trimmed;
 *  - the first non-blank line is the header; blank lines are skipped;
 *  - every row must have as many fields as the header (an error names the row);
 *  - numbers: decimal or exponent notation; "nan", "inf", "-inf" (any case,
 *    also "Infinity") give NaN / +-Infinity for the validator to judge;
 *    with a semicolon delimiter a decimal comma is accepted (0,5 = 0.5).
 *    Up to 15 significant digits are converted exactly with one correctly
 *    rounded IEEE operation (Clinger's fast path); longer ones via Number().
 *  - empty numeric cells: NaN when the column allows it, else an error.
 *
 * Columns not asked for are ignored, or (keepExtra) kept as text and turned
 * into Float64Array at finish() when every non-empty cell is a number.
 * Errors are InputErrors naming file, line (header = line 1), column, value.
 * Speed: a two-column [id, number] table (the spike table) reads its plain
 * records (`7,0.0123` + LF or CRLF, known id) in a tight record loop and
 * hands every other record to the general field-by-field path; both give
 * the same values (tested byte for byte; pairFastPath: false turns it off).
 * Memory: the parsed columns (8 bytes per number; 2 per id code while a column
 * has fewer than 65,536 distinct ids, else 4) plus one partial record carried
 * between chunks.
 */
import { InputError } from '../errors';
import { decodeUtf8 } from './decode-utf8';

export type ColumnKind = 'number' | 'code' | 'text';

export interface ColumnSpec {
  /** Header name in the file. */
  readonly name: string;
  readonly kind: ColumnKind;
  /** Missing column is an error when true. */
  readonly required: boolean;
  /** Number columns: empty cells become NaN (else an error). */
  readonly allowEmpty?: boolean;
  /**
   * Number and code columns: hand the column over as the parser's row blocks
   * (table.pieces) instead of one joined array, so a long column is never
   * copied (the spike table: buildRecording reads it piece by piece).
   */
  readonly pieces?: boolean;
}

export interface DelimitedSpec {
  /** File name for messages. */
  readonly file: string;
  readonly columns: readonly ColumnSpec[];
  /** Keep columns not in `columns` (as number or text columns). */
  readonly keepExtra?: boolean;
  /**
   * Read plain `<id>,<number>` records of a two-column [code, number] table
   * through the record fast path (default true; false always takes the
   * general path: the tests compare the two on the same bytes).
   */
  readonly pairFastPath?: boolean;
}

export interface CodeColumn {
  readonly codes: Int32Array;
  /** dictionary[code] = the text of the cell. */
  readonly dictionary: readonly string[];
}

export interface DelimitedTable {
  readonly file: string;
  readonly header: readonly string[];
  readonly delimiter: string;
  readonly rowCount: number;
  readonly numbers: ReadonlyMap<string, Float64Array>;
  readonly codes: ReadonlyMap<string, CodeColumn>;
  readonly texts: ReadonlyMap<string, readonly string[]>;
  /**
   * Columns asked for with `pieces`: consecutive blocks of rows (every column's
   * blocks have the same lengths), codes with their dictionary.
   */
  readonly pieces: ReadonlyMap<string, { readonly numbers?: Float64Array[]; readonly codes?: (Int32Array | Uint16Array)[]; readonly dictionary?: readonly string[] }>;
  /** Extra columns (keepExtra), in header order. */
  readonly extra: ReadonlyMap<string, Float64Array | readonly string[]>;
  /** Header names present in the file but not read. */
  readonly ignored: readonly string[];
  /** 1-based line of record i (header = line 1). */
  rowOf(index: number): number;
}

export interface DelimitedParser {
  push(chunk: Uint8Array): void;
  finish(): DelimitedTable;
}

const QUOTE = 34;
const LF = 10;
const CR = 13;
const SPACE = 32;
const TAB = 9;

const K_SKIP = 0;
const K_NUMBER = 1;
const K_CODE = 2;
const K_TEXT = 3;

const POW10 = Array.from({ length: 23 }, (_, i) => Number(`1e${i}`));

/** Returned by the number scanner when the bytes are not a number. */
const BAD = Symbol('bad');

/** scanDecimalDigits' results: mantissa, significant digits taken, power of ten, 1 if any digit was seen. */
const DEC = new Float64Array(4);

/**
 * Reads the digits of a decimal number from buf[p] (after its sign): the
 * integer part, then after '.' (or ',' when `comma`) the fraction. Keeps up
 * to 16 significant digits in DEC[0] (exact as a double when 15 or fewer),
 * their count in DEC[1], the power of ten that scales them in DEC[2], and
 * DEC[3] = 1 when any digit was seen; returns the position after the last
 * digit. The record fast path and the general field path both read numbers
 * with it, so both give the same values.
 */
function scanDecimalDigits(buf: Uint8Array, p: number, n: number, comma: boolean): number {
  let mant = 0;
  let digits = 0;
  let exp = 0;
  let saw = 0;
  let ch = p < n ? buf[p] : -1;
  while (ch >= 48 && ch <= 57) {
    saw = 1;
    if (digits < 16) {
      if (mant !== 0 || ch !== 48) digits++;
      mant = mant * 10 + (ch - 48);
    } else exp++;
    ch = ++p < n ? buf[p] : -1;
  }
  if (ch === 46 || (comma && ch === 44)) {
    ch = ++p < n ? buf[p] : -1;
    while (ch >= 48 && ch <= 57) {
      saw = 1;
      if (digits < 16) {
        if (mant !== 0 || ch !== 48) digits++;
        mant = mant * 10 + (ch - 48);
        exp--;
      }
      ch = ++p < n ? buf[p] : -1;
    }
  }
  DEC[0] = mant;
  DEC[1] = digits;
  DEC[2] = exp;
  DEC[3] = saw;
  return p;
}

export function createDelimitedParser(spec: DelimitedSpec): DelimitedParser {
  const file = spec.file;
  let leftover: Uint8Array<ArrayBufferLike> | null = null;
  let started = false; // BOM handled
  let header: string[] | null = null;
  let delim = 44;
  let decimalComma = false;
  let line = 1; // line number of the next record start
  let rowCount = 0;
  let capacity = 0; // rows that fit before a new block is needed
  let blockBase = 0; // global row index of the current block's first row
  // line breakpoints: from record breakIdx[k] on, rowOf(i) = i + breakShift[k]
  const breakIdx: number[] = [0];
  const breakShift: number[] = [2];

  // per header column
  let kinds: Uint8Array = new Uint8Array(0);
  let allowEmpty: Uint8Array = new Uint8Array(0);
  let names: string[] = [];
  let numCols: (Float64Array | null)[] = [];
  let codeCols: (CodeBlock | null)[] = [];
  let numDone: Float64Array[][] = [];
  let codeDone: CodeBlock[][] = [];
  let textCols: (string[] | null)[] = [];
  let dicts: { list: string[]; byString: Map<string, number>; small: Int32Array; byNumber: Map<number, number> }[] = [];

  // scratch for unescaping quoted fields
  let scratch: Uint8Array = new Uint8Array(256);

  const fail = (row: number, column: string | undefined, value: string | undefined, problem: string, fix?: string): never => {
    throw new InputError({ file, row, ...(column !== undefined ? { column } : {}), ...(value !== undefined ? { value } : {}), problem, ...(fix ? { fix } : {}) });
  };

  function setupHeader(h: string[]): void {
    header = h;
    names = h;
    const n = h.length;
    kinds = new Uint8Array(n);
    allowEmpty = new Uint8Array(n);
    numCols = new Array(n).fill(null);
    codeCols = new Array(n).fill(null);
    numDone = Array.from({ length: n }, () => []);
    codeDone = Array.from({ length: n }, () => []);
    textCols = new Array(n).fill(null);
    dicts = new Array(n);
    const seen = new Map<string, number>();
    h.forEach((name, i) => {
      if (seen.has(name) && name !== '') fail(1, name, undefined, `the header names column "${name}" twice`, 'give every column a distinct name');
      seen.set(name, i);
    });
    for (const c of spec.columns) {
      const i = seen.get(c.name);
      if (i === undefined) {
        if (c.required) {
          const shown = h.length === 1 ? `the header was read as one column "${h[0]}" (delimiter not found)` : `the header has: ${h.join(', ')}`;
          fail(1, c.name, undefined, `required column "${c.name}" is missing; ${shown}`, 'rename the column in the file, or map it with "columns" in session.json');
        }
        continue;
      }
      kinds[i] = c.kind === 'number' ? K_NUMBER : c.kind === 'code' ? K_CODE : K_TEXT;
      allowEmpty[i] = c.allowEmpty ? 1 : 0;
    }
    for (let i = 0; i < n; i++) {
      if (kinds[i] === K_SKIP && spec.keepExtra && h[i] !== '') kinds[i] = K_TEXT;
      if (kinds[i] === K_CODE) dicts[i] = { list: [], byString: new Map(), small: new Int32Array(1024).fill(-1), byNumber: new Map() };
    }
    grow(1024);
    // the spike table's layout (an id, then a number) gets a record-at-a-time fast path
    simplePair = spec.pairFastPath !== false && n === 2 && kinds[0] === K_CODE && kinds[1] === K_NUMBER && !decimalComma;
  }

  /** True when the columns are [code, number] (see simplePairs). */
  let simplePair = false;

  /**
   * Parses consecutive records of the plainest form, `<id>,<number>` + LF or
   * CRLF (id: a known canonical non-negative integer of up to 9 digits;
   * number: as the number fast path takes it, converted exactly in one IEEE
   * operation), into the current block, and returns where it stopped: the
   * start of the first record that is anything else (quotes, spaces, empty or
   * new ids, long or exotic numbers, blank lines, a record cut by the chunk
   * end, a full block), which the general path then reads. The values are
   * those the general path gives the same bytes.
   */
  function simplePairs(buf: Uint8Array, pos: number): number {
    const n = buf.length;
    const codes = codeCols[0]!;
    const nums = numCols[1]!;
    const small = dicts[0].small;
    const d = delim;
    let shift = breakShift[breakShift.length - 1];
    while (rowCount < capacity && pos < n) {
      // ---- id ----
      let ch = buf[pos];
      if (ch < 49 || ch > 57) break;
      let v = ch - 48;
      let p = pos + 1;
      ch = p < n ? buf[p] : -1;
      while (ch >= 48 && ch <= 57 && p - pos < 9) {
        v = v * 10 + (ch - 48);
        ch = ++p < n ? buf[p] : -1;
      }
      if (ch !== d || v >= small.length) break;
      const code = small[v];
      if (code < 0) break;
      // ---- number ----
      ch = ++p < n ? buf[p] : -1;
      let neg = false;
      if (ch === 45 || ch === 43) {
        neg = ch === 45;
        ch = ++p < n ? buf[p] : -1;
      }
      p = scanDecimalDigits(buf, p, n, false);
      ch = p < n ? buf[p] : -1;
      const mant = DEC[0];
      const digits = DEC[1];
      const exp = DEC[2];
      if (DEC[3] === 0 || digits > 15 || exp < -22 || exp > 22) break;
      // ---- end of record ----
      if (ch === CR) {
        if (p + 1 >= n || buf[p + 1] !== LF) break;
        p++;
      } else if (ch !== LF) break;
      let x = exp < 0 ? mant / POW10[-exp] : mant * POW10[exp];
      if (neg) x = -x;
      const row = rowCount - blockBase;
      codes[row] = code;
      nums[row] = x;
      if (line !== rowCount + shift) {
        breakIdx.push(rowCount);
        breakShift.push((shift = line - rowCount));
      }
      rowCount++;
      line++;
      pos = p + 1;
    }
    return pos;
  }

  /**
   * Starts a new block of BLOCK rows for every numeric and code column (full
   * blocks are kept in a list and joined once at finish(): no doubling copies).
   */
  function grow(_min: number): void {
    for (let i = 0; i < kinds.length; i++) {
      if (kinds[i] === K_NUMBER) {
        if (numCols[i]) numDone[i].push(numCols[i]!);
        numCols[i] = new Float64Array(BLOCK);
      } else if (kinds[i] === K_CODE) {
        if (codeCols[i]) codeDone[i].push(codeCols[i]!);
        // 2 bytes per code while the dictionary has fewer than 65,536 ids (see widen)
        codeCols[i] = dicts[i].list.length < 65536 ? new Uint16Array(BLOCK) : new Int32Array(BLOCK);
      } else if (kinds[i] === K_TEXT && !textCols[i]) textCols[i] = [];
    }
    if (capacity > 0) blockBase += BLOCK;
    capacity = blockBase + BLOCK;
  }

  /** Interns field bytes [s, e) of fieldBuf into column i's dictionary. */
  function intern(i: number, b: Uint8Array, s: number, e: number): number {
    const d = dicts[i];
    const len = e - s;
    if (len > 0 && len <= 9 && (b[s] !== 48 || len === 1)) {
      let v = 0;
      let k = s;
      for (; k < e; k++) {
        const c = b[k] - 48;
        if (c < 0 || c > 9) break;
        v = v * 10 + c;
      }
      if (k === e) {
        if (v < d.small.length) {
          const code = d.small[v];
          if (code >= 0) return code;
          const nc = d.list.length;
          d.list.push(String(v));
          d.small[v] = nc;
          return nc;
        }
        if (v < 1 << 20) {
          const big = new Int32Array(Math.max(v + 1, d.small.length * 2)).fill(-1);
          big.set(d.small);
          d.small = big;
          return intern(i, b, s, e);
        }
        const code = d.byNumber.get(v);
        if (code !== undefined) return code;
        const nc = d.list.length;
        d.list.push(String(v));
        d.byNumber.set(v, nc);
        return nc;
      }
    }
    const str = decodeUtf8(b, s, e);
    const code = d.byString.get(str);
    if (code !== undefined) return code;
    const nc = d.list.length;
    d.list.push(str);
    d.byString.set(str, nc);
    return nc;
  }

  /** Parses bytes [s, e) as a number (trimmed), or BAD. */
  function slowNumber(b: Uint8Array, s: number, e: number): number | typeof BAD {
    while (s < e && (b[s] === SPACE || b[s] === TAB)) s++;
    while (e > s && (b[e - 1] === SPACE || b[e - 1] === TAB)) e--;
    if (s === e) return BAD;
    let str = decodeUtf8(b, s, e);
    if (decimalComma) str = str.replace(',', '.');
    const low = str.toLowerCase();
    if (low === 'nan' || low === '+nan' || low === '-nan') return NaN;
    if (low === 'inf' || low === '+inf' || low === 'infinity' || low === '+infinity') return Infinity;
    if (low === '-inf' || low === '-infinity') return -Infinity;
    if (!/^[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?$/.test(str)) return BAD;
    return Number(str);
  }

  /**
   * Parses complete records of buf from `pos`. Returns the offset of the first
   * byte not consumed (start of an incomplete record), or buf.length.
   */
  function parseRecords(buf: Uint8Array, pos: number, final: boolean): number {
    const n = buf.length;
    const nCols = kinds.length;
    const kindOf = kinds;
    let nums = numCols;
    let cods = codeCols;
    while (pos < n) {
      if (simplePair) {
        pos = simplePairs(buf, pos);
        if (pos >= n) break;
      }
      const recStart = pos;
      const recLine = line;
      let newlines = 0;
      if (rowCount >= capacity) {
        grow(rowCount + 1);
        nums = numCols;
        cods = codeCols;
      }
      const row = rowCount - blockBase; // slot in the current block
      let col = 0;
      let complete = false;
      // blank line?
      if (buf[pos] === LF) {
        pos++;
        line++;
        continue;
      }
      if (buf[pos] === CR) {
        if (pos + 1 < n) {
          if (buf[pos + 1] === LF) {
            pos += 2;
            line++;
            continue;
          }
        } else if (!final) return recStart;
        else {
          pos++;
          line++;
          continue;
        }
      }
      for (;;) {
        // ---- one field starting at pos ----
        const kind = col < nCols ? kindOf[col] : K_SKIP;
        if (col >= nCols) {
          fail(recLine, undefined, undefined, `this row has more fields than the header's ${nCols}`, 'quote values that contain the delimiter');
        }
        let c = pos < n ? buf[pos] : -1;
        let fieldStart = pos;
        let fieldEnd: number;
        let b: Uint8Array = buf;
        if (kind === K_NUMBER && c !== QUOTE && c !== SPACE) {
          // fast path: scan and convert in one pass
          let neg = false;
          let p = pos;
          if (c === 45 || c === 43) {
            neg = c === 45;
            p++;
          }
          p = scanDecimalDigits(buf, p, n, decimalComma);
          let ch = p < n ? buf[p] : -1;
          const mant = DEC[0];
          const digits = DEC[1]; // significant digits taken
          let exp = DEC[2];
          let ok = DEC[3] === 1;
          if (ok && (ch === 101 || ch === 69)) {
            ch = ++p < n ? buf[p] : -1;
            let eneg = false;
            if (ch === 45 || ch === 43) {
              eneg = ch === 45;
              ch = ++p < n ? buf[p] : -1;
            }
            let ev = 0;
            let ed = false;
            while (ch >= 48 && ch <= 57) {
              ed = true;
              if (ev < 100000) ev = ev * 10 + (ch - 48);
              ch = ++p < n ? buf[p] : -1;
            }
            ok = ed;
            exp += eneg ? -ev : ev;
          }
          if (ch === -1 && !final) return recStart; // field may continue in the next chunk
          if (ok && (ch === delim || ch === LF || ch === CR || ch === -1)) {
            let v: number;
            if (digits <= 15 && exp >= -22 && exp <= 22) {
              v = exp < 0 ? mant / POW10[-exp] : mant * POW10[exp];
              if (neg) v = -v;
            } else v = Number(decodeUtf8(buf, pos, p).replace(',', '.')); // sign included
            nums[col]![row] = v;
            pos = p;
            c = ch;
            // fall through to terminator handling
            if (c === delim) {
              pos++;
              col++;
              continue;
            }
            // end of record (LF, CR or end of data)
            if (c === CR) {
              if (pos + 1 < n) {
                if (buf[pos + 1] === LF) pos++;
              } else if (!final) return recStart;
            }
            if (c !== -1) pos++;
            col++;
            complete = true;
            break;
          }
          // not a plain number: fall back to the general field path below
        }
        if (kind === K_CODE && c >= 49 && c <= 57) {
          // fast path: a canonical non-negative integer id (no leading zero)
          let v = c - 48;
          let p = pos + 1;
          let ch = p < n ? buf[p] : -1;
          while (ch >= 48 && ch <= 57 && p - pos < 9) {
            v = v * 10 + (ch - 48);
            ch = ++p < n ? buf[p] : -1;
          }
          if (ch === -1 && !final) return recStart;
          const small = dicts[col].small;
          if ((ch === delim || ch === LF || ch === CR || ch === -1) && v < small.length && small[v] >= 0) {
            cods[col]![row] = small[v];
            pos = p;
            col++;
            if (ch === delim) {
              pos++;
              continue;
            }
            if (ch === CR) {
              if (pos + 1 < n) {
                if (buf[pos + 1] === LF) pos++;
              } else if (!final) return recStart;
            }
            if (ch !== -1) pos++;
            complete = true;
            break;
          }
        }
        // ---- general field ----
        if (c === QUOTE) {
          let p = pos + 1;
          let w = 0;
          let closed = false;
          while (p < n) {
            const ch = buf[p];
            if (ch === QUOTE) {
              if (p + 1 < n && buf[p + 1] === QUOTE) {
                if (w >= scratch.length) scratch = growScratch(scratch, w + 1);
                scratch[w++] = QUOTE;
                p += 2;
                continue;
              }
              if (p + 1 >= n && !final) return recStart;
              closed = true;
              p++;
              break;
            }
            if (ch === LF) newlines++;
            if (w >= scratch.length) scratch = growScratch(scratch, w + 1);
            scratch[w++] = ch;
            p++;
          }
          if (!closed) {
            if (!final) return recStart;
            fail(recLine, names[col], undefined, 'a quoted value is not closed before the end of the file', 'close the quote or remove it');
          }
          // only spaces may follow the closing quote
          while (p < n && (buf[p] === SPACE || buf[p] === TAB) && buf[p] !== delim) p++;
          if (p >= n && !final) return recStart;
          c = p < n ? buf[p] : -1;
          if (c !== delim && c !== LF && c !== CR && c !== -1) {
            fail(recLine, names[col], undefined, 'text follows a closing quote', 'write a quote inside a quoted value as two quotes ("")');
          }
          b = scratch;
          fieldStart = 0;
          fieldEnd = w;
          pos = p;
        } else {
          let p = pos;
          while (p < n) {
            const ch = buf[p];
            if (ch === delim || ch === LF || ch === CR) break;
            p++;
          }
          if (p >= n && !final) return recStart;
          fieldEnd = p;
          pos = p;
          c = p < n ? buf[p] : -1;
          // trim spaces (not the delimiter itself)
          while (fieldStart < fieldEnd && (buf[fieldStart] === SPACE || (buf[fieldStart] === TAB && delim !== TAB))) fieldStart++;
          while (fieldEnd > fieldStart && (buf[fieldEnd - 1] === SPACE || (buf[fieldEnd - 1] === TAB && delim !== TAB))) fieldEnd--;
        }
        if (kind === K_NUMBER) {
          if (fieldStart === fieldEnd) {
            if (!allowEmpty[col]) fail(recLine + newlines, names[col], '', 'the value is empty', 'give a number (empty cells are allowed only in optional columns)');
            numCols[col]![row] = NaN;
          } else {
            const v = slowNumber(b, fieldStart, fieldEnd);
            if (v === BAD) fail(recLine + newlines, names[col], decodeUtf8(b, fieldStart, fieldEnd), 'the value is not a number', 'use digits with "." as decimal point');
            numCols[col]![row] = v as number;
          }
        } else if (kind === K_CODE) {
          const code = intern(col, b, fieldStart, fieldEnd);
          if (code > 65535 && codeCols[col] instanceof Uint16Array) codeCols[col] = Int32Array.from(codeCols[col]!); // widen this block
          codeCols[col]![row] = code;
        } else if (kind === K_TEXT) {
          textCols[col]![rowCount] = decodeUtf8(b, fieldStart, fieldEnd);
        }
        col++;
        if (c === delim) {
          pos++;
          continue;
        }
        if (c === CR) {
          if (pos + 1 < n) {
            if (buf[pos + 1] === LF) pos++;
          } else if (!final) return recStart;
        }
        if (c !== -1) pos++;
        complete = true;
        break;
      }
      if (!complete) return recStart;
      if (col === 1 && nCols > 1) {
        // a line holding one empty field is a blank line (e.g. spaces only)
        const k = kinds[0];
        const empty =
          k === K_TEXT ? textCols[0]![rowCount] === '' : k === K_CODE ? dicts[0].list[codeCols[0]![row]] === '' : k === K_NUMBER ? numCols[0]![row] !== numCols[0]![row] : isBlank(buf, recStart, pos);
        if (empty) {
          line += 1 + newlines;
          continue;
        }
      }
      if (col !== nCols) fail(recLine, undefined, undefined, `this row has ${col} field(s) but the header has ${nCols}`, 'give every row one value per column (empty cells are allowed)');
      if (recLine !== rowCount + breakShift[breakShift.length - 1]) {
        breakIdx.push(rowCount);
        breakShift.push(recLine - rowCount);
      }
      rowCount++;
      line += 1 + newlines;
    }
    return pos;
  }

  function parseHeader(buf: Uint8Array, final: boolean): number {
    let pos = 0;
    let blank = 0;
    // skip blank lines
    for (;;) {
      if (pos < buf.length && (buf[pos] === LF || buf[pos] === CR)) {
        if (buf[pos] === LF) blank++;
        pos++;
      } else break;
    }
    // find the end of the header line (outside quotes)
    let inQ = false;
    let end = -1;
    const counts = { [TAB]: 0, 44: 0, 59: 0 } as Record<number, number>;
    for (let p = pos; p < buf.length; p++) {
      const ch = buf[p];
      if (ch === QUOTE) inQ = !inQ;
      else if (!inQ && (ch === LF || ch === CR)) {
        end = p;
        break;
      } else if (!inQ && (ch === TAB || ch === 44 || ch === 59)) counts[ch]++;
    }
    if (end < 0 && !final) return -1;
    if (end === buf.length - 1 && buf[end] === CR && !final) return -1; // LF may follow in the next chunk
    if (end < 0) end = buf.length;
    if (end === pos) return -2; // empty
    line += blank;
    delim = counts[TAB] >= counts[44] && counts[TAB] >= counts[59] && counts[TAB] > 0 ? TAB : counts[59] > counts[44] ? 59 : 44;
    decimalComma = delim === 59;
    // parse the header line as a record of text fields
    const h: string[] = [];
    let p = pos;
    for (;;) {
      let str: string;
      if (buf[p] === QUOTE) {
        let q = p + 1;
        const bytes: number[] = [];
        for (; q < end; q++) {
          if (buf[q] === QUOTE) {
            if (buf[q + 1] === QUOTE) {
              bytes.push(QUOTE);
              q++;
              continue;
            }
            break;
          }
          bytes.push(buf[q]);
        }
        str = decodeUtf8(Uint8Array.from(bytes));
        q++;
        while (q < end && buf[q] !== delim) q++;
        p = q;
      } else {
        let e = p;
        while (e < end && buf[e] !== delim) e++;
        str = decodeUtf8(buf, p, e);
        p = e;
      }
      h.push(str.trim());
      if (p < end && buf[p] === delim) {
        p++;
        continue;
      }
      break;
    }
    setupHeader(h);
    // consume the line break
    let q = end;
    if (q < buf.length && buf[q] === CR) q++;
    if (q < buf.length && buf[q] === LF) q++;
    line++;
    return q;
  }

  function feed(buf: Uint8Array<ArrayBufferLike>, final: boolean): void {
    let pos = 0;
    if (!started) {
      if (buf.length < 3 && !final) {
        leftover = buf.slice();
        return;
      }
      if (buf[0] === 0xef && buf[1] === 0xbb && buf[2] === 0xbf) pos = 3;
      started = true;
      buf = buf.subarray(pos);
      pos = 0;
    }
    if (!header) {
      const q = parseHeader(buf, final);
      if (q === -1) {
        leftover = buf.slice();
        return;
      }
      if (q === -2) return;
      pos = q;
    }
    const stop = parseRecords(buf, pos, final);
    if (stop >= buf.length) leftover = null;
    else if (buf.buffer === work.buffer) {
      // keep the partial record at the start of the work buffer (no new allocation)
      work.copyWithin(0, buf.byteOffset + stop, buf.byteOffset + buf.length);
      leftover = work.subarray(0, buf.length - stop);
    } else leftover = buf.slice(stop);
  }

  /** Reused buffer joining a partial record with the next chunk (grows to the largest chunk + record). */
  let work = new Uint8Array(0);

  return {
    push(chunk: Uint8Array): void {
      if (chunk.length === 0) return;
      let buf: Uint8Array<ArrayBufferLike> = chunk;
      if (leftover) {
        const L = leftover.length;
        if (work.length < L + chunk.length) {
          const w = new Uint8Array(Math.max(L + chunk.length, Math.ceil(work.length * 1.5)));
          w.set(leftover);
          work = w;
        } else if (leftover.buffer !== work.buffer || leftover.byteOffset !== 0) work.set(leftover);
        work.set(chunk, L);
        buf = work.subarray(0, L + chunk.length);
        leftover = null;
      }
      feed(buf, false);
    },
    finish(): DelimitedTable {
      const rest = leftover ?? new Uint8Array(0);
      leftover = null;
      feed(rest, true);
      if (!header) {
        throw new InputError({ file, problem: 'the file is empty', fix: 'export the table with a header row and at least one data row' });
      }
      const numbers = new Map<string, Float64Array>();
      const codes = new Map<string, CodeColumn>();
      const texts = new Map<string, readonly string[]>();
      const extra = new Map<string, Float64Array | readonly string[]>();
      const pieces = new Map<string, { numbers?: Float64Array[]; codes?: CodeBlock[]; dictionary?: readonly string[] }>();
      const wanted = new Set(spec.columns.map((c) => c.name));
      const inPieces = new Set(spec.columns.filter((c) => c.pieces).map((c) => c.name));
      const ignored: string[] = [];
      const last = rowCount - blockBase;
      names.forEach((name, i) => {
        const k = kinds[i];
        if (inPieces.has(name) && k === K_NUMBER) pieces.set(name, { numbers: blockList(numDone[i], numCols[i]!, last) });
        else if (inPieces.has(name) && k === K_CODE) pieces.set(name, { codes: blockList<CodeBlock>(codeDone[i], codeCols[i]!, last), dictionary: dicts[i].list });
        else if (k === K_NUMBER) numbers.set(name, join(new Float64Array(rowCount), numDone[i], numCols[i]!, rowCount - blockBase));
        else if (k === K_CODE) codes.set(name, { codes: join(new Int32Array(rowCount), codeDone[i], codeCols[i]!, rowCount - blockBase), dictionary: dicts[i].list });
        else if (k === K_TEXT) {
          const t = textCols[i]!;
          t.length = rowCount;
          if (wanted.has(name)) texts.set(name, t);
          else extra.set(name, numericIfAll(t));
        } else if (name !== '') ignored.push(name);
      });
      // drop the blocks now joined, so they can be collected while the table lives on
      numDone = [];
      codeDone = [];
      numCols = [];
      codeCols = [];
      const bi = breakIdx.slice();
      const bs = breakShift.slice();
      return {
        file,
        header: names,
        delimiter: String.fromCharCode(delim),
        rowCount,
        numbers,
        codes,
        texts,
        pieces,
        extra,
        ignored,
        rowOf(index: number): number {
          let lo = 0;
          let hi = bi.length - 1;
          while (lo < hi) {
            const mid = (lo + hi + 1) >> 1;
            if (bi[mid] <= index) lo = mid;
            else hi = mid - 1;
          }
          return index + bs[lo];
        },
      };
    },
  };

}

/** A block of id codes: Uint16 while a column has fewer than 65,536 distinct ids, then Int32. */
type CodeBlock = Uint16Array | Int32Array;

/** Rows per column block. */
const BLOCK = 1 << 16;

function join<T extends Float64Array | Int32Array>(out: T, full: (T | Uint16Array)[], last: T | Uint16Array, lastRows: number): T {
  let o = 0;
  for (const b of full) {
    out.set(b, o);
    o += b.length;
  }
  out.set(last.subarray(0, lastRows), o);
  return out;
}

/** The full blocks and the used part of the last one (no empty last block). */
function blockList<T extends Float64Array | Int32Array | Uint16Array>(full: T[], last: T, lastRows: number): T[] {
  return lastRows > 0 ? [...full, last.subarray(0, lastRows) as T] : full.slice();
}

function growScratch(a: Uint8Array, min: number): Uint8Array {
  const b = new Uint8Array(Math.max(min, a.length * 2));
  b.set(a);
  return b;
}

function isBlank(b: Uint8Array, s: number, e: number): boolean {
  for (let i = s; i < e; i++) if (b[i] !== SPACE && b[i] !== TAB && b[i] !== CR && b[i] !== LF) return false;
  return true;
}

const NUMBER_TEXT = /^[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?$/;

/** A text column whose non-empty cells are all numbers becomes a Float64Array (empty -> NaN). */
function numericIfAll(t: string[]): Float64Array | string[] {
  let any = false;
  for (const s of t) {
    if (s === '') continue;
    if (!NUMBER_TEXT.test(s)) return t;
    any = true;
  }
  if (!any) return t;
  return Float64Array.from(t, (s) => (s === '' ? NaN : Number(s)));
}
