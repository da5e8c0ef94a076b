/**
 * What the analysis worker offers the screens (through comlink). Everything
 * that computes runs behind this interface, in the worker, over core; the
 * React screens only draw what comes back.
 */
import type { Parameters } from '../../core/defaults';
import type { FigureSpec } from '../../core/figures/theme';
import type { CurationState } from '../../core/curation/types';
import type { RecordingSummary } from '../../core/model/summarise-recording';
import type { Warning } from '../../core/model/types';
import type { InputFileRecord } from '../../core/io/import-result';

/** One file of a session handed to the worker (File from an input, or a Blob read through the desktop bridge). */
export interface SessionFileInput {
  /** Name relative to the session folder, forward slashes. */
  readonly name: string;
  readonly blob: Blob;
}

export interface Progress {
  readonly label: string;
  readonly done: number;
  readonly total: number;
}

/** A column of the unit table, as the screens receive it. */
export type TableColumnData =
  | { readonly name: string; readonly kind: 'number'; readonly values: Float64Array; readonly description: string; readonly digits?: number }
  | { readonly name: string; readonly kind: 'string'; readonly values: readonly string[]; readonly description: string };

export interface TableData {
  readonly columns: readonly TableColumnData[];
  readonly rowCount: number;
}

export interface AnalysisOutcome {
  readonly table: TableData;
  readonly parameters: Parameters;
  readonly warnings: readonly Warning[];
  /** Milliseconds the analysis took (shown in the status line). */
  readonly elapsedMs: number;
}

export interface OpenOutcome extends AnalysisOutcome {
  readonly name: string;
  readonly summary: RecordingSummary;
  readonly importWarnings: readonly Warning[];
  readonly timeline: FigureSpec;
  /** Event labels, kinds and whether trials carry conditions (for the Event response controls). */
  readonly eventLabels: readonly string[];
  /** Every input file read, with its SHA-256 (provenance of exports). */
  readonly inputs: readonly InputFileRecord[];
}

/** A figure placed in a section of the Unit page. */
export interface PlacedFigure {
  readonly section: UnitSection;
  readonly id: string;
  readonly title: string;
  readonly spec: FigureSpec;
}

export type UnitSection = 'light' | 'event' | 'ramp-jump' | 'indicator' | 'quality';

export interface UnitView {
  readonly unitIndex: number;
  readonly unitId: string;
  readonly figures: readonly PlacedFigure[];
  /** Reason strings of the verdicts (columns named *reason / *reasons). */
  readonly reasons: readonly { column: string; text: string }[];
}

export interface PopulationView {
  /** Units summarised (after exclusions). */
  readonly units: number;
  readonly figures: readonly { id: string; title: string; spec: FigureSpec }[];
  /** Units per verdict word of each verdict column, computed and final (after the person's labels). */
  readonly counts: readonly { column: string; counts: readonly { word: string; computed: number; final: number }[] }[];
}

/** The Unit page's view of the event response: these fields of parameters.align, changed for display only. */
export type EventView = Pick<Parameters['align'], 'event' | 'windowStartS' | 'windowStopS' | 'binMs' | 'smoothing' | 'smoothingWidthMs' | 'groupBy'>;

export type TableFormat = 'csv' | 'tsv' | 'json';

/** What the page adds to a report request: what the worker cannot know. */
export interface ReportRequest {
  readonly curation: CurationState;
  readonly title: string;
  readonly createdAt: string;
  readonly toolVersion: string;
  readonly source: string;
  readonly sessionFile: string | null;
  readonly notices: readonly string[];
  /** The minified plotly.js source, embedded so the report opens offline. */
  readonly plotlySource: string;
}

/** What the page adds to a run.json request (the provenance of an exported table). */
export interface RunRecordRequest {
  readonly curation: CurationState;
  readonly finishedAt: string;
  readonly toolVersion: string;
  readonly source: string;
  readonly sessionFile: string | null;
  readonly notices: readonly string[];
  /** The files this record describes, e.g. ["units_curated.csv"]. */
  readonly outputs: readonly string[];
}

export interface WorkbenchApi {
  /** Imports a session and runs the analysis with the given parameter overrides. */
  open(files: readonly SessionFileInput[], name: string, overrides: unknown, onProgress: (p: Progress) => void): Promise<OpenOutcome>;
  /** Re-runs the analysis with new parameter overrides (validated; an InputError names the bad key). */
  analyse(overrides: unknown, onProgress: (p: Progress) => void): Promise<AnalysisOutcome>;
  /** Everything the Unit page shows of one unit (kept for the last few units and event views). */
  unitView(unitIndex: number, eventView: EventView): Promise<UnitView>;
  /** Computes the unit views of these units ahead (the neighbours in the table's order), so stepping to them answers at once. */
  prefetchUnitViews(unitIndexes: readonly number[], eventView: EventView): Promise<void>;
  /** Population summaries over the units the curation does not exclude. */
  population(curation: CurationState): Promise<PopulationView>;
  /** The unit table as text (units.csv layout); with curation, final_* / included / note columns follow (applyCuration). */
  tableText(format: TableFormat, curation: CurationState | null): Promise<string>;
  /** The self-contained HTML report (core/report/build-report.ts) of the curated table, every figure and the provenance. */
  reportHtml(input: ReportRequest): Promise<string>;
  /** run.json of the current analysis (core/export/build-run-record.ts: the same record `tagbench export` writes). */
  runRecordText(input: RunRecordRequest): Promise<string>;
}
