import { resolveParameters } from '../../core/resolve-parameters';
import type { Parameters } from '../../core/defaults';
import { applyCuration } from '../../core/curation/apply-curation';
import type { CurationState } from '../../core/curation/types';
import { verdictWords } from '../../core/curation/verdict-words';
import { formatTable } from '../../core/export/format-table';
import { buildReport } from '../../core/report/build-report';
import { collectReportFigures } from '../../core/report/collect-report-figures';
import { sessionTimelineFigure } from '../../core/figures/session-timeline-figure';
import type { UnitFigure } from '../../core/figures/types';
import { summariseRecording } from '../../core/model/summarise-recording';
import type { Recording, Warning } from '../../core/model/types';
import { assembleTable } from '../../core/table/assemble-table';
import type { Column, UnitTable } from '../../core/table/types';
import { STEPS } from '../../core/pipeline/steps';
import type { ReportRequest, RunRecordRequest } from './api';
import { buildRunRecord } from '../../core/export/build-run-record';
import type { AnalysisOutcome, EventView, OpenOutcome, PlacedFigure, PopulationView, Progress, SessionFileInput, TableData, TableFormat, UnitSection, UnitView, WorkbenchApi } from './api';
import { POPULATION_FIGURE_LIST, UNIT_FIGURE_LIST } from './figure-lists';
import { isVerdictColumn } from '../state/verdict-columns';
import type { InputFileRecord } from '../../core/io/import-result';
import { importSessionFiles, type OpenHdf5Bytes } from './import-session-files';

/**
 * The worker's engine: holds the imported recording and the last analysis,
 * and answers the screens' questions over core. Plain class (no worker
 * globals), so tests and the benchmark can drive it directly.
 */
export class WorkbenchEngine implements WorkbenchApi {
  private recording: Recording | null = null;
  private parameters: Parameters | null = null;
  private table: UnitTable | null = null;
  private sessionParameters: readonly { file: string; overrides: unknown }[] = [];
  private inputs: readonly InputFileRecord[] = [];
  private importWarnings: readonly Warning[] = [];
  private analysisWarnings: readonly Warning[] = [];
  private summaries: Readonly<Record<string, unknown>> = {};
  /** Unit views of the current analysis by unit and event view (cleared by every analysis). */
  private views = new Map<string, UnitView>();
  private openedAt = '';
  private session: { name: string; kind: 'folder' | 'nwb' } = { name: '', kind: 'folder' };

  /** `openHdf5Bytes` replaces the worker's h5wasm opener (tests in Node). */
  constructor(private readonly openHdf5Bytes?: OpenHdf5Bytes) {}

  async open(files: readonly SessionFileInput[], name: string, overrides: unknown, onProgress: (p: Progress) => void): Promise<OpenOutcome> {
    onProgress({ label: `Importing ${name}`, done: 0, total: 1 });
    const imported = await importSessionFiles(name, files, this.openHdf5Bytes);
    this.recording = imported.recording;
    this.sessionParameters = imported.parameterSources;
    this.inputs = imported.inputs;
    this.importWarnings = imported.warnings;
    this.session = { name: imported.name, kind: imported.sourceKind };
    this.openedAt = new Date().toISOString();
    const outcome = await this.analyse(overrides, onProgress);
    return {
      ...outcome,
      name,
      summary: summariseRecording(imported.recording),
      importWarnings: imported.warnings,
      timeline: sessionTimelineFigure(imported.recording),
      eventLabels: [...new Set(imported.recording.events.label)],
      inputs: imported.inputs,
    };
  }

  async analyse(overrides: unknown, onProgress: (p: Progress) => void): Promise<AnalysisOutcome> {
    const rec = this.need();
    const t0 = performance.now();
    // The session's own parameters (session.json) first, then the workbench's settings.
    const parameters = resolveParameters([...this.sessionParameters, { file: 'Analysis settings', overrides }]);
    const columns = new Map<string, Column>();
    const warnings: Warning[] = [];
    const summaries: Record<string, unknown> = {};
    STEPS.forEach((step, i) => {
      onProgress({ label: `Analysis: ${step.name}`, done: i, total: STEPS.length });
      const res = step.run({ recording: rec, parameters, columns });
      for (const c of res.columns) columns.set(c.name, c);
      if (res.warnings) warnings.push(...res.warnings);
      if (res.summary) summaries[step.name] = res.summary;
    });
    this.summaries = summaries;
    this.analysisWarnings = warnings;
    this.views.clear();
    onProgress({ label: 'Analysis done', done: STEPS.length, total: STEPS.length });
    this.parameters = parameters;
    this.table = assembleTable([...columns.values()], rec.units.length);
    return { table: toTableData(this.table), parameters, warnings, elapsedMs: performance.now() - t0 };
  }

  async unitView(unitIndex: number, eventView: EventView): Promise<UnitView> {
    const key = `${unitIndex}|${JSON.stringify(eventView)}`;
    const cached = this.views.get(key);
    if (cached) return cached;
    const view = this.buildUnitView(unitIndex, eventView);
    this.views.set(key, view);
    // Keep the last few (the units around the one on screen); the oldest go first.
    for (const k of this.views.keys()) {
      if (this.views.size <= VIEW_CACHE_SIZE) break;
      this.views.delete(k);
    }
    return view;
  }

  async prefetchUnitViews(unitIndexes: readonly number[], eventView: EventView): Promise<void> {
    const rec = this.need();
    for (const i of unitIndexes) if (i >= 0 && i < rec.units.length) await this.unitView(i, eventView);
  }

  private buildUnitView(unitIndex: number, eventView: EventView): UnitView {
    const rec = this.need();
    const unit = rec.units[unitIndex];
    if (!unit) throw new Error(`no unit at index ${unitIndex}`);
    const parameters = this.needParameters();
    const ctx = { recording: rec, parameters, table: this.needTable() };
    // The event response is drawn with the page's window/bin/smoothing controls.
    const eventCtx = { ...ctx, parameters: { ...parameters, align: { ...parameters.align, ...eventView } } };
    const figures: PlacedFigure[] = [];
    for (const f of UNIT_FIGURE_LIST) {
      const section = sectionOf(f);
      const spec = f.build(section === 'event' ? eventCtx : ctx, unitIndex);
      if (spec) figures.push({ section, id: f.id, title: f.title, spec });
    }
    const reasons: { column: string; text: string }[] = [];
    for (const c of ctx.table.columns) {
      if (c.kind === 'string' && /reasons?$/.test(c.name) && c.values[unitIndex]) reasons.push({ column: c.name, text: c.values[unitIndex] });
    }
    return { unitIndex, unitId: unit.id, figures, reasons };
  }

  async population(curation: CurationState): Promise<PopulationView> {
    const curated = applyCuration(this.needTable(), curation).table;
    const ids = curated.columns.find((c) => c.name === 'unit')!.values as readonly string[];
    const excluded = new Set(ids.filter((id) => curation.units[id]?.include?.value === false));
    const table = keepRows(curated, excluded);
    const ctx = { recording: this.need(), parameters: this.needParameters(), table };
    const figures: PopulationView['figures'][number][] = [];
    for (const f of POPULATION_FIGURE_LIST) {
      const spec = f.build(ctx);
      if (spec) figures.push({ id: f.id, title: f.title, spec });
    }
    const byName = new Map(table.columns.map((c) => [c.name, c]));
    const counts: PopulationView['counts'][number][] = [];
    for (const c of table.columns) {
      if (c.kind !== 'string' || !isVerdictColumn(c)) continue;
      const words = verdictWords(c.name)!;
      const fin = byName.get(`final_${c.name}`)?.values as readonly string[] | undefined;
      counts.push({
        column: c.name,
        counts: words.map((word) => ({
          word,
          computed: c.values.filter((v) => v === word).length,
          final: (fin ?? c.values).filter((v) => v === word).length,
        })),
      });
    }
    return { units: table.rowCount, figures, counts };
  }

  async tableText(format: TableFormat, curation: CurationState | null): Promise<string> {
    const t = this.needTable();
    return formatTable(curation ? applyCuration(t, curation).table : t, format);
  }

  async runRecordText(r: RunRecordRequest): Promise<string> {
    const curated = applyCuration(this.needTable(), r.curation);
    return buildRunRecord({
      version: r.toolVersion,
      command: 'workbench export',
      startedAt: this.openedAt,
      finishedAt: r.finishedAt,
      session: { name: this.session.name, path: r.source, kind: this.session.kind },
      sessionFile: r.sessionFile,
      inputs: this.inputs,
      parameterFiles: [...this.sessionParameters.map((s) => s.file), 'Analysis settings'],
      parameters: this.needParameters(),
      recording: this.need(),
      warnings: [...this.importWarnings, ...this.analysisWarnings],
      steps: this.summaries,
      curation: { state: r.curation, orphans: curated.orphans },
      notices: r.notices,
      outputs: r.outputs,
      table: curated.table,
    });
  }

  async reportHtml(r: ReportRequest): Promise<string> {
    const table = applyCuration(this.needTable(), r.curation).table;
    const parameters = this.needParameters();
    const figures = collectReportFigures({ recording: this.need(), parameters, table }, UNIT_FIGURE_LIST, POPULATION_FIGURE_LIST);
    return buildReport({
      title: r.title,
      createdAt: r.createdAt,
      toolVersion: r.toolVersion,
      source: r.source,
      sessionFile: r.sessionFile,
      table,
      parameters,
      summaries: this.summaries,
      inputs: this.inputs,
      warnings: [...this.importWarnings, ...this.analysisWarnings],
      notices: r.notices,
      figures,
      plotlySource: r.plotlySource,
    });
  }

  /** The current parameters (after the last analysis). */
  currentParameters(): Parameters | null {
    return this.parameters;
  }

  private need(): Recording {
    if (!this.recording) throw new Error('no session is open');
    return this.recording;
  }

  private needParameters(): Parameters {
    if (!this.parameters) throw new Error('no analysis has run');
    return this.parameters;
  }

  private needTable(): UnitTable {
    if (!this.table) throw new Error('no analysis has run');
    return this.table;
  }
}

/** Unit views kept by the engine: the one on screen and its neighbours in the table, fetched ahead. */
const VIEW_CACHE_SIZE = 8;

/** The Unit page section a unit figure belongs to, by its id. */
function sectionOf(f: UnitFigure): UnitSection {
  if (f.id.startsWith('light')) return 'light';
  if (f.id === 'event-response' || f.id.startsWith('event')) return 'event';
  if (f.id.startsWith('ramp') || f.id.startsWith('jump')) return 'ramp-jump';
  if (f.id.startsWith('indicator')) return 'indicator';
  return 'quality';
}

/** The table without the rows of the given unit ids (column `unit`). */
function keepRows(t: UnitTable, ex: ReadonlySet<string>): UnitTable {
  if (ex.size === 0) return t;
  const ids = t.columns.find((c) => c.name === 'unit')?.values as readonly string[];
  const keep: number[] = [];
  for (let i = 0; i < t.rowCount; i++) if (!ex.has(ids[i])) keep.push(i);
  return {
    rowCount: keep.length,
    columns: t.columns.map((c) =>
      c.kind === 'number' ? { ...c, values: Float64Array.from(keep, (i) => c.values[i]) } : { ...c, values: keep.map((i) => c.values[i]) },
    ),
  };
}

function toTableData(t: UnitTable): TableData {
  return { rowCount: t.rowCount, columns: t.columns.map((c) => ({ ...c })) as TableData['columns'] };
}
