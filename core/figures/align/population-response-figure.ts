import { populationMatrix } from '../../align/population-matrix';
import { selectAlignment } from '../../align/select-alignment';
import type { Smoothing } from '../../align/types';
import { BASE_LAYOUT } from '../theme';
import type { PopulationFigure } from '../types';

/** z-scores beyond this are drawn at the end of the colour scale. */
const Z_CAP = 5;

/**
 * Population heatmap of event responses: one row per unit, the unit's PSTH
 * around parameters.align.event (all trials; window, bins and smoothing from
 * the parameters) as a z-score against its own first second of the window
 * (or the part before the event, when shorter), rows sorted by the time of
 * their largest |z| so sequences and ramps show as diagonals and bands.
 * Diverging colour scale RdBu reversed (red up, blue down; both ends
 * distinguishable for common colour-vision deficiencies), capped at +-5.
 * Units whose baseline is flat (silent) are drawn empty. null without the
 * event or units.
 */
export const populationResponseFigure: PopulationFigure = {
  id: 'population-event-response',
  title: 'Event response, all units',
  build({ recording, parameters }) {
    const d = parameters.align;
    const set = selectAlignment(recording, { event: d.event });
    if (set.times.length === 0 || recording.units.length === 0) return null;
    const baseStop = Math.min(d.windowStartS + 1, Math.max(d.windowStartS + (d.binMs / 1000) * 2, 0));
    const m = populationMatrix(
      recording.units.map((u) => u.spikeTimes),
      set.times,
      {
        windowStartS: d.windowStartS,
        windowStopS: d.windowStopS,
        binMs: d.binMs,
        smoothing: { kind: d.smoothing as Smoothing['kind'], widthMs: d.smoothingWidthMs },
        normalise: 'zscore',
        baselineStartS: d.windowStartS,
        baselineStopS: baseStop,
      },
    );
    const peakAt = Array.from({ length: m.rows }, (_, u) => {
      let best = -1;
      let at = Infinity;
      for (let j = 0; j < m.cols; j++) {
        const v = Math.abs(m.values[u * m.cols + j]);
        if (v > best) {
          best = v;
          at = j;
        }
      }
      return best >= 0 ? at : Infinity;
    });
    const order = Array.from({ length: m.rows }, (_, u) => u).sort((a, b) => peakAt[a] - peakAt[b] || a - b);
    const z = order.map((u) => Array.from(m.values.subarray(u * m.cols, (u + 1) * m.cols), (v) => (Number.isFinite(v) ? Math.max(-Z_CAP, Math.min(Z_CAP, v)) : null)));
    return {
      data: [
        {
          type: 'heatmap',
          x: Array.from(m.binCenterS),
          y: order.map((u) => `unit ${recording.units[u].id}`),
          z,
          zmin: -Z_CAP,
          zmax: Z_CAP,
          zmid: 0,
          colorscale: 'RdBu',
          reversescale: true,
          colorbar: { title: { text: 'z (baseline)' } },
          hovertemplate: '%{y}, %{x:.2f} s: z = %{z:.2f}<extra></extra>',
        },
      ],
      layout: {
        ...BASE_LAYOUT,
        title: { text: `Responses to ${d.event}, ${set.times.length} events (z-score vs [${d.windowStartS}, ${baseStop}) s; sorted by peak time)` },
        showlegend: false,
        xaxis: { title: { text: `Time from ${d.event} (s)` } },
        yaxis: { autorange: 'reversed', type: 'category', showticklabels: recording.units.length <= 60 },
        shapes: [{ type: 'line', xref: 'x', yref: 'paper', x0: 0, x1: 0, y0: 0, y1: 1, line: { color: '#222', width: 1, dash: 'dot' } }],
        height: Math.min(1200, 200 + 12 * recording.units.length),
      },
    };
  },
};
