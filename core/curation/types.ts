/**
 * Curation: a person's decisions stored beside the computed results, never
 * over them. Computed verdicts stay in the unit table as computed; a label
 * here overrides the *final* value only (see applyCuration).
 *
 * Every decision carries who made it and when (`by`, `at`). Core has no
 * clock: the caller (app or CLI) passes `at` as an ISO 8601 UTC string.
 */
export interface Stamp {
  /** Who decided (user name as the app or CLI was told). */
  readonly by: string;
  /** When, ISO 8601 UTC, e.g. "2026-03-01T14:05:00.000Z". */
  readonly at: string;
}

/** A person's label for one verdict column (e.g. column "tag", value "tagged"). */
export interface LabelDecision extends Stamp {
  readonly value: string;
}

export interface NoteDecision extends Stamp {
  readonly text: string;
}

export interface IncludeDecision extends Stamp {
  /** true = keep the unit in analyses and exports' "included" set, false = exclude it. */
  readonly value: boolean;
}

/** Everything decided about one unit. Absent fields = nothing decided. */
export interface UnitCuration {
  /** Labels by verdict column name (tag, ramp, quality, jump_K). */
  readonly labels: Readonly<Record<string, LabelDecision>>;
  readonly note?: NoteDecision;
  readonly include?: IncludeDecision;
}

/** The curation of a session, by unit id. */
export interface CurationState {
  readonly units: Readonly<Record<string, UnitCuration>>;
}

/** One curation action. value null / text "" clears the decision. */
export type CurationAction =
  | ({ readonly type: 'label'; readonly unit: string; readonly column: string; readonly value: string | null } & Stamp)
  | ({ readonly type: 'note'; readonly unit: string; readonly text: string } & Stamp)
  | ({ readonly type: 'include'; readonly unit: string; readonly value: boolean | null } & Stamp)
  /** Several actions undone and redone as one step (e.g. "exclude these 12 units"). */
  | { readonly type: 'batch'; readonly actions: readonly CurationAction[] };

/** The empty curation. */
export const EMPTY_CURATION: CurationState = { units: {} };
