import { eventResponse } from '../../align/event-response';
import { rasterPsthFigure } from './raster-psth-figure';
import type { UnitFigure } from '../types';

/**
 * The "Event response" unit figure for screens, exports and the report:
 * raster + PSTH by condition around parameters.align.event, with the
 * parameters' window, bins, smoothing and band. null when the session has no
 * such event.
 */
export const rasterPsthUnitFigure: UnitFigure = {
  id: 'event-response',
  title: 'Event response',
  build(ctx, unitIndex) {
    const event = ctx.parameters.align.event;
    if (!ctx.recording.events.label.includes(event)) return null;
    return rasterPsthFigure(eventResponse(ctx.recording, ctx.parameters, { unitIndex, align: { event } }));
  },
};
