import type { Parameters } from '../defaults';
import type { InputFileRecord } from '../io/import-result';
import type { Warning } from '../model/types';

/** What run.json holds beside an export or report (provenance). */
export interface Provenance {
  readonly tool: { readonly name: 'tagbench'; readonly version: string };
  /** The command that wrote the files, e.g. "export". */
  readonly command: string;
  /** When the files were written, ISO 8601 UTC (passed in: core has no clock). */
  readonly createdAt: string;
  /** The session file used, if any, and the data source it points to. */
  readonly sessionFile: string | null;
  readonly source: string;
  readonly inputs: readonly InputFileRecord[];
  readonly parameters: Parameters;
  readonly warnings: readonly Warning[];
  /** Per-step summaries of the analysis (e.g. quality counts, light criteria). */
  readonly summaries: Readonly<Record<string, unknown>>;
  /** Curation counts, and notices (inputs changed, session loaded from backup). */
  readonly curation: { readonly unitsCurated: number; readonly labels: number; readonly excluded: number; readonly orphans: readonly string[] };
  readonly notices: readonly string[];
  /** Files written, with the table's column order. */
  readonly outputs: readonly string[];
  readonly columns: readonly string[];
}

/**
 * Assembles the provenance record written as run.json beside exports and the
 * report. Pure; the Node edge adds the clock and writes it. (`run` writes its
 * own run.json through the import area's writer; the fields here are a
 * superset meant to be merged with it.)
 */
export function buildProvenance(p: Provenance): string {
  return `${JSON.stringify(p, (_k, v) => (typeof v === 'number' && !Number.isFinite(v) ? String(v) : v), 2)}\n`;
}
