/**
 * Figure JSON for snapshots: numbers rounded to 6 significant digits (so a
 * change in the last bits of a float does not break a snapshot, while any
 * real change does), NaN/Infinity as null, keys in insertion order.
 */
export function normaliseFigure(x: unknown): string {
  return JSON.stringify(
    x,
    (_k, v) => {
      if (typeof v === 'number') return Number.isFinite(v) ? Number(v.toPrecision(6)) : null;
      if (ArrayBuffer.isView(v)) return Array.from(v as unknown as ArrayLike<number>, (n) => (Number.isFinite(n) ? Number(n.toPrecision(6)) : null));
      return v;
    },
    1,
  ) + '\n';
}
