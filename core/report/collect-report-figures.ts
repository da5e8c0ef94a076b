import { POPULATION_FIGURES, UNIT_FIGURES } from '../figures/registry';
import type { FigureSpec } from '../figures/theme';
import type { FigureContext, PopulationFigure, UnitFigure } from '../figures/types';

/** A built figure, ready to embed. */
export interface BuiltFigure {
  readonly id: string;
  readonly title: string;
  readonly spec: FigureSpec;
}

/**
 * Builds every registered figure that applies: the population figures once,
 * the unit figures for each unit (units[i] belongs to the table's row i).
 * Figures whose build() returns null are left out.
 */
export function collectReportFigures(
  ctx: FigureContext,
  unitFigures: readonly UnitFigure[] = UNIT_FIGURES,
  populationFigures: readonly PopulationFigure[] = POPULATION_FIGURES,
): { population: BuiltFigure[]; units: BuiltFigure[][] } {
  const population: BuiltFigure[] = [];
  for (const f of populationFigures) {
    const spec = f.build(ctx);
    if (spec) population.push({ id: f.id, title: f.title, spec });
  }
  const units = ctx.recording.units.map((_, i) => {
    const out: BuiltFigure[] = [];
    for (const f of unitFigures) {
      const spec = f.build(ctx, i);
      if (spec) out.push({ id: f.id, title: f.title, spec });
    }
    return out;
  });
  return { population, units };
}
