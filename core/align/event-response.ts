import type { Parameters } from '../defaults';
import type { Recording } from '../model/types';
import { computePsth } from './compute-psth';
import { extractRaster } from './extract-raster';
import { groupTrials } from './group-trials';
import { orderTrials } from './order-trials';
import { selectAlignment, type AlignmentSpec } from './select-alignment';
import type { AlignmentSet, GroupBy, OrderBy, Psth, PsthOptions, Raster } from './types';

/** One group of an event response: its rows, raster (rows in display order) and PSTH. */
export interface ResponseGroup {
  readonly label: string;
  readonly rows: Int32Array;
  readonly raster: Raster;
  readonly psth: Psth;
}

export interface EventResponse {
  readonly unitId: string;
  /** Event label, or "pulses". */
  readonly source: string;
  readonly set: AlignmentSet;
  readonly groups: readonly ResponseGroup[];
  readonly options: PsthOptions;
}

/** What eventResponse needs beyond the recording; defaults from parameters.align. */
export interface EventResponseRequest {
  readonly unitIndex: number;
  readonly align: AlignmentSpec;
  readonly groupBy?: GroupBy;
  readonly orderBy?: OrderBy;
  readonly psth?: Partial<PsthOptions>;
}

/**
 * The raster and PSTH of one unit around one event label (or the pulses),
 * grouped and ordered: selectAlignment -> orderTrials -> groupTrials ->
 * extractRaster + computePsth per group (group g's bootstrap seeded seed + g).
 * The one pipeline behind the psth command and the raster/PSTH figure.
 * PSTH options not given come from parameters.align (DEFAULTS).
 */
export function eventResponse(recording: Recording, parameters: Parameters, req: EventResponseRequest): EventResponse {
  const unit = recording.units[req.unitIndex];
  if (!unit) throw new Error(`eventResponse: no unit at index ${req.unitIndex}`);
  const d = parameters.align;
  const options: PsthOptions = {
    windowStartS: d.windowStartS,
    windowStopS: d.windowStopS,
    binMs: d.binMs,
    smoothing: { kind: d.smoothing as 'none' | 'gaussian' | 'exponential' | 'boxcar', widthMs: d.smoothingWidthMs },
    band: d.band as 'sem' | 'bootstrap' | 'none',
    level: d.bandLevel,
    nBoot: d.bootstrapResamples,
    seed: d.seed,
    ...req.psth,
  };
  const set = selectAlignment(recording, req.align);
  const order = orderTrials(set, recording.trials, req.orderBy ?? { by: 'time' });
  const groupBy = req.groupBy ?? ({ by: d.groupBy } as GroupBy);
  const groups = groupTrials(set, recording.trials, groupBy, order).map((g, k) => {
    const times = Float64Array.from(g.rows, (r) => set.times[r]);
    return {
      label: g.label,
      rows: g.rows,
      raster: extractRaster(unit.spikeTimes, times, options.windowStartS, options.windowStopS),
      psth: computePsth(unit.spikeTimes, times, { ...options, seed: (options.seed ?? 1) + k }),
    };
  });
  return { unitId: unit.id, source: set.source, set, groups, options };
}
