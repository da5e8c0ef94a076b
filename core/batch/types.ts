/**
 * Types of the batch runner (tagbench batch): one job per session, run by a
 * pool of workers; results collected into a combined table and a summary.
 */

/** What a worker is asked to do for one session. */
export interface BatchJob {
  /** Position in the batch (0-based). */
  readonly index: number;
  /** Session folder or .nwb file, as given (absolute). */
  readonly session: string;
  /** Unique, file-system-safe name of the session inside the batch. */
  readonly name: string;
  /** Output folder of this session (absolute). */
  readonly outDir: string;
  /** --config file to pass to `run`, if any (absolute). */
  readonly config: string | null;
  /** Analysis threads for the session's `run` (--threads): the CPUs shared among the batch's workers, at least 1. */
  readonly threads: number;
  /** Hash of everything besides the inputs that decides the result (tool version, config text). */
  readonly parametersKey: string;
  /** Ignore earlier results and run again. */
  readonly force: boolean;
  /** What the last batch into the same --out recorded for this session, if it succeeded. */
  readonly previous: { readonly listingKey: string; readonly parametersKey: string } | null;
}

export type BatchStatus = 'ok' | 'skipped' | 'failed';

/** The outcome of one job. */
export interface BatchJobResult {
  readonly index: number;
  readonly name: string;
  readonly session: string;
  readonly status: BatchStatus;
  /** Why it failed: "input" (the session's problem, one paragraph) or "internal" (a bug). */
  readonly failure?: 'input' | 'internal';
  /** One paragraph for a person (the failure message, or why it was skipped). */
  readonly message: string;
  /** Wall time spent, s. */
  readonly seconds: number;
  /** Sum of the sizes of the session's files, bytes. */
  readonly bytes: number;
  /** Listing key and parameters key the result was computed with (for the next resume). */
  readonly listingKey: string;
  readonly parametersKey: string;
}

/** Messages from a worker to the coordinator. */
export type WorkerMessage =
  | { readonly type: 'stage'; readonly index: number; readonly stage: string }
  | { readonly type: 'result'; readonly result: BatchJobResult };

/** Progress of one worker, for display. */
export interface WorkerProgress {
  readonly worker: number;
  /** Session name, or null when idle. */
  readonly name: string | null;
  readonly stage: string;
  /** Seconds since the session started. */
  readonly elapsedS: number;
  /** Estimated fraction done in [0, 1) (from input size and the throughput seen so far), NaN if unknown. */
  readonly fraction: number;
}
