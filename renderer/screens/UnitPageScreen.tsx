import { useEffect, useState, type RefObject } from 'react';
import type { EventResponseOptions } from '../../core/figures/event-response-figure';
import { formatNumber } from '../../core/table/format-number';
import type { OpenSession } from '../app/App';
import { Plot } from '../components/Plot';
import { isVerdictWord, VerdictBadge } from '../components/VerdictBadge';
import { CURATION_LABELS, type UnitCuration } from '../state/curation';
import type { UnitSection, UnitView } from '../worker/api';

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
  view: UnitView | null;
  curation: UnitCuration;
  onEdit: (change: Partial<UnitCuration>) => void;
  noteRef: RefObject<HTMLTextAreaElement | null>;
  eventOptions: EventResponseOptions;
  onEventOptions: (o: EventResponseOptions) => void;
  position: { at: number; of: number };
  onStep: (d: 1 | -1) => void;
}) {
  const { session, unitIndex, view, curation, onEdit, noteRef, eventOptions, onEventOptions, position, onStep } = props;
  const table = session.analysis.table;
  const unitId = session.unitIds[unitIndex];
  const [note, setNote] = useState(curation.note);
  useEffect(() => setNote(curation.note), [curation.note, unitId]);
  const verdicts = table.columns.filter((c) => c.kind === 'string' && c.name !== 'unit' && isVerdictWord(c.values[unitIndex]));

  return (
    <div className="screen unit-page">
      <aside className="unit-side">
        <div className="unit-nav">
          <button onClick={() => onStep(-1)} title="Previous unit (Ctrl/Cmd + Up)" aria-label="Previous unit">&#8593;</button>
          <h1 data-testid="unit-title">Unit {unitId}</h1>
          <button onClick={() => onStep(1)} title="Next unit (Ctrl/Cmd + Down)" aria-label="Next unit">&#8595;</button>
        </div>
        <div className="muted small">{position.at >= 0 ? `${position.at + 1} of ${position.of} in the table's order` : 'not in the filtered table'}</div>
        {verdicts.length > 0 && (
          <dl className="verdicts">
            {verdicts.map((c) => (
              <div key={c.name} title={c.description}>
                <dt>{c.name}</dt>
                <dd><VerdictBadge word={c.values[unitIndex] as string} /></dd>
              </div>
            ))}
          </dl>
        )}
        <section className="curation" aria-label="Curation">
          <h2>Curation</h2>
          <div className="label-buttons" role="radiogroup" aria-label="Label">
            {CURATION_LABELS.map((l, i) => (
              <button key={l} role="radio" aria-checked={curation.label === l} className={curation.label === l ? 'chip on' : 'chip'} onClick={() => onEdit({ label: curation.label === l ? null : l })} title={`Key ${i + 1}`}>
                {l}
              </button>
            ))}
          </div>
          <label className="check">
            <input type="checkbox" checked={curation.included} onChange={(e) => onEdit({ included: e.target.checked })} /> included in summaries and exports (X)
          </label>
          <textarea
            ref={noteRef}
            value={note}
            placeholder="Note (N to write; saved when you leave the field)"
            onChange={(e) => setNote(e.target.value)}
            onBlur={() => onEdit({ note })}
            onKeyDown={(e) => {
              if (e.key === 'Escape') e.currentTarget.blur();
            }}
            rows={3}
            aria-label="Note"
          />
        </section>
        {view && view.reasons.length > 0 && (
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
                .filter((c) => c.name !== 'unit' && !(c.kind === 'string' && (isVerdictWord(c.values[unitIndex]) || /reasons?$/.test(c.name))))
                .map((c) => (
                  <tr key={c.name} title={c.description}>
                    <th>{c.name}</th>
                    <td className={c.kind === 'number' ? 'num' : ''}>{c.kind === 'number' ? formatNumber(c.values[unitIndex], 4) || '-' : c.values[unitIndex] || '-'}</td>
                  </tr>
                ))}
            </tbody>
          </table>
        </section>
      </aside>
      <div className="unit-main" data-testid="unit-figures">
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

/** Window, bin, smoothing and grouping of the event response. Values apply on change (Enter or leaving a field). */
function EventControls({ session, options, onChange }: { session: OpenSession; options: EventResponseOptions; onChange: (o: EventResponseOptions) => void }) {
  const [draft, setDraft] = useState(options);
  useEffect(() => setDraft(options), [options]);
  const commit = (next: EventResponseOptions) => {
    if (next.windowEndS > next.windowStartS && next.binMs > 0 && next.smoothMs >= 0) onChange(next);
    else setDraft(options);
  };
  const num = (key: 'windowStartS' | 'windowEndS' | 'binMs' | 'smoothMs', label: string, unit: string, stepV: number) => (
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
      {num('windowEndS', 'to', 's', 0.1)}
      {num('binMs', 'Bin', 'ms', 5)}
      {num('smoothMs', 'Smoothing sd', 'ms', 5)}
      <label className="control">
        Split by
        <select value={draft.groupBy} onChange={(e) => commit({ ...draft, groupBy: e.target.value as EventResponseOptions['groupBy'] })} aria-label="Split trials by">
          <option value="condition">trial condition</option>
          <option value="kind">event kind</option>
          <option value="none">nothing</option>
        </select>
      </label>
    </div>
  );
}
