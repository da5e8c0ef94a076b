import type { CurationState } from '../curation/types';
import type { Parameters } from '../defaults';
import type { InputFileRecord } from '../io/import-result';
import { summariseRecording } from '../model/summarise-recording';
import type { Recording, Warning } from '../model/types';
import type { UnitTable } from '../table/types';

/** Curation counts, present when the output was made from a curated session. */
export interface CurationSummary {
  readonly unitsCurated: number;
  readonly labels: number;
  readonly excluded: number;
  /** Curated unit ids that no longer exist in the data. */
  readonly orphans: readonly string[];
}

/** Counts of a curation, as run.json reports them. */
function curationSummary(state: CurationState, orphans: readonly string[]): CurationSummary {
  const cu = Object.values(state.units);
  return {
    unitsCurated: cu.length,
    labels: cu.reduce((n, u) => n + Object.keys(u.labels).length, 0),
    excluded: cu.filter((u) => u.include?.value === false).length,
    orphans,
  };
}

/** What every command that writes an output folder records in its run.json. */
export interface RunRecordInput {
  readonly version: string;
  /** The command that wrote the files: "run", "export", ... */
  readonly command: string;
  /** ISO 8601 UTC times (passed in: core has no clock). */
  readonly startedAt: string;
  readonly finishedAt: string;
  readonly session: { readonly name: string; readonly path: string; readonly kind: 'folder' | 'nwb' };
  /** The curated session file used, or null when the data were opened directly. */
  readonly sessionFile: string | null;
  readonly inputs: readonly InputFileRecord[];
  /** Files whose "parameters" were applied, in order (session.json, --config file, ...). */
  readonly parameterFiles: readonly string[];
  readonly parameters: Parameters;
  readonly recording: Recording;
  readonly warnings: readonly Warning[];
  /** Per-step session summaries of the analysis, keyed by step name. */
  readonly steps: Readonly<Record<string, unknown>>;
  /** The curation applied to `table`, and the curated ids not in the data (applyCuration's orphans). */
  readonly curation?: { readonly state: CurationState; readonly orphans: readonly string[] };
  /** Things the user was told (inputs changed, backup used). */
  readonly notices?: readonly string[];
  /** Files written beside run.json. */
  readonly outputs: readonly string[];
  readonly table: UnitTable;
}

/**
 * The text of run.json, the provenance record written beside every output
 * folder's tables (DESIGN.md section 3: tool version, parameters, SHA-256 of
 * every input file, warnings). One builder for every command, so a script
 * reading run.json sees the same fields whichever command wrote it, and an
 * output folder is recognised as tagbench's by `"tool": "tagbench"`.
 * Non-finite numbers (which JSON cannot hold) are written as strings
 * ("NaN", "Infinity"). Pure; the Node edge adds the clock and writes it.
 */
export function buildRunRecord(r: RunRecordInput): string {
  const record = {
    tool: 'tagbench' as const,
    version: r.version,
    command: r.command,
    startedAt: r.startedAt,
    finishedAt: r.finishedAt,
    session: r.session,
    sessionFile: r.sessionFile,
    inputs: r.inputs,
    parameterFiles: r.parameterFiles,
    parameters: r.parameters,
    recording: (({ units, spikes, spanS, spanSource, pulses }) => ({ units, spikes, spanS, spanSource, pulses, events: r.recording.events.time.length, trials: r.recording.trials.trial.length }))(summariseRecording(r.recording)),
    warnings: r.warnings,
    steps: r.steps,
    ...(r.curation ? { curation: curationSummary(r.curation.state, r.curation.orphans) } : {}),
    notices: r.notices ?? [],
    outputs: r.outputs,
    columns: r.table.columns.map((c) => ({ name: c.name, description: c.description })),
  };
  return `${JSON.stringify(record, (_k, v) => (typeof v === 'number' && !Number.isFinite(v) ? String(v) : v), 2)}\n`;
}
