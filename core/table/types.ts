/**
 * The per-unit table (units.csv and its exports). One row per unit, in the
 * recording's unit order. Columns are typed arrays (numbers; NaN = empty cell)
 * or string arrays.
 */
export interface NumberColumn {
  readonly name: string;
  readonly kind: 'number';
  readonly values: Float64Array;
  /** Significant digits when written as text (default 6). */
  readonly digits?: number;
  /** One line for the README / report, with units. */
  readonly description: string;
}

export interface StringColumn {
  readonly name: string;
  readonly kind: 'string';
  readonly values: readonly string[];
  readonly description: string;
}

export type Column = NumberColumn | StringColumn;

export interface UnitTable {
  readonly columns: readonly Column[];
  readonly rowCount: number;
}
