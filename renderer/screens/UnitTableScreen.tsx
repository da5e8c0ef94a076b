import { useEffect, useLayoutEffect, useMemo, useRef, useState } from 'react';
import { formatCell } from '../state/format-cell';
import type { OpenSession, TableViewState } from '../app/App';
import { isVerdictWord, VerdictBadge } from '../components/VerdictBadge';
import type { CurationState } from '../../core/curation/types';
import { isIncluded, labelSummary, unitCurationOf } from '../state/curation-edits';
import { visibleRange } from '../state/table-view';
import type { TableColumnData } from '../worker/api';

export const ROW_PX = 26;

function widthOf(c: TableColumnData): number {
  if (c.name === 'unit') return 76;
  if (c.kind === 'string') return 118;
  return Math.max(84, Math.min(150, c.name.length * 7.4 + 18));
}

/**
 * Unit table: every unit with its metrics and verdicts, sortable (click a
 * header), filterable (e.g. `tag=tagged rate_hz>2`), virtualised (only rows in
 * view are in the page, so 1,000+ units scroll smoothly). Up/Down move the
 * selection, Enter opens the Unit page.
 */
export function UnitTableScreen(props: {
  session: OpenSession;
  curation: CurationState;
  order: Int32Array;
  view: TableViewState;
  filterError: string | null;
  selected: number;
  onView: (v: TableViewState) => void;
  onSelect: (row: number) => void;
  onOpen: (row: number) => void;
}) {
  const { session, curation, order, view, filterError, selected, onView, onSelect, onOpen } = props;
  const table = session.analysis.table;
  const columns = table.columns;
  const widths = useMemo(() => columns.map(widthOf), [columns]);
  const template = `${widths.map((w) => `${w}px`).join(' ')} 150px 70px`;
  const scroller = useRef<HTMLDivElement>(null);
  const [scrollTop, setScrollTop] = useState(0);
  const [viewport, setViewport] = useState(600);
  const [first, last] = visibleRange(scrollTop, viewport, ROW_PX, order.length);

  useLayoutEffect(() => {
    const el = scroller.current;
    if (!el) return;
    const ro = new ResizeObserver(() => setViewport(el.clientHeight));
    ro.observe(el);
    setViewport(el.clientHeight);
    return () => ro.disconnect();
  }, []);

  // Keep the selected row in view when it changes by keyboard.
  useEffect(() => {
    const el = scroller.current;
    const at = order.indexOf(selected);
    if (!el || at < 0) return;
    const top = at * ROW_PX;
    const header = ROW_PX + 4;
    if (top < el.scrollTop) el.scrollTop = top;
    else if (top + ROW_PX > el.scrollTop + el.clientHeight - header) el.scrollTop = top + ROW_PX - el.clientHeight + header;
  }, [selected, order]);

  const sortBy = (name: string) =>
    onView({ ...view, sortColumn: name, direction: view.sortColumn === name && view.direction === 'ascending' ? 'descending' : 'ascending' });

  const onKey = (e: React.KeyboardEvent) => {
    const at = order.indexOf(selected);
    if (e.key === 'ArrowDown' || e.key === 'ArrowUp') {
      e.preventDefault();
      const next = at < 0 ? 0 : Math.min(order.length - 1, Math.max(0, at + (e.key === 'ArrowDown' ? 1 : -1)));
      if (order.length) onSelect(order[next]);
    } else if (e.key === 'Enter' && at >= 0) {
      e.preventDefault();
      onOpen(selected);
    }
  };

  const rows = [];
  for (let k = first; k < last; k++) {
    const r = order[k];
    const id = session.unitIds[r];
    const included = isIncluded(curation, id);
    const labels = labelSummary(unitCurationOf(curation, id));
    rows.push(
      <div
        key={r}
        role="row"
        aria-selected={r === selected}
        className={`trow${r === selected ? ' selected' : ''}${included ? '' : ' excluded'}`}
        style={{ top: ROW_PX * (k + 1), gridTemplateColumns: template }}
        onClick={() => onSelect(r)}
        onDoubleClick={() => onOpen(r)}
        data-unit={session.unitIds[r]}
      >
        {columns.map((c) => (
          <div role="cell" key={c.name} className={c.kind === 'number' ? 'cell num' : 'cell'}>
            {c.kind === 'number' ? formatCell(c.values[r]) : isVerdictWord(c.values[r]) ? <VerdictBadge word={c.values[r]} /> : c.values[r]}
          </div>
        ))}
        <div role="cell" className="cell" title={labels}>{labels}</div>
        <div role="cell" className="cell">{included ? 'yes' : 'no'}</div>
      </div>,
    );
  }

  return (
    <div className="screen table-screen">
      <div className="toolbar">
        <h1>Unit table</h1>
        <input
          className={filterError ? 'filter invalid' : 'filter'}
          type="search"
          placeholder="Filter, e.g. tag=tagged rate_hz>2 (or a unit id)"
          value={view.filter}
          onChange={(e) => onView({ ...view, filter: e.target.value })}
          aria-label="Filter units"
          spellCheck={false}
        />
        <span className="count" data-testid="row-count">
          {order.length} of {table.rowCount} units
        </span>
        {filterError && <span className="filter-error">{filterError}</span>}
      </div>
      <div className="vtable" ref={scroller} tabIndex={0} onKeyDown={onKey} onScroll={(e) => setScrollTop(e.currentTarget.scrollTop)} role="table" aria-rowcount={order.length + 1} data-testid="unit-table">
        <div className="vtable-body" style={{ height: ROW_PX * (order.length + 1), minWidth: widths.reduce((a, b) => a + b, 0) + 220 }}>
          <div className="thead" role="row" style={{ gridTemplateColumns: template }}>
            {columns.map((c) => (
              <button key={c.name} role="columnheader" className={c.kind === 'number' ? 'th num' : 'th'} title={c.description} onClick={() => sortBy(c.name)}
                aria-sort={view.sortColumn === c.name ? view.direction : 'none'}>
                {c.name}
                {view.sortColumn === c.name ? (view.direction === 'ascending' ? ' \u25B4' : ' \u25BE') : ''}
              </button>
            ))}
            <div role="columnheader" className="th" title="Your labels (beside the computed verdicts)">your labels</div>
            <div role="columnheader" className="th" title="Included in population summaries and exports">included</div>
          </div>
          {rows}
        </div>
      </div>
    </div>
  );
}
