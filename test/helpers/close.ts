/**
 * Tolerance check that prints value, expected, difference and tolerance on
 * failure (house style). |got - want| <= max(rel * |want|, abs).
 */
export function close(got: number, want: number, rel: number, abs = 0, what = ''): void {
  const diff = Math.abs(got - want);
  const tol = Math.max(rel * Math.abs(want), abs);
  if (!(diff <= tol) && !(Number.isNaN(got) && Number.isNaN(want))) {
    throw new Error(`${what ? `${what}: ` : ''}value ${got}, expected ${want}, difference ${diff}, tolerance ${tol}`);
  }
}
