import { proxy, wrap, type Remote } from 'comlink';
import type { CurationState } from '../../core/curation/types';
import type { ReportRequest, RunRecordRequest } from './api';
import type { AnalysisOutcome, EventView, OpenOutcome, PopulationView, Progress, SessionFileInput, TableFormat, UnitView, WorkbenchApi } from './api';

/** Thrown into a pending call when the user cancels it. */
export class CancelledError extends Error {
  constructor() {
    super('Cancelled.');
    this.name = 'CancelledError';
  }
}

/**
 * The page's handle on the analysis worker. Cancelling long work terminates
 * the worker (the only way to stop synchronous computation at once), starts a
 * fresh one and reopens the session with the last parameters that completed,
 * so the screens keep showing the previous results.
 */
export class AnalysisClient {
  private worker!: Worker;
  private api!: Remote<WorkbenchApi>;
  private cancelWaiters = new Set<(e: Error) => void>();
  private files: readonly SessionFileInput[] = [];
  private name = '';
  private goodOverrides: unknown = {};

  constructor(private readonly createWorker: () => Worker = defaultWorker) {
    this.spawn();
  }

  private spawn(): void {
    this.worker = this.createWorker();
    this.api = wrap<WorkbenchApi>(this.worker);
  }

  private cancellable<T>(p: Promise<T>): Promise<T> {
    return new Promise<T>((resolve, reject) => {
      const onCancel = (e: Error) => reject(e);
      this.cancelWaiters.add(onCancel);
      p.then(resolve, reject).finally(() => this.cancelWaiters.delete(onCancel));
    });
  }

  async open(files: readonly SessionFileInput[], name: string, overrides: unknown, onProgress: (p: Progress) => void): Promise<OpenOutcome> {
    const out = await this.cancellable(this.api.open(files, name, overrides, proxy(onProgress)));
    this.files = files;
    this.name = name;
    this.goodOverrides = overrides;
    return out;
  }

  async analyse(overrides: unknown, onProgress: (p: Progress) => void): Promise<AnalysisOutcome> {
    const out = await this.cancellable(this.api.analyse(overrides, proxy(onProgress)));
    this.goodOverrides = overrides;
    return out;
  }

  unitView(unitIndex: number, view: EventView): Promise<UnitView> {
    return this.cancellable(this.api.unitView(unitIndex, view));
  }

  /** Fire and forget: the worker computes these units' views while the page draws (errors are ignored: the real request reports them). */
  prefetchUnitViews(unitIndexes: readonly number[], view: EventView): void {
    this.api.prefetchUnitViews(unitIndexes, view).catch(() => undefined);
  }

  population(curation: CurationState): Promise<PopulationView> {
    return this.cancellable(this.api.population(curation));
  }

  tableText(format: TableFormat, curation: CurationState | null): Promise<string> {
    return this.cancellable(this.api.tableText(format, curation));
  }

  reportHtml(r: ReportRequest): Promise<string> {
    return this.cancellable(this.api.reportHtml(r));
  }

  runRecordText(r: RunRecordRequest): Promise<string> {
    return this.cancellable(this.api.runRecordText(r));
  }

  /** Stops whatever the worker is doing; pending calls reject with CancelledError. */
  async cancel(): Promise<void> {
    this.worker.terminate();
    for (const w of [...this.cancelWaiters]) w(new CancelledError());
    this.cancelWaiters.clear();
    this.spawn();
    if (this.files.length > 0) await this.api.open(this.files, this.name, this.goodOverrides, proxy(() => undefined));
  }
}

function defaultWorker(): Worker {
  return new Worker(new URL('./analysis.worker.ts', import.meta.url), { type: 'module', name: 'tagbench-analysis' });
}
