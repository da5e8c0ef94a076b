import { lightFollowingFigure } from '../../core/figures/light/light-following';
import { lightLatencyFigure } from '../../core/figures/light/light-latency';
import { lightRasterFigure } from '../../core/figures/light/light-raster';
import { lightWaveformFigure } from '../../core/figures/light/light-waveform';
import { indicatorUnitFigure } from '../../core/figures/indicator-unit-figure';
import { rasterPsthUnitFigure } from '../../core/figures/align/raster-psth-unit-figure';
import { POPULATION_FIGURES, UNIT_FIGURES } from '../../core/figures/registry';
import type { PopulationFigure, UnitFigure } from '../../core/figures/types';

/** Unique by id, first wins (a figure later added to the registry is not drawn twice). */
function uniqueById<T extends { id: string }>(list: readonly T[]): T[] {
  const seen = new Set<string>();
  return list.filter((f) => !seen.has(f.id) && (seen.add(f.id), true));
}

/**
 * The figures of the Unit page, in display order: light response, event
 * response, the predicted indicator trace, then every figure of core's registry (quality and what other
 * analyses register). The Unit page places each in its section by id.
 */
export const UNIT_FIGURE_LIST: readonly UnitFigure[] = uniqueById([
  lightRasterFigure,
  lightLatencyFigure,
  lightFollowingFigure,
  lightWaveformFigure,
  rasterPsthUnitFigure,
  indicatorUnitFigure,
  ...UNIT_FIGURES,
]);

/** The figures of the Population screen: core's registry. */
export const POPULATION_FIGURE_LIST: readonly PopulationFigure[] = uniqueById([...POPULATION_FIGURES]);
