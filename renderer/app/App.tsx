import { useCallback, useEffect, useMemo, useRef, useState } from 'react';
import { DEFAULTS, type Parameters } from '../../core/defaults';
import { DEFAULT_EVENT_RESPONSE, type EventResponseOptions } from '../../core/figures/event-response-figure';
import { isInputError } from '../../core/errors';
import type { Host, OpenedSession } from '../host/host';
import { loadDemoSession } from '../host/host';
import { readLocal } from '../host/browser-host';
import { curationOf, editCuration, EMPTY_CURATION, redoCuration, undoCuration, type CurationLabel, type CurationState, type UnitCuration } from '../state/curation';
import { parseSavedState, serialiseState } from '../state/saved-state';
import { filterRows, parseFilter, sortRows, type SortDirection } from '../state/table-view';
import type { AnalysisOutcome, OpenOutcome, Progress, UnitView } from '../worker/api';
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
  const [curation, setCuration] = useState<CurationState>(EMPTY_CURATION);
  const [selected, setSelected] = useState(0);
  const [tableView, setTableView] = useState<TableViewState>({ sortColumn: null, direction: 'ascending', filter: '' });
  const [help, setHelp] = useState(false);
  const [eventOptions, setEventOptions] = useState<EventResponseOptions>(DEFAULT_EVENT_RESPONSE);
  const [unitView, setUnitView] = useState<UnitView | null>(null);
  const [settingsError, setSettingsError] = useState<string | null>(null);
  const noteRef = useRef<HTMLTextAreaElement>(null);
  const dirty = useRef(false);

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
        const saved = parseSavedState(opened.savedState);
        let overrides: Overrides = saved.parameters;
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
        setCuration(saved.curation);
        setSelected(0);
        setUnitView(null);
        setTableView({ sortColumn: null, direction: 'ascending', filter: '' });
        setEventOptions({ ...DEFAULT_EVENT_RESPONSE, event: info.eventLabels.includes(DEFAULTS.ramp.event) ? DEFAULTS.ramp.event : (info.eventLabels[0] ?? '') });
        host.noteOpened(o);
        if (saved.message) setStatus(saved.message);
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
      (v) => live && setUnitView(v),
      (e) => live && !(e instanceof CancelledError) && setStatus(message(e)),
    );
    return () => {
      live = false;
    };
  }, [client, session, screen, selected, eventOptions]);

  // Saving: every change is kept (debounced), so curation work is never lost.
  const save = useCallback(
    async (explicit: boolean) => {
      if (!session) return;
      try {
        const where = await host.saveState(session.opened, serialiseState(session.opened.name, session.overrides, curation, new Date()));
        dirty.current = false;
        if (explicit) setStatus(`Workbench state saved to ${where}.`);
      } catch (e) {
        setStatus(`Could not save the workbench state: ${message(e)}`);
      }
    },
    [curation, host, session],
  );
  useEffect(() => {
    if (!session || !dirty.current) return;
    const t = setTimeout(() => void save(false), 400);
    return () => clearTimeout(t);
  }, [curation, session, save]);

  const unitId = session ? session.unitIds[selected] : '';
  const edit = useCallback(
    (change: Partial<UnitCuration>) => {
      if (!session) return;
      const next = editCuration(curation, unitId, change);
      if (next === curation) return;
      dirty.current = true;
      setCuration(next);
      setStatus(next.undo.at(-1)!.what);
    },
    [curation, session, unitId],
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
        case 'label:identified':
        case 'label:not identified':
        case 'label:unsure':
          edit({ label: c.slice(6) as CurationLabel });
          return;
        case 'label:clear':
          edit({ label: null });
          return;
        case 'toggle-include':
          edit({ included: !curationOf(curation, unitId).included });
          return;
        case 'focus-note':
          setScreen('unit');
          setTimeout(() => noteRef.current?.focus(), 0);
          return;
        case 'undo':
        case 'redo': {
          const r = (c === 'undo' ? undoCuration : redoCuration)(curation);
          if (!r.edit) {
            setStatus(`Nothing to ${c}.`);
            return;
          }
          dirty.current = true;
          setCuration(r.state);
          setSelected(Math.max(0, session.unitIds.indexOf(r.edit.unitId)));
          setStatus(`${c === 'undo' ? 'Undone' : 'Redone'}: ${r.edit.what}`);
          return;
        }
        case 'save':
          void save(true);
          return;
      }
    },
    [curation, edit, openDemo, openPicked, save, session, step, unitId],
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
            view={unitView && unitView.unitIndex === selected ? unitView : null}
            curation={curationOf(curation, unitId)}
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
          <SettingsScreen session={session} onRun={rerun} error={settingsError} busy={!!busy} />
        ) : (
          <ExportScreen client={client} host={host} session={session} curation={curation} unitIndex={selected} eventOptions={eventOptions} onStatus={setStatus} />
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
