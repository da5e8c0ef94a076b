import { driftSegments } from '../../quality/drift-segments';
import { rateDrift } from '../../quality/rate-drift';
import { BASE_LAYOUT } from '../theme';
import type { PopulationFigure } from '../types';

/**
 * Population heatmap of firing rate over the session: one row per unit (table
 * order), quality.presenceBins equal time bins, each row divided by the
 * unit's mean rate (1 = its average; 0 = silent), capped at 3 so one burst
 * does not wash out the rest. Colour scale Viridis (perceptually uniform and
 * colour-blind safe). Drift and units that appear or vanish show as bands.
 */
export const rateHeatmapFigure: PopulationFigure = {
  id: 'population-rate-heatmap',
  title: 'Firing rate over the session, all units',
  build({ recording, parameters }) {
    const [t0, t1] = recording.span;
    if (!(t1 > t0) || recording.units.length === 0) return null;
    const bins = Math.max(2, parameters.quality.presenceBins);
    let x: number[] = [];
    const z: (number | null)[][] = [];
    const segments = driftSegments(t0, t1, bins);
    for (const u of recording.units) {
      const d = rateDrift(u.spikeTimes, segments);
      if (x.length === 0) x = Array.from(d.centresS, (t) => t / 60);
      let mean = 0;
      for (const r of d.ratesHz) mean += r / d.ratesHz.length;
      z.push(Array.from(d.ratesHz, (r) => (mean > 0 ? Math.min(3, r / mean) : null)));
    }
    return {
      data: [
        {
          type: 'heatmap',
          x,
          y: recording.units.map((u) => `unit ${u.id}`),
          z,
          zmin: 0,
          zmax: 3,
          colorscale: 'Viridis',
          colorbar: { title: { text: 'rate / mean' } },
          hovertemplate: '%{y}, %{x:.1f} min: %{z:.2f} x mean<extra></extra>',
        },
      ],
      layout: {
        ...BASE_LAYOUT,
        title: { text: 'Firing rate over the session (each unit relative to its mean)' },
        showlegend: false,
        xaxis: { title: { text: 'Time (min)' } },
        yaxis: { autorange: 'reversed', type: 'category', showticklabels: recording.units.length <= 60 },
        height: Math.min(1200, 200 + 12 * recording.units.length),
      },
    };
  },
};
