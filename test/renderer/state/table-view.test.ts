import { describe, expect, it } from 'vitest';
import { filterRows, parseFilter, sortRows, visibleRange } from '../../../renderer/state/table-view';
import type { TableData } from '../../../renderer/worker/api';

const table: TableData = {
  rowCount: 5,
  columns: [
    { name: 'unit', kind: 'string', values: ['1', '10', '2', 'a', '3'], description: '' },
    { name: 'rate_hz', kind: 'number', values: Float64Array.from([5, NaN, 1, 5, 9]), description: '' },
    { name: 'tag', kind: 'string', values: ['tagged', 'untagged', '', 'borderline', 'tagged'], description: '' },
  ],
};
const ids = ['1', '10', '2', 'a', '3'];

describe('unit table sorting', () => {
  it('sorts numbers with NaN last and stable ties, both directions', () => {
    expect([...sortRows(table, 'rate_hz', 'ascending')]).toEqual([2, 0, 3, 4, 1]);
    expect([...sortRows(table, 'rate_hz', 'descending')]).toEqual([4, 0, 3, 2, 1]);
  });
  it('sorts text naturally with empty cells last', () => {
    expect([...sortRows(table, 'unit', 'ascending')]).toEqual([0, 2, 4, 1, 3]);
    expect([...sortRows(table, 'tag', 'ascending')]).toEqual([3, 0, 4, 1, 2]);
    expect([...sortRows(table, null, 'ascending')]).toEqual([0, 1, 2, 3, 4]);
  });
});

describe('unit table filter', () => {
  const run = (q: string) => {
    const { terms, error } = parseFilter(q, table.columns);
    if (error) return error;
    return [...filterRows(table, sortRows(table, null, 'ascending'), terms, ids)];
  };
  it.each([
    ['tag=tagged', [0, 4]],
    ['tag = tagged and rate_hz > 5', [4]],
    ['rate_hz>=5', [0, 3, 4]],
    ['rate_hz!=5', [1, 2, 4]],
    ['1', [0, 1]],
    ['', [0, 1, 2, 3, 4]],
  ])('%s', (q, rows) => expect(run(q)).toEqual(rows));
  it('names an unknown column', () => expect(run('ramp=up')).toBe('No column "ramp" in the table.'));
});

describe('virtualised rows', () => {
  it('renders only the rows in view plus overscan', () => {
    expect(visibleRange(0, 600, 24, 1000, 8)).toEqual([0, 33]);
    expect(visibleRange(24 * 500, 600, 24, 1000, 8)).toEqual([492, 533]);
    expect(visibleRange(24 * 990, 600, 24, 1000, 8)).toEqual([982, 1000]);
    expect(visibleRange(0, 600, 24, 0, 8)).toEqual([0, 0]);
  });
});
