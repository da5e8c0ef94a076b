import { useEffect, useState, type RefObject } from 'react';
import type { UnitCuration } from '../../core/curation/types';
import { verdictWords } from '../../core/curation/verdict-words';
import { formatCell } from '../state/format-cell';
import type { OpenSession } from '../app/App';
import { Plot } from '../components/Plot';
import { VerdictBadge } from '../components/VerdictBadge';
import type { UnstampedAction } from '../state/curation-edits';
import { isVerdictColumn } from '../state/verdict-columns';
import type { EventView, UnitSection, UnitView } from '../worker/api';

const SECTIONS: readonly { id: UnitSection; title: string }[] = [
  { id: 'light', title: 'Light response' },
  { id: 'event', title: 'Event response' },
  { id: 'ramp-jump', title: 'Ramp and jumps' },
  { id: 'indicator', title: 'Indicator model' },
  { id: 'quality', title: 'Quality' },
];

/**
 * Unit page: the unit's verdicts, metrics, reasons and curation on the left;
 * its figures by section on the right (light response, event response with
 * window and smoothing controls, ramp and jumps, indicator model, quality).
 */
export function UnitPageScreen(props: {
  session: OpenSession;
  unitIndex: number;
  /** The figures last received from the worker; while they are another unit's (a switch in flight), they are dimmed and their reasons hidden. */
  view: UnitView | null;
  curation: UnitCuration;
  onEdit: (action: UnstampedAction) => void;
  noteRef: RefObject<HTMLTextAreaElement | null>;
  eventOptions: EventView;
  onEventOptions: (o: EventView) => void;
  position: { at: number; of: number };
  onStep: (d: 1 | -1) => void;
}) {
  const { session, unitIndex, view, curation, onEdit, noteRef, eventOptions, onEventOptions, position, onStep } = props;
  const table = session.analysis.table;
  const unitId = session.unitIds[unitIndex];
  const savedNote = curation.note?.text ?? '';
  const [note, setNote] = useState(savedNote);
  useEffect(() => setNote(savedNote), [savedNote, unitId]);
  const verdicts = table.columns.filter(isVerdictColumn);
  const included = curation.include?.value !== false;

  return (
    <div className="screen unit-page">
      <aside className="unit-side">
        <div className="unit-nav">
          <button onClick={() => onStep(-1)} title="Previous unit (Ctrl/Cmd + Up)" aria-label="Previous unit">&#8593;</button>
          <h1 data-testid="unit-title">Unit {unitId}</h1>
          <button onClick={() => onStep(1)} title="Next unit (Ctrl/Cmd + Down)" aria-label="Next unit">&#8595;</button>
        </div>
        <div className="muted small">{position.at >= 0 ? `${position.at + 1} of ${position.of} in the table's order` : 'not in the filtered table'}</div>
        <section className="curation" aria-label="Verdicts and your labels">
          <h2>Verdicts and your labels</h2>
          {verdicts.length === 0 && <p className="muted small">This analysis gives no verdicts yet.</p>}
          {verdicts.map((c) => {
            const mine = curation.labels[c.name];
            return (
              <div className="verdict-row" key={c.name} title={c.description}>
                <div className="verdict-head">
                  <span className="verdict-col">{c.name}</span>
                  <VerdictBadge word={c.values[unitIndex] as string} />
                  {mine && <span className="muted small">yours: {mine.value}</span>}
                </div>
                <div className="label-buttons" role="radiogroup" aria-label={`Your ${c.name} label`}>
                  {verdictWords(c.name)!.map((w) => (
                    <button
                      key={w}
                      role="radio"
                      aria-checked={mine?.value === w}
                      className={mine?.value === w ? 'chip on' : 'chip'}
                      onClick={() => onEdit({ type: 'label', unit: unitId, column: c.name, value: mine?.value === w ? null : w })}
                      title={mine?.value === w ? `Set by ${mine.by} at ${mine.at}; click to clear` : `Label ${c.name} "${w}"`}
                    >
                      {w}
                    </button>
                  ))}
                </div>
              </div>
            );
          })}
          <label className="check">
            <input type="checkbox" checked={included} onChange={(e) => onEdit({ type: 'include', unit: unitId, value: e.target.checked })} /> included in summaries and exports (X)
          </label>
          <textarea
            ref={noteRef}
            value={note}
            placeholder="Note (N to write; saved when you leave the field)"
            onChange={(e) => setNote(e.target.value)}
            onBlur={() => note !== savedNote && onEdit({ type: 'note', unit: unitId, text: note })}
            onKeyDown={(e) => {
              if (e.key === 'Escape') e.currentTarget.blur();
            }}
            rows={3}
            aria-label="Note"
          />
          {curation.note && <div className="muted small">note by {curation.note.by}, {curation.note.at.slice(0, 16).replace('T', ' ')} UTC</div>}
        </section>
        {view && view.unitIndex === unitIndex && view.reasons.length > 0 && (
          <section>
            <h2>Reasons</h2>
            <ul className="reasons">
              {view.reasons.map((r) => (
                <li key={r.column}><span className="muted">{r.column}:</span> {r.text}</li>
              ))}
            </ul>
          </section>
        )}
        <section>
          <h2>Metrics</h2>
          <table className="metrics">
            <tbody>
              {table.columns
                .filter((c) => c.name !== 'unit' && !isVerdictColumn(c) && !(c.kind === 'string' && /reasons?$/.test(c.name)))
                .map((c) => (
                  <tr key={c.name} title={c.description}>
                    <th>{c.name}</th>
                    <td className={c.kind === 'number' ? 'num' : ''}>{c.kind === 'number' ? formatCell(c.values[unitIndex]) || '-' : c.values[unitIndex] || '-'}</td>
                  </tr>
                ))}
            </tbody>
          </table>
        </section>
      </aside>
      {/* Until the new unit's figures arrive, the previous unit's are dimmed, never shown as this unit's. */}
      <div
        className={view && view.unitIndex !== unitIndex ? 'unit-main stale' : 'unit-main'}
        data-testid="unit-figures"
        data-unit={view?.unitId}
        aria-busy={!view || view.unitIndex !== unitIndex}
      >
        {!view && <p className="muted">Drawing...</p>}
        {view &&
          SECTIONS.map((s) => {
            const figs = view.figures.filter((f) => f.section === s.id);
            if (s.id !== 'event' && figs.length === 0) return null;
            return (
              <section className="panel" key={s.id}>
                <h2>{s.title}</h2>
                {s.id === 'event' && <EventControls session={session} options={eventOptions} onChange={onEventOptions} />}
                {s.id === 'event' && figs.length === 0 && <p className="muted">No "{eventOptions.event}" events in this session, or an empty window.</p>}
                <div className="figure-grid">
                  {figs.map((f) => (
                    <Plot key={f.id} spec={f.spec} testId={`plot-${f.id}`} />
                  ))}
                </div>
              </section>
            );
          })}
      </div>
    </div>
  );
}

/** Window, bin, smoothing and grouping of the event response (display only; Analysis settings holds the saved values). Values apply on Enter or leaving a field. */
function EventControls({ session, options, onChange }: { session: OpenSession; options: EventView; onChange: (o: EventView) => void }) {
  const [draft, setDraft] = useState(options);
  useEffect(() => setDraft(options), [options]);
  const commit = (next: EventView) => {
    if (next.windowStopS > next.windowStartS && next.binMs > 0 && next.smoothingWidthMs >= 0) onChange(next);
    else setDraft(options);
  };
  const num = (key: 'windowStartS' | 'windowStopS' | 'binMs' | 'smoothingWidthMs', label: string, unit: string, stepV: number) => (
    <label className="control">
      {label}
      <input
        type="number"
        step={stepV}
        value={Number.isFinite(draft[key]) ? draft[key] : ''}
        onChange={(e) => setDraft({ ...draft, [key]: e.target.valueAsNumber })}
        onBlur={() => commit(draft)}
        onKeyDown={(e) => e.key === 'Enter' && commit(draft)}
        aria-label={`${label} (${unit})`}
      />
      <span className="unit">{unit}</span>
    </label>
  );
  return (
    <div className="controls">
      <label className="control">
        Align on
        <select value={draft.event} onChange={(e) => commit({ ...draft, event: e.target.value })} aria-label="Align on event">
          {session.info.eventLabels.map((l) => (
            <option key={l} value={l}>{l}</option>
          ))}
        </select>
      </label>
      {num('windowStartS', 'From', 's', 0.1)}
      {num('windowStopS', 'to', 's', 0.1)}
      {num('binMs', 'Bin', 'ms', 5)}
      <label className="control">
        Smoothing
        <select value={draft.smoothing} onChange={(e) => commit({ ...draft, smoothing: e.target.value })} aria-label="Smoothing">
          <option value="none">none</option>
          <option value="gaussian">Gaussian</option>
          <option value="exponential">exponential</option>
          <option value="boxcar">boxcar</option>
        </select>
      </label>
      {num('smoothingWidthMs', 'width', 'ms', 5)}
      <label className="control">
        Split by
        <select value={draft.groupBy} onChange={(e) => commit({ ...draft, groupBy: e.target.value })} aria-label="Split trials by">
          <option value="condition">trial condition</option>
          <option value="kind">event kind</option>
          <option value="none">nothing</option>
        </select>
      </label>
    </div>
  );
}
