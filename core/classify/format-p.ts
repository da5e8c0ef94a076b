/** A p- or q-value for a reason string: 3 significant digits, "< 1e-300" for underflow. */
export function formatP(p: number): string {
  if (!(p === p)) return 'NaN';
  if (p === 0) return '< 1e-300';
  return p < 1e-3 ? p.toExponential(2) : p.toPrecision(3);
}
