// runSteps and combineStepResults on hand-made steps: what each step sees, and how results join.
import { describe, expect, it } from 'vitest';
import { DEFAULTS } from '../../../core/defaults';
import type { Recording } from '../../../core/model/types';
import { combineStepResults } from '../../../core/pipeline/combine-step-results';
import { runSteps } from '../../../core/pipeline/run-steps';
import type { AnalysisStep } from '../../../core/pipeline/types';

const rec = { units: [{ id: 'a' }, { id: 'b' }] } as unknown as Recording;

const first: AnalysisStep = {
  name: 'first',
  run: () => ({
    columns: [{ name: 'unit', kind: 'string', values: ['a', 'b'], description: 'id' }, { name: 'x', kind: 'number', values: Float64Array.of(1, 2), description: 'x' }],
    summary: { n: 2 },
    warnings: [{ code: 'w1', message: 'first warning', count: 1 }],
  }),
};
const second: AnalysisStep = {
  name: 'second',
  run: ({ columns }) => {
    const x = columns.get('x');
    const seen = x && x.kind === 'number' ? Array.from(x.values) : [];
    return {
      columns: [{ name: 'x', kind: 'number', values: Float64Array.from(seen, (v) => v * 10), description: 'x again' }],
      warnings: [{ code: 'w2', message: 'second warning', count: 3 }],
    };
  },
};

describe('runSteps / combineStepResults', () => {
  it('each step sees the earlier steps\' columns; a later column of the same name replaces the earlier; summaries by name, warnings in order', () => {
    const results = runSteps(rec, DEFAULTS, [first, second]);
    expect(results.map((r) => r.name)).toEqual(['first', 'second']);
    const joined = combineStepResults(results, 2);
    const x = joined.table.columns.find((c) => c.name === 'x');
    expect(x && Array.from(x.values as Float64Array)).toEqual([10, 20]);
    expect(joined.table.columns.filter((c) => c.name === 'x')).toHaveLength(1);
    expect(joined.summaries).toEqual({ first: { n: 2 } });
    expect(joined.warnings.map((w) => w.code)).toEqual(['w1', 'w2']);
    expect(joined.table.rowCount).toBe(2);
  });
});
