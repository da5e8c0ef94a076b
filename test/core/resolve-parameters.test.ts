import { describe, expect, it } from 'vitest';
import { DEFAULTS } from '../../core/defaults';
import { InputError } from '../../core/errors';
import { resolveParameters } from '../../core/resolve-parameters';

describe('DEFAULTS (DESIGN.md section 4)', () => {
  it('pins the documented defaults', () => {
    expect(DEFAULTS.light).toMatchObject({ windowStartMs: 0, windowEndMs: 10, saltBinMs: 1, alphaSalt: 0.01, maxLatencyMs: 6, minWaveformR: 0.9 });
    expect(DEFAULTS.ramp).toMatchObject({ event: 'reward', windowStartS: -3, windowEndS: 0, condition: 'standard', binS: 0.1, alpha: 0.05 });
    expect(DEFAULTS.jump).toMatchObject({ event: 'jump', postStartS: 0, postEndS: 0.3, preStartS: -0.3, preEndS: 0, alpha: 0.05 });
    // 1.5 ms / 0 ms: common practice (no single published source).
    expect(DEFAULTS.quality).toMatchObject({ refractoryMs: 1.5, censoredMs: 0 });
    expect(DEFAULTS.span).toMatchObject({ startS: null, stopS: null });
  });
});

describe('resolveParameters', () => {
  it('applies overrides in order and leaves the defaults untouched', () => {
    const p = resolveParameters([
      { file: 'session.json', overrides: { light: { windowEndMs: 8 } } },
      { file: 'analysis.json', overrides: { light: { windowEndMs: 7 }, ramp: { condition: 'fast' } } },
    ]);
    expect(p.light.windowEndMs).toBe(7);
    expect(p.ramp.condition).toBe('fast');
    expect(DEFAULTS.light.windowEndMs).toBe(10);
  });
  it('accepts a number for a null default', () => {
    expect(resolveParameters([{ file: 'a.json', overrides: { span: { stopS: 100 } } }]).span.stopS).toBe(100);
  });
  it.each([
    [{ lite: {} }, /a\.json, column "lite": unknown parameter section/],
    [{ light: { windowEnd: 3 } }, /a\.json, column "light\.windowEnd": unknown parameter/],
    [{ light: { windowEndMs: '8' } }, /expected a finite number/],
    [{ light: { windowEndMs: null } }, /expected a finite number/],
    [[1], /must be a JSON object/],
  ])('rejects %j with a message naming file and key', (overrides, re) => {
    expect(() => resolveParameters([{ file: 'a.json', overrides }])).toThrow(InputError);
    expect(() => resolveParameters([{ file: 'a.json', overrides }])).toThrow(re);
  });
});
