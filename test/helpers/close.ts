import { expect } from 'vitest';

/**
 * Asserts |value - expected| <= tol (absolute) and prints value, expected,
 * difference and tolerance on failure (DESIGN.md section 8).
 */
export function expectClose(value: number, expected: number, tol: number, what = 'value'): void {
  const diff = Math.abs(value - expected);
  const ok = diff <= tol || (Number.isNaN(value) && Number.isNaN(expected));
  expect(ok, `${what}: got ${value}, expected ${expected}, difference ${diff}, tolerance ${tol}`).toBe(true);
}

/** Largest |a[i] - b[i]| over two equally long arrays (length mismatch fails). */
export function maxAbsDiff(a: ArrayLike<number>, b: ArrayLike<number>): number {
  expect(a.length, 'array lengths').toBe(b.length);
  let m = 0;
  for (let i = 0; i < a.length; i++) m = Math.max(m, Math.abs(a[i] - b[i]));
  return m;
}

/** Largest |a[i]|. */
export function maxAbs(a: ArrayLike<number>): number {
  let m = 0;
  for (let i = 0; i < a.length; i++) m = Math.max(m, Math.abs(a[i]));
  return m;
}

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
