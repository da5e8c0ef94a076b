/**
 * The spike table as consecutive pieces (unit codes + times), the form
 * buildRecording reads spikes in: a whole array is one piece; the CSV parser
 * hands over its row blocks without joining them; the .npy reader reads both
 * files piece by piece through a small reused buffer (core/io/npy-spike-pieces.ts).
 * So no reader has to hold a second full-length copy of the spikes: the only
 * full-length array that importing creates is the recording's own.
 *
 * spikePieces(units, times) makes pieces from same-length arrays, in order
 * (units[k].length === times[k].length; an error otherwise, a reader bug).
 */

/** Unit codes of a piece (2 bytes each while there are fewer than 65,536 ids). */
export type UnitCodes = Int32Array | Uint16Array;

/** Spikes in file order, in pieces; every call of forEach sees the same pieces. */
export interface SpikePieces {
  /** Number of spikes (records) in all pieces. */
  readonly length: number;
  /**
   * Calls visit(unit, time, first) for each piece in file order: the unit
   * codes and the times (s) of records first .. first + time.length - 1.
   * The arrays may be reused between calls (read-only for the visitor; copy
   * what you keep). `last` tells the source this is the final visit, so it may
   * drop each piece once visited. Readers' input errors may be thrown.
   */
  forEach(visit: (unit: UnitCodes, time: Float64Array, first: number) => void, last?: boolean): void;
  /** The same pieces' unit codes alone (cheaper: times are not read). */
  forEachUnit(visit: (unit: UnitCodes, first: number) => void): void;
  /**
   * Optional: what a visit of forEachUnit would count, when the source knows
   * it already (the .npy reader counts while it codes the unit ids): spikes
   * per unit code, and each code's first record (0-based; -1 = none). One
   * entry per unit id; fresh arrays (the caller may keep them).
   */
  codeCounts?(): { readonly count: Float64Array; readonly first: Float64Array };
}

export function spikePieces(units: UnitCodes[], times: Float64Array[]): SpikePieces {
  if (units.length !== times.length) throw new Error('spikePieces: unit and time lists differ in length');
  let length = 0;
  for (let k = 0; k < units.length; k++) {
    if (units[k].length !== times[k].length) throw new Error(`spikePieces: piece ${k} has ${units[k].length} unit codes but ${times[k].length} times`);
    length += times[k].length;
  }
  const u: (UnitCodes | null)[] = units.slice();
  const t: (Float64Array | null)[] = times.slice();
  return {
    length,
    forEach(visit, last = false) {
      let first = 0;
      for (let k = 0; k < t.length; k++) {
        const tk = t[k];
        const uk = u[k];
        if (!tk || !uk) throw new Error('spikePieces: visited again after the last visit');
        visit(uk, tk, first);
        first += tk.length;
        if (last) {
          t[k] = null;
          u[k] = null;
        }
      }
    },
    forEachUnit(visit) {
      let first = 0;
      for (let k = 0; k < u.length; k++) {
        const uk = u[k];
        if (!uk) throw new Error('spikePieces: visited again after the last visit');
        visit(uk, first);
        first += uk.length;
      }
    },
  };
}
