import type Plotly from 'plotly.js-dist-min';
import { loadPlotly } from '../components/load-plotly';
import { figureHeight } from '../../core/figures/draw/figure-height';
import { forScreen } from '../../core/figures/draw/for-screen';
import { useEffect, useState } from 'react';
import type { CurationHistory } from '../../core/curation/history';
import type { FigureSpec } from '../../core/figures/theme';
import { SESSION_FILE_NAME, sessionFileText, type OpenSession } from '../app/App';
import type { Host } from '../host/host';
import type { EventView } from '../worker/api';
import type { AnalysisClient } from '../worker/client';

/** Figure sizes of exports, px (at scale 1 the SVG's own size; PNG at scale 2 for print). */
export const EXPORT_WIDTH = 900;

/** Bytes of an image data URL from Plotly.toImage (SVG comes URL-encoded, PNG base64). */
export function dataUrlBytes(url: string): Uint8Array {
  const comma = url.indexOf(',');
  const head = url.slice(0, comma);
  const body = url.slice(comma + 1);
  if (head.endsWith(';base64')) return Uint8Array.from(atob(body), (ch) => ch.charCodeAt(0));
  return new TextEncoder().encode(decodeURIComponent(body));
}

interface NamedFigure {
  readonly name: string;
  readonly title: string;
  readonly spec: FigureSpec;
}

/** Export: the unit table, curation, figures as SVG or PNG, and the workbench state. */
export function ExportScreen(props: {
  client: AnalysisClient;
  host: Host;
  session: OpenSession;
  history: CurationHistory;
  unitIndex: number;
  eventOptions: EventView;
  onStatus: (s: string) => void;
}) {
  const { client, host, session, history, unitIndex, eventOptions, onStatus } = props;
  const curation = history.present;
  const [figures, setFigures] = useState<NamedFigure[]>([]);
  const [working, setWorking] = useState(false);
  const unitId = session.unitIds[unitIndex];
  const base = session.opened.name.replace(/[^\w.-]+/g, '_');

  useEffect(() => {
    let live = true;
    void Promise.all([client.unitView(unitIndex, eventOptions), client.population(curation)]).then(([u, p]) => {
      if (!live) return;
      setFigures([
        { name: `${base}_timeline`, title: 'Session timeline', spec: session.info.timeline },
        ...u.figures.map((f) => ({ name: `${base}_unit-${unitId}_${f.id}`, title: `Unit ${unitId}: ${f.title}`, spec: f.spec })),
        ...p.figures.map((f) => ({ name: `${base}_${f.id}`, title: `Population: ${f.title}`, spec: f.spec })),
      ]);
    });
    return () => {
      live = false;
    };
  }, [client, unitIndex, eventOptions, session, curation, base, unitId]);

  const save = async (fileName: string, data: () => Promise<string | Uint8Array>, mime: string) => {
    setWorking(true);
    try {
      const where = await host.saveExport(fileName, await data(), mime);
      onStatus(where ? `Exported ${fileName} to ${where}.` : 'Export cancelled.');
    } catch (e) {
      onStatus(`Could not export ${fileName}: ${(e as Error).message}`);
    } finally {
      setWorking(false);
    }
  };

  const report = async (): Promise<string> => {
    onStatus('Building the report (every figure of every unit)...');
    const plotlySource = (await import('plotly.js-dist-min/plotly.min.js?raw')).default;
    return client.reportHtml({
      curation,
      title: `tagbench report: ${session.opened.name}`,
      createdAt: new Date().toISOString(),
      toolVersion: typeof __TAGBENCH_VERSION__ === 'string' ? __TAGBENCH_VERSION__ : 'unknown',
      source: session.opened.displayPath,
      sessionFile: SESSION_FILE_NAME,
      notices: [],
      plotlySource,
    });
  };

  const image = (f: NamedFigure, format: 'svg' | 'png') =>
    save(
      `${f.name}.${format}`,
      async () => {
        const height = figureHeight(f.spec);
        const spec = forScreen(f.spec, { widthPx: EXPORT_WIDTH, heightPx: height, exact: true });
        const url = await (await loadPlotly()).toImage({ data: spec.data as Plotly.Data[], layout: spec.layout as Partial<Plotly.Layout> }, { format, width: EXPORT_WIDTH, height, scale: format === 'png' ? 2 : 1 });
        return dataUrlBytes(url);
      },
      format === 'svg' ? 'image/svg+xml' : 'image/png',
    );

  return (
    <div className="screen export">
      <h1>Export</h1>
      <div className="columns">
        <section className="panel">
          <h2>Tables</h2>
          <ul className="export-list">
            <li>
              <button disabled={working} onClick={() => save('units.csv', () => client.tableText('csv', null), 'text/csv')} data-testid="export-units-csv">units.csv</button>
              <span className="muted">one row per unit, the computed columns of the headless run</span>
            </li>
            <li>
              <button disabled={working} onClick={() => save('units_curated.csv', () => client.tableText('csv', curation), 'text/csv')} data-testid="export-curated-csv">units_curated.csv</button>
              <span className="muted">the same plus final_* (your labels where set), included, note and who curated when</span>
            </li>
            <li>
              <button disabled={working} onClick={() => save('units_curated.tsv', () => client.tableText('tsv', curation), 'text/tab-separated-values')}>.tsv</button>
              <button disabled={working} onClick={() => save('units_curated.json', () => client.tableText('json', curation), 'application/json')}>.json</button>
              <span className="muted">the curated table, tab-separated or as JSON</span>
            </li>
            <li>
              <button
                disabled={working}
                onClick={() =>
                  save(
                    'run.json',
                    () =>
                      client.runRecordText({
                        curation,
                        finishedAt: new Date().toISOString(),
                        toolVersion: typeof __TAGBENCH_VERSION__ === 'string' ? __TAGBENCH_VERSION__ : 'unknown',
                        source: session.opened.displayPath,
                        sessionFile: SESSION_FILE_NAME,
                        notices: [],
                        outputs: ['units.csv', 'units_curated.csv'],
                      }),
                    'application/json',
                  )
                }
                data-testid="export-run-json"
              >
                run.json
              </button>
              <span className="muted">provenance of the tables: tool version, parameters, input files with SHA-256, warnings, analysis summaries, curation counts (the record the command line's export writes)</span>
            </li>
            <li>
              <button disabled={working} onClick={() => save(`${base}_report.html`, report, 'text/html')} data-testid="export-report">
                HTML report
              </button>
              <span className="muted">one file that opens offline: cautions, counts, criteria, quality, every figure and unit, inputs with SHA-256</span>
            </li>
            <li>
              <button disabled={working} onClick={() => save(SESSION_FILE_NAME, async () => sessionFileText(session, history, new Date()), 'application/json')} data-testid="export-session-file">
                {SESSION_FILE_NAME}
              </button>
              <span className="muted">the session file: input hashes, parameters and your curation, to reopen the work</span>
            </li>
          </ul>
        </section>
        <section className="panel">
          <h2>Figures</h2>
          <p className="muted small">Unit {unitId} (the unit selected in the Unit table) and the population. SVG for editing, PNG at twice the screen size.</p>
          {figures.length === 0 && <p className="muted small">Preparing the figures...</p>}
          <ul className="export-list">
            {figures.map((f) => (
              <li key={f.name}>
                <span className="figure-title">{f.title}</span>
                <button disabled={working} onClick={() => image(f, 'svg')}>SVG</button>
                <button disabled={working} onClick={() => image(f, 'png')}>PNG</button>
              </li>
            ))}
          </ul>
        </section>
      </div>
    </div>
  );
}
