import { POPULATION_FIGURES, UNIT_FIGURES } from '../../core/figures/registry';
import type { PopulationFigure, UnitFigure } from '../../core/figures/types';

/**
 * The figures of the Unit page: every figure of core's registry, in its
 * display order (light response, event response, ramps and jumps, indicator
 * model, quality). The Unit page places each in its section by id.
 */
export const UNIT_FIGURE_LIST: readonly UnitFigure[] = UNIT_FIGURES;

/** The figures of the Population screen: core's registry. */
export const POPULATION_FIGURE_LIST: readonly PopulationFigure[] = POPULATION_FIGURES;
