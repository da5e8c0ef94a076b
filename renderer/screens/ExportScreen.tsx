import type Plotly from 'plotly.js-dist-min';
import { loadPlotly } from '../components/load-plotly';
import { useEffect, useState } from 'react';
import type { EventResponseOptions } from '../../core/figures/event-response-figure';
import type { FigureSpec } from '../../core/figures/theme';
import type { OpenSession } from '../app/App';
import type { Host } from '../host/host';
import { curationCsv, type CurationState } from '../state/curation';
import { serialiseState } from '../state/saved-state';
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
  curation: CurationState;
  unitIndex: number;
  eventOptions: EventResponseOptions;
  onStatus: (s: string) => void;
}) {
  const { client, host, session, curation, unitIndex, eventOptions, onStatus } = props;
  const [figures, setFigures] = useState<NamedFigure[]>([]);
  const [working, setWorking] = useState(false);
  const unitId = session.unitIds[unitIndex];
  const base = session.opened.name.replace(/[^\w.-]+/g, '_');

  useEffect(() => {
    let live = true;
    const excluded = Object.entries(curation.byUnit).filter(([, c]) => !c.included).map(([id]) => id);
    void Promise.all([client.unitView(unitIndex, eventOptions), client.population(excluded)]).then(([u, p]) => {
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
  }, [client, unitIndex, eventOptions, session, curation.byUnit, base, unitId]);

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

  const image = (f: NamedFigure, format: 'svg' | 'png') =>
    save(
      `${f.name}.${format}`,
      async () => {
        const height = Number((f.spec.layout as { height?: number }).height) || 450;
        const url = await (await loadPlotly()).toImage({ data: f.spec.data as Plotly.Data[], layout: f.spec.layout as Partial<Plotly.Layout> }, { format, width: EXPORT_WIDTH, height, scale: format === 'png' ? 2 : 1 });
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
              <button disabled={working} onClick={() => save('units.csv', () => client.tableText(','), 'text/csv')} data-testid="export-units-csv">units.csv</button>
              <span className="muted">one row per unit, the headless run's columns (comma-separated)</span>
            </li>
            <li>
              <button disabled={working} onClick={() => save('units.tsv', () => client.tableText('\t'), 'text/tab-separated-values')}>units.tsv</button>
              <span className="muted">the same, tab-separated</span>
            </li>
            <li>
              <button disabled={working} onClick={() => save('curation.csv', async () => curationCsv(curation, session.unitIds), 'text/csv')} data-testid="export-curation-csv">curation.csv</button>
              <span className="muted">your label, include/exclude and note per unit</span>
            </li>
            <li>
              <button disabled={working} onClick={() => save(`${base}.tagbench-workbench.json`, async () => serialiseState(session.opened.name, session.overrides, curation, new Date()), 'application/json')}>
                workbench state (JSON)
              </button>
              <span className="muted">analysis settings and curation, to reopen elsewhere</span>
            </li>
          </ul>
        </section>
        <section className="panel">
          <h2>Figures</h2>
          <p className="muted small">Unit {unitId} (the unit selected in the Unit table) and the population. SVG for editing, PNG at twice the screen size.</p>
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
