import { populationResponseFigure } from './align/population-response-figure';
import { rasterPsthUnitFigure } from './align/raster-psth-unit-figure';
import { autocorrelogramFigure } from './quality/autocorrelogram-figure';
import { isiHistogramFigure } from './quality/isi-histogram-figure';
import { rateHeatmapFigure } from './quality/rate-heatmap-figure';
import { rateOverSessionFigure } from './quality/rate-over-session-figure';
import { verdictCountsFigure } from './quality/verdict-counts-figure';
import { waveformFigure } from './quality/waveform-figure';
import { lightFollowingFigure } from './light/light-following';
import { lightLatencyFigure } from './light/light-latency';
import { lightRasterFigure } from './light/light-raster';
import { lightWaveformFigure } from './light/light-waveform';
import { indicatorUnitFigure } from './indicator-unit-figure';
import type { PopulationFigure, UnitFigure } from './types';
import { rampFitFigure } from './classify/ramp-fit-figure';
import { jumpAnswersFigure } from './classify/jump-answers-figure';
import { clusterAveragesFigure } from './classify/cluster-averages-figure';

/**
 * Every figure the app, the exports and the HTML report can draw, in display
 * order. To add one: write a UnitFigure or PopulationFigure (pure build(),
 * plain Plotly JSON, null when it does not apply) in core/figures/<area>/ and
 * add a line to the list of your area here. Ids must be unique
 * (test/core/figures/registry.test.ts checks).
 */
export const UNIT_FIGURES: readonly UnitFigure[] = [
  // light identification
  lightRasterFigure,
  lightLatencyFigure,
  lightFollowingFigure,
  lightWaveformFigure,
  // event response
  rasterPsthUnitFigure,
  // ramps and jumps
  rampFitFigure,
  jumpAnswersFigure,
  // indicator model
  indicatorUnitFigure,
  // quality
  rateOverSessionFigure,
  autocorrelogramFigure,
  isiHistogramFigure,
  waveformFigure,
];

export const POPULATION_FIGURES: readonly PopulationFigure[] = [
  // quality and curation
  verdictCountsFigure,
  rateHeatmapFigure,
  // event response
  populationResponseFigure,
  // response clusters
  clusterAveragesFigure,
];
