import type { WorkerProgress } from './types';

/**
 * Progress lines for a terminal: one overall line (sessions finished of the
 * total, a bar, counts, elapsed time) and one line per worker (its session,
 * stage, elapsed time and an estimated bar; "~" marks an estimate). Bars are
 * `width` cells of "#" and "." (plain ASCII, so any terminal shows them).
 * Pure: the caller redraws the lines in place.
 */
export function renderBatchProgress(state: {
  readonly total: number;
  readonly ok: number;
  readonly skipped: number;
  readonly failed: number;
  readonly elapsedS: number;
  readonly workers: readonly WorkerProgress[];
  readonly width?: number;
}): string[] {
  const width = state.width ?? 24;
  const bar = (f: number) => {
    const k = Math.max(0, Math.min(width, Math.round(f * width)));
    return `[${'#'.repeat(k)}${'.'.repeat(width - k)}]`;
  };
  const done = state.ok + state.skipped + state.failed;
  const frac = state.total > 0 ? done / state.total : 1;
  const lines = [
    `batch ${bar(frac)} ${String(done).padStart(String(state.total).length)}/${state.total} sessions  ok ${state.ok}  skipped ${state.skipped}  failed ${state.failed}  ${state.elapsedS.toFixed(0)} s`,
  ];
  for (const w of state.workers) {
    if (w.name === null) {
      lines.push(`  worker ${w.worker}  ${' '.repeat(width + 2)}  idle`);
      continue;
    }
    const est = Number.isNaN(w.fraction) ? `${' '.repeat(width + 2)}     ` : `${bar(w.fraction)} ~${String(Math.floor(w.fraction * 100)).padStart(2)}%`;
    lines.push(`  worker ${w.worker}  ${est}  ${w.name}  ${w.stage} ${w.elapsedS.toFixed(1)} s`);
  }
  return lines;
}
