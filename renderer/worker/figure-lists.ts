import { clusterAveragesFigure } from '../../core/figures/cluster-averages-figure';
import { indicatorUnitFigure } from '../../core/figures/indicator-unit-figure';
import { jumpAnswersFigure } from '../../core/figures/jump-answers-figure';
import { rampFitFigure } from '../../core/figures/ramp-fit-figure';
import { POPULATION_FIGURES, UNIT_FIGURES } from '../../core/figures/registry';
import type { PopulationFigure, UnitFigure } from '../../core/figures/types';

/** Unique by id, first wins (a figure later added to the registry is not drawn twice). */
function uniqueById<T extends { id: string }>(list: readonly T[]): T[] {
  const seen = new Set<string>();
  return list.filter((f) => !seen.has(f.id) && (seen.add(f.id), true));
}

/**
 * The figures of the Unit page: every figure of core's registry, then the
 * unit figures not (yet) registered there (ramp fit, jump answers, the
 * predicted indicator trace). The Unit page places each in its section by id.
 */
export const UNIT_FIGURE_LIST: readonly UnitFigure[] = uniqueById([...UNIT_FIGURES, rampFitFigure, jumpAnswersFigure, indicatorUnitFigure]);

/** The figures of the Population screen: core's registry, then the cluster averages. */
export const POPULATION_FIGURE_LIST: readonly PopulationFigure[] = uniqueById([...POPULATION_FIGURES, clusterAveragesFigure]);
