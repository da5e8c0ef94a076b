import { useCallback, useEffect, useMemo, useRef, useState } from 'react';
import { DEFAULTS, type Parameters } from '../../core/defaults';
import { compareInputs } from '../../core/curation/compare-inputs';
import { describeInputMismatch } from '../../core/curation/describe-input-mismatch';
import { historyDispatch, historyRedo, historyUndo, newHistory, type CurationHistory } from '../../core/curation/history';
import { checkCurationAction } from '../../core/curation/check-curation-action';
import { serializeSessionFile } from '../../core/curation/serialize-session-file';
import { SAVED_SESSION_FILE, SESSION_FORMAT, SESSION_SCHEMA_VERSION } from '../../core/curation/session-file';
import { EMPTY_CURATION } from '../../core/curation/types';
import { validateSessionFile } from '../../core/curation/validate-session-file';
import { isInputError } from '../../core/errors';
import type { Host, OpenedSession } from '../host/host';
import { loadDemoSession } from '../host/host';
import { readLocal } from '../host/browser-host';
import { changedUnit, describeAction, isIncluded, stamp, unitCurationOf, type UnstampedAction } from '../state/curation-edits';
import { filterRows, parseFilter, sortRows, type SortDirection } from '../state/table-view';
import type { AnalysisOutcome, EventView, OpenOutcome, Progress, UnitView } from '../worker/api';
import { AnalysisClient, CancelledError } from '../worker/client';
import { ExportScreen } from '../screens/ExportScreen';
import { OverviewScreen } from '../screens/OverviewScreen';
import { PopulationScreen } from '../screens/PopulationScreen';
import { SettingsScreen } from '../screens/SettingsScreen';
import { StartScreen } from '../screens/StartScreen';
import { UnitPageScreen } from '../screens/UnitPageScreen';
import { UnitTableScreen } from '../screens/UnitTableScreen';
import { HelpOverlay } from './HelpOverlay';
import { keyToCommand, type Command } from './shortcuts';

export type Screen = 'start' | 'overview' | 'table' | 'unit' | 'population' | 'settings' | 'export';

export const SCREENS: readonly { id: Screen; title: string }[] = [
  { id: 'start', title: 'Start' },
  { id: 'overview', title: 'Session overview' },
  { id: 'table', title: 'Unit table' },
  { id: 'unit', title: 'Unit page' },
  { id: 'population', title: 'Population' },
  { id: 'settings', title: 'Analysis settings' },
  { id: 'export', title: 'Export' },
];

/** Parameter overrides: only the values that differ from DEFAULTS, by section. */
export type Overrides = Record<string, Record<string, unknown>>;

export interface OpenSession {
  readonly opened: OpenedSession;
  readonly info: OpenOutcome;
  readonly analysis: AnalysisOutcome;
  readonly overrides: Overrides;
  readonly unitIds: readonly string[];
}

/** Name stamped on curation decisions (set on the Analysis settings screen). */
export const CURATOR_KEY = 'tagbench:curator';
export function curatorName(): string {
  return readLocal(CURATOR_KEY)?.trim() || 'unnamed curator';
}

/** File name of the session file (curation and settings) in exports and beside a desktop session. */
export const SESSION_FILE_NAME = SAVED_SESSION_FILE;

export function eventViewOf(p: Parameters): EventView {
  const { event, windowStartS, windowStopS, binMs, smoothing, smoothingWidthMs, groupBy } = p.align;
  return { event, windowStartS, windowStopS, binMs, smoothing, smoothingWidthMs, groupBy };
}

/** The session file text of the current work (core/curation's format). */
export function sessionFileText(session: OpenSession, history: CurationHistory, now: Date): string {
  return serializeSessionFile({
    format: SESSION_FORMAT,
    schemaVersion: SESSION_SCHEMA_VERSION,
    source: session.opened.displayPath,
    inputs: session.info.inputs,
    parameters: session.analysis.parameters,
    units: session.unitIds,
    curation: history.present,
    savedAt: now.toISOString(),
    savedWith: 'tagbench workbench',
  });
}

export interface Busy extends Progress {
  readonly cancellable: boolean;
}

export interface TableViewState {
  readonly sortColumn: string | null;
  readonly direction: SortDirection;
  readonly filter: string;
}

function message(e: unknown): string {
  if (e instanceof CancelledError) return 'Cancelled.';
  if (isInputError(e) || (e as Error)?.name === 'InputError') return (e as Error).message;
  const m = (e as Error)?.message ?? String(e);
  return m.startsWith('Unexpected') ? m : `Unexpected problem: ${m}`;
}

export function App({ host, client }: { host: Host; client: AnalysisClient }) {
  const [screen, setScreen] = useState<Screen>('start');
  const [session, setSession] = useState<OpenSession | null>(null);
  const [busy, setBusy] = useState<Busy | null>(null);
  const [failure, setFailure] = useState<{ title: string; message: string } | null>(null);
  const [status, setStatus] = useState('');
  const [history, setHistory] = useState<CurationHistory>(() => newHistory(EMPTY_CURATION));
  const curation = history.present;
  const [selected, setSelected] = useState(0);
  const [tableView, setTableView] = useState<TableViewState>({ sortColumn: null, direction: 'ascending', filter: '' });
  const [help, setHelp] = useState(false);
  const [eventOptions, setEventOptions] = useState<EventView>(() => eventViewOf(DEFAULTS));
  const [unitView, setUnitView] = useState<UnitView | null>(null);
  const [settingsError, setSettingsError] = useState<string | null>(null);
  const noteRef = useRef<HTMLTextAreaElement>(null);
  const dirty = useRef(false);
  const saveBlocked = useRef(false);
  const savedInputs = useRef<OpenOutcome['inputs'] | null>(null);

  // Table order (sort + filter) drives next/previous unit everywhere.
  const filterResult = useMemo(() => (session ? parseFilter(tableView.filter, session.analysis.table.columns) : { terms: [], error: null }), [session, tableView.filter]);
  const order = useMemo(() => {
    if (!session) return new Int32Array(0);
    const sorted = sortRows(session.analysis.table, tableView.sortColumn, tableView.direction);
    return filterRows(session.analysis.table, sorted, filterResult.terms, session.unitIds);
  }, [session, tableView.sortColumn, tableView.direction, filterResult]);

  // Progress messages come over their own channel and may arrive after the
  // result: only the run still in progress may update the progress bar.
  const activeRun = useRef(0);
  const run = useCallback(async <T,>(label: string, cancellable: boolean, work: (onProgress: (p: Progress) => void) => Promise<T>): Promise<T> => {
    const token = ++activeRun.current;
    setBusy({ label, done: 0, total: 1, cancellable });
    try {
      return await work((p) => {
        if (activeRun.current === token) setBusy({ ...p, cancellable });
      });
    } finally {
      if (activeRun.current === token) {
        activeRun.current++;
        setBusy(null);
      }
    }
  }, []);

  const openWith = useCallback(
    async (get: () => Promise<OpenedSession | null>) => {
      setFailure(null);
      let opened: OpenedSession | null = null;
      try {
        opened = await run('Opening the session', false, async () => get());
        if (!opened) return;
        // The saved session file (curation + parameters), checked by core; a damaged one is reported, never overwritten silently.
        let savedHistory = newHistory(EMPTY_CURATION);
        let overrides: Overrides = {};
        const notes: string[] = [];
        if (opened.savedState) {
          try {
            const file = validateSessionFile(opened.savedState, SESSION_FILE_NAME);
            overrides = file.parameters as unknown as Overrides;
            savedHistory = newHistory(file.curation);
            savedInputs.current = file.inputs;
          } catch (e) {
            notes.push(`The saved ${SESSION_FILE_NAME} was not used and will not be overwritten until you save (Ctrl+S): ${message(e)}`);
            saveBlocked.current = true;
          }
        }
        const o = opened;
        let info: OpenOutcome;
        try {
          info = await run(`Opening ${o.name}`, true, (p) => client.open(o.files, o.name, overrides, p));
        } catch (e) {
          if (Object.keys(overrides).length === 0 || e instanceof CancelledError) throw e;
          // Saved settings no longer valid (e.g. a renamed parameter): open with the defaults and say so.
          const why = message(e);
          overrides = {};
          info = await run(`Opening ${o.name}`, true, (p) => client.open(o.files, o.name, overrides, p));
          setStatus(`Saved analysis settings were not used: ${why}`);
        }
        const ids = info.table.columns.find((c) => c.name === 'unit')?.values as readonly string[];
        setSession({ opened: o, info, analysis: info, overrides, unitIds: ids });
        setHistory(savedHistory);
        if (savedInputs.current) {
          const m = compareInputs(savedInputs.current, info.inputs);
          if (!m.same) notes.push(describeInputMismatch(m, SESSION_FILE_NAME));
          savedInputs.current = null;
        }
        setSelected(0);
        setUnitView(null);
        setTableView({ sortColumn: null, direction: 'ascending', filter: '' });
        const view = eventViewOf(info.parameters);
        setEventOptions(info.eventLabels.includes(view.event) || info.eventLabels.length === 0 ? view : { ...view, event: info.eventLabels[0] });
        host.noteOpened(o);
        if (notes.length) setStatus(notes.join(' '));
        else setStatus(`Opened ${o.name}: ${info.summary.units} units, analysed in ${Math.round(info.elapsedMs)} ms.`);
        setScreen('overview');
      } catch (e) {
        if (e instanceof CancelledError) {
          setStatus('Opening cancelled.');
          return;
        }
        setFailure({ title: opened ? `Could not open ${opened.name}` : 'Could not open the session', message: message(e) });
      }
    },
    [client, host, run],
  );

  const openDemo = useCallback(() => openWith(() => loadDemoSession(readLocal)), [openWith]);
  const openPicked = useCallback((kind: 'folder' | 'nwb') => openWith(() => host.pickSession(kind)), [host, openWith]);

  // Open the demo straight away when the URL asks for it (npm start / npm run web --demo).
  const started = useRef(false);
  useEffect(() => {
    if (started.current) return;
    started.current = true;
    if (new URLSearchParams(location.search).get('open') === 'demo') void openDemo();
  }, [openDemo]);

  const rerun = useCallback(
    async (overrides: Overrides) => {
      if (!session) return;
      setSettingsError(null);
      try {
        const analysis = await run('Re-running the analysis', true, (p) => client.analyse(overrides, p));
        setSession({ ...session, analysis, overrides });
        setEventOptions(eventViewOf(analysis.parameters));
        setUnitView(null);
        dirty.current = true;
        setStatus(`Analysis re-run in ${Math.round(analysis.elapsedMs)} ms with ${Object.keys(overrides).length ? 'changed' : 'default'} settings.`);
      } catch (e) {
        if (e instanceof CancelledError) setStatus('Re-run cancelled; the previous results stay.');
        else setSettingsError(message(e));
      }
    },
    [client, run, session],
  );

  const cancel = useCallback(() => void client.cancel(), [client]);

  // Unit page data: fetched from the worker for the selected unit and event options.
  useEffect(() => {
    if (!session || screen !== 'unit') return;
    let live = true;
    client.unitView(selected, eventOptions).then(
      (v) => {
        if (!live) return;
        setUnitView(v);
        // The next and previous units in the table's order, computed by the worker while this one draws.
        const at = order.indexOf(selected);
        if (at >= 0) client.prefetchUnitViews([order[at + 1] ?? -1, order[at - 1] ?? -1], eventOptions);
      },
      (e) => live && !(e instanceof CancelledError) && setStatus(message(e)),
    );
    return () => {
      live = false;
    };
  }, [client, session, screen, selected, eventOptions, order]);

  // Saving: every change is kept (debounced), so curation work is never lost.
  const save = useCallback(
    async (explicit: boolean) => {
      if (!session) return;
      try {
        if (saveBlocked.current && !explicit) return;
        const where = await host.saveState(session.opened, sessionFileText(session, history, new Date()));
        dirty.current = false;
        saveBlocked.current = false;
        if (explicit) setStatus(`Workbench state saved to ${where}.`);
      } catch (e) {
        setStatus(`Could not save the workbench state: ${message(e)}`);
      }
    },
    [history, host, session],
  );
  useEffect(() => {
    if (!session || !dirty.current) return;
    const t = setTimeout(() => void save(false), 400);
    return () => clearTimeout(t);
  }, [history, session, save]);

  const unitId = session ? session.unitIds[selected] : '';
  const edit = useCallback(
    (a: UnstampedAction) => {
      if (!session) return;
      const action = stamp(a, curatorName(), new Date());
      const problem = checkCurationAction(action, new Set(session.unitIds));
      if (problem) {
        setStatus(problem);
        return;
      }
      const next = historyDispatch(history, action);
      if (next === history) return;
      dirty.current = true;
      setHistory(next);
      setStatus(describeAction(a));
    },
    [history, session],
  );

  const step = useCallback(
    (delta: 1 | -1) => {
      if (order.length === 0) return;
      const at = order.indexOf(selected);
      const next = at < 0 ? order[0] : order[Math.min(order.length - 1, Math.max(0, at + delta))];
      setSelected(next);
    },
    [order, selected],
  );

  const command = useCallback(
    (c: Command | string) => {
      if (c.startsWith('screen:')) {
        setScreen(c.slice(7) as Screen);
        return;
      }
      switch (c) {
        case 'show-help':
          setHelp(true);
          return;
        case 'close-overlay':
          setHelp(false);
          if (document.activeElement === noteRef.current) noteRef.current?.blur();
          return;
        case 'open-folder':
          void openPicked('folder');
          return;
        case 'open-nwb':
          void openPicked('nwb');
          return;
        case 'open-demo':
          void openDemo();
          return;
      }
      if (!session) return;
      switch (c) {
        case 'next-unit':
          step(1);
          return;
        case 'previous-unit':
          step(-1);
          return;
        case 'label:tagged':
        case 'label:borderline':
        case 'label:untagged':
          edit({ type: 'label', unit: unitId, column: 'tag', value: c.slice(6) });
          return;
        case 'label:clear':
          edit({ type: 'label', unit: unitId, column: 'tag', value: null });
          return;
        case 'toggle-include':
          edit({ type: 'include', unit: unitId, value: !isIncluded(curation, unitId) });
          return;
        case 'focus-note':
          setScreen('unit');
          setTimeout(() => noteRef.current?.focus(), 0);
          return;
        case 'undo':
        case 'redo': {
          const next = (c === 'undo' ? historyUndo : historyRedo)(history);
          if (next === history) {
            setStatus(`Nothing to ${c}.`);
            return;
          }
          const unit = changedUnit(history.present, next.present);
          dirty.current = true;
          setHistory(next);
          if (unit !== null && session.unitIds.includes(unit)) setSelected(session.unitIds.indexOf(unit));
          setStatus(`${c === 'undo' ? 'Undone' : 'Redone'}: change to unit ${unit ?? '?'}.`);
          return;
        }
        case 'save':
          void save(true);
          return;
      }
    },
    [curation, edit, history, openDemo, openPicked, save, session, step, unitId],
  );

  useEffect(() => {
    const onKey = (e: KeyboardEvent) => {
      const t = e.target as HTMLElement | null;
      const inText = !!t && (t.tagName === 'TEXTAREA' || (t.tagName === 'INPUT' && !['checkbox', 'radio', 'button'].includes((t as HTMLInputElement).type)) || t.tagName === 'SELECT' || t.isContentEditable);
      const c = keyToCommand(e, inText);
      if (!c) return;
      if (!session && !['show-help', 'close-overlay', 'open-folder', 'open-nwb'].includes(c) && !c.startsWith('screen:')) return;
      e.preventDefault();
      command(c);
    };
    window.addEventListener('keydown', onKey);
    return () => window.removeEventListener('keydown', onKey);
  }, [command, session]);
  useEffect(() => host.onCommand(command), [host, command]);

  const needsSession = screen !== 'start' && !session;
  return (
    <div className="app">
      <header className="topbar">
        <div className="brand">tagbench</div>
        <nav className="tabs" aria-label="Screens">
          {SCREENS.map((s) => (
            <button
              key={s.id}
              className={s.id === screen ? 'tab active' : 'tab'}
              aria-current={s.id === screen ? 'page' : undefined}
              disabled={s.id !== 'start' && !session}
              onClick={() => setScreen(s.id)}
            >
              {s.title}
            </button>
          ))}
        </nav>
        <div className="session-name" title={session?.opened.displayPath}>
          {session ? `${session.opened.name} · ${session.unitIds.length} units` : 'no session open'}
        </div>
        <button className="help-button" onClick={() => setHelp(true)} title="Keyboard shortcuts (? or F1)">
          ?
        </button>
      </header>
      <main className="content">
        {failure ? (
          <div className="error-screen" role="alert">
            <h1>{failure.title}</h1>
            <p className="error-message">{failure.message}</p>
            <p>Nothing was changed in your files. Fix the problem named above and open the session again.</p>
            <div className="row">
              <button onClick={() => { setFailure(null); setScreen('start'); }}>Back to Start</button>
              {session && <button onClick={() => { setFailure(null); setScreen('table'); }}>Back to {session.opened.name}</button>}
            </div>
          </div>
        ) : needsSession ? (
          <StartScreen host={host} onDemo={openDemo} onPick={openPicked} onOpenWith={openWith} busy={!!busy} />
        ) : screen === 'start' || !session ? (
          <StartScreen host={host} onDemo={openDemo} onPick={openPicked} onOpenWith={openWith} busy={!!busy} />
        ) : screen === 'overview' ? (
          <OverviewScreen session={session} />
        ) : screen === 'table' ? (
          <UnitTableScreen
            session={session}
            curation={curation}
            order={order}
            view={tableView}
            filterError={filterResult.error}
            selected={selected}
            onView={setTableView}
            onSelect={setSelected}
            onOpen={(i) => { setSelected(i); setScreen('unit'); }}
          />
        ) : screen === 'unit' ? (
          <UnitPageScreen
            session={session}
            unitIndex={selected}
            view={unitView}
            curation={unitCurationOf(curation, unitId)}
            onEdit={edit}
            noteRef={noteRef}
            eventOptions={eventOptions}
            onEventOptions={setEventOptions}
            position={{ at: order.indexOf(selected), of: order.length }}
            onStep={step}
          />
        ) : screen === 'population' ? (
          <PopulationScreen client={client} session={session} curation={curation} />
        ) : screen === 'settings' ? (
          <SettingsScreen session={session} onRun={rerun} error={settingsError} busy={!!busy} onStatus={setStatus} />
        ) : (
          <ExportScreen client={client} host={host} session={session} history={history} unitIndex={selected} eventOptions={eventOptions} onStatus={setStatus} />
        )}
      </main>
      <footer className="statusbar">
        {busy ? (
          <div className="progress" role="status" aria-live="polite">
            <span className="progress-label">{busy.label}</span>
            <progress max={Math.max(1, busy.total)} value={busy.done} />
            {busy.cancellable && <button onClick={cancel}>Cancel</button>}
          </div>
        ) : (
          <div className="status-text" role="status" aria-live="polite">{status}</div>
        )}
        <div className="caution">Verdicts are statistical screens, not proof of identity.</div>
      </footer>
      {help && <HelpOverlay onClose={() => setHelp(false)} />}
    </div>
  );
}

export type { Parameters };
