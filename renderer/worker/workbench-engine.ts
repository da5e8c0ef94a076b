import { resolveParameters } from '../../core/resolve-parameters';
import type { Parameters } from '../../core/defaults';
import { eventResponseFigure, type EventResponseOptions } from '../../core/figures/event-response-figure';
import { sessionTimelineFigure } from '../../core/figures/session-timeline-figure';
import { verdictCounts, verdictCountsFigure } from '../../core/figures/verdict-counts-figure';
import { summariseRecording } from '../../core/model/summarise-recording';
import type { Recording, Warning } from '../../core/model/types';
import { assembleTable } from '../../core/table/assemble-table';
import { formatDelimited } from '../../core/table/format-delimited';
import type { Column, UnitTable } from '../../core/table/types';
import { STEPS } from '../../core/pipeline/steps';
import type { AnalysisOutcome, OpenOutcome, PlacedFigure, PopulationView, Progress, SessionFileInput, TableData, UnitView, WorkbenchApi } from './api';
import { importSession } from '../../core/io/import-session';
import type { InputFileRecord } from '../../core/io/import-result';
import { createBlobSessionSource } from './blob-session-source';

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

  async open(files: readonly SessionFileInput[], name: string, overrides: unknown, onProgress: (p: Progress) => void): Promise<OpenOutcome> {
    onProgress({ label: `Importing ${name}`, done: 0, total: 1 });
    const imported = await importSession(createBlobSessionSource(name, files));
    this.recording = imported.recording;
    this.sessionParameters = imported.parameterSources;
    this.inputs = imported.inputs;
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
    STEPS.forEach((step, i) => {
      onProgress({ label: `Analysis: ${step.name}`, done: i, total: STEPS.length });
      const res = step.run({ recording: rec, parameters, columns });
      for (const c of res.columns) columns.set(c.name, c);
      if (res.warnings) warnings.push(...res.warnings);
    });
    onProgress({ label: 'Analysis done', done: STEPS.length, total: STEPS.length });
    this.parameters = parameters;
    this.table = assembleTable([...columns.values()], rec.units.length);
    return { table: toTableData(this.table), parameters, warnings, elapsedMs: performance.now() - t0 };
  }

  async unitView(unitIndex: number, eventOptions: EventResponseOptions): Promise<UnitView> {
    const rec = this.need();
    const unit = rec.units[unitIndex];
    if (!unit) throw new Error(`no unit at index ${unitIndex}`);
    const figures: PlacedFigure[] = [];
    const ev = eventResponseFigure(unit.spikeTimes, rec.events, rec.trials, eventOptions, unit.id);
    if (ev) figures.push({ section: 'event', id: 'event-response', title: 'Event response', spec: ev });
    const reasons: { column: string; text: string }[] = [];
    for (const c of this.table?.columns ?? []) {
      if (c.kind === 'string' && /reasons?$/.test(c.name) && c.values[unitIndex]) reasons.push({ column: c.name, text: c.values[unitIndex] });
    }
    return { unitIndex, unitId: unit.id, figures, reasons };
  }

  async population(excludedUnitIds: readonly string[]): Promise<PopulationView> {
    const table = keepRows(this.needTable(), excludedUnitIds);
    const figures: PopulationView['figures'][number][] = [];
    const counts = verdictCountsFigure(table);
    if (counts) figures.push({ id: 'verdict-counts', title: 'Units per verdict', spec: counts });
    return { units: table.rowCount, figures, counts: verdictCounts(table) };
  }

  async tableText(delimiter: ',' | '\t'): Promise<string> {
    return formatDelimited(this.needTable(), delimiter);
  }

  /** The current parameters (after the last analysis). */
  currentParameters(): Parameters | null {
    return this.parameters;
  }

  private need(): Recording {
    if (!this.recording) throw new Error('no session is open');
    return this.recording;
  }

  private needTable(): UnitTable {
    if (!this.table) throw new Error('no analysis has run');
    return this.table;
  }
}

/** The table without the rows of the given unit ids (column `unit`). */
function keepRows(t: UnitTable, excludedUnitIds: readonly string[]): UnitTable {
  if (excludedUnitIds.length === 0) return t;
  const ex = new Set(excludedUnitIds);
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
