import { clusterUnits } from '../../classify/cluster-units';
import { BASE_LAYOUT, GROUP_COLORS, type FigureSpec } from '../theme';
import type { FigureContext, PopulationFigure } from '../types';

/**
 * "Response clusters": the class-average z-scored, trial-averaged responses
 * of each k-means cluster (mean +- SEM band), one panel per segment (ramp
 * window before reward, then each jump kind), with the cluster sizes and the
 * mean silhouette in the legend/title. Null when no clustering was possible.
 */
export const clusterAveragesFigure: PopulationFigure = {
  id: 'cluster-averages',
  title: 'Response clusters',
  build(ctx: FigureContext): FigureSpec | null {
    const c = clusterUnits(ctx.recording, ctx.parameters);
    if (c.k === 0) return null;
    const nSeg = c.segments.length;
    const gap = 0.04;
    const width = (1 - gap * (nSeg - 1)) / nSeg;
    const data: Record<string, unknown>[] = [];
    const layout: Record<string, unknown> = {
      ...BASE_LAYOUT,
      title: {
        text: `Response clusters: k = ${c.k}, ${c.unitsUsed} units; mean silhouette ${c.silhouetteByK.find((s) => s.k === c.k)!.mean.toFixed(2)} (${c.structure === 'none' ? 'no substantial structure' : `${c.structure} structure`})`,
      },
      yaxis: { title: { text: 'z-scored rate' } },
    };
    c.segments.forEach((seg, s) => {
      const ax = s === 0 ? '' : String(s + 1);
      layout[`xaxis${ax}`] = { domain: [s * (width + gap), s * (width + gap) + width], title: { text: `time from ${seg.name} (s)` }, anchor: `y${ax}` };
      if (s > 0) layout[`yaxis${ax}`] = { anchor: `x${ax}`, matches: 'y', showticklabels: false };
      const x = Array.from({ length: seg.nBins }, (_, b) => seg.startS + (b + 0.5) * seg.binS);
      c.classes.forEach((cl, i) => {
        const color = GROUP_COLORS[i % GROUP_COLORS.length];
        const m = cl.mean.slice(seg.offset, seg.offset + seg.nBins);
        const e = cl.sem.slice(seg.offset, seg.offset + seg.nBins).map((v) => (v === v ? v : 0));
        data.push({
          type: 'scatter', mode: 'lines', x: [...x, ...x.slice().reverse()],
          y: [...m.map((v, b) => v + e[b]), ...m.map((v, b) => v - e[b]).reverse()],
          fill: 'toself', fillcolor: color, opacity: 0.2, line: { width: 0 }, hoverinfo: 'skip', showlegend: false,
          xaxis: `x${ax}`, yaxis: `y${ax}`,
        });
        data.push({
          type: 'scatter', mode: 'lines', name: `cluster ${cl.cluster} (${cl.size} units)`, legendgroup: `c${cl.cluster}`,
          showlegend: s === 0, x, y: m, line: { color, width: 2 }, xaxis: `x${ax}`, yaxis: `y${ax}`,
        });
      });
    });
    return { data, layout };
  },
};
