import type { EventResponse } from '../../align/event-response';
import { BASE_LAYOUT, GROUP_COLORS, type FigureSpec } from '../theme';

/**
 * Raster (top) and PSTH (bottom) of one unit around one event, one colour per
 * trial group (GROUP_COLORS, Okabe & Ito), sharing the time axis. Raster rows
 * stack the groups in order, each group's rows in display order; ticks are
 * vertical line markers. PSTH: mean rate with its band (SEM or bootstrap) as a
 * filled area; a dotted line marks the event. Plain Plotly JSON (no plotly
 * import); numbers as plain arrays so the spec serialises as JSON.
 */
export function rasterPsthFigure(r: EventResponse): FigureSpec {
  const data: Record<string, unknown>[] = [];
  let row = 0;
  r.groups.forEach((g, k) => {
    const color = GROUP_COLORS[k % GROUP_COLORS.length];
    const x: number[] = [];
    const y: number[] = [];
    for (let q = 0; q < g.raster.rows; q++) {
      for (let i = g.raster.offsets[q]; i < g.raster.offsets[q + 1]; i++) {
        x.push(g.raster.times[i]);
        y.push(row + q);
      }
    }
    row += g.raster.rows;
    data.push({
      type: 'scattergl',
      mode: 'markers',
      name: `${g.label} (n = ${g.raster.rows})`,
      legendgroup: g.label,
      x,
      y,
      xaxis: 'x',
      yaxis: 'y2',
      marker: { symbol: 'line-ns-open', size: 5, color, line: { width: 1, color } },
      hoverinfo: 'x+y',
    });
  });
  const bandName = (b: string) => (b === 'bootstrap' ? 'bootstrap band' : b === 'sem' ? '± SEM' : '');
  r.groups.forEach((g, k) => {
    const color = GROUP_COLORS[k % GROUP_COLORS.length];
    const x = Array.from(g.psth.binCenterS);
    if (g.psth.band !== 'none') {
      data.push({ type: 'scatter', mode: 'lines', x, y: Array.from(g.psth.upperHz), line: { width: 0, color }, showlegend: false, legendgroup: g.label, hoverinfo: 'skip', xaxis: 'x', yaxis: 'y' });
      data.push({
        type: 'scatter',
        mode: 'lines',
        x,
        y: Array.from(g.psth.lowerHz),
        line: { width: 0, color },
        fill: 'tonexty',
        fillcolor: `${color}33`,
        name: `${g.label} ${bandName(g.psth.band)}`,
        showlegend: false,
        legendgroup: g.label,
        hoverinfo: 'skip',
        xaxis: 'x',
        yaxis: 'y',
      });
    }
    data.push({ type: 'scatter', mode: 'lines', name: `${g.label} PSTH`, showlegend: false, legendgroup: g.label, x, y: Array.from(g.psth.rateHz), line: { color, width: 2 }, xaxis: 'x', yaxis: 'y' });
  });
  const o = r.options;
  const smooth = o.smoothing && o.smoothing.kind !== 'none' ? `, ${o.smoothing.kind} ${o.smoothing.widthMs} ms` : '';
  const band = r.groups[0]?.psth.band ?? 'none';
  return {
    data,
    layout: {
      ...BASE_LAYOUT,
      title: { text: `Unit ${r.unitId}: ${r.source === 'pulses' ? 'laser pulses' : r.source}` },
      xaxis: { title: { text: `Time from ${r.source === 'pulses' ? 'pulse onset' : r.source} (s)` }, range: [o.windowStartS, o.windowStopS], zeroline: false, anchor: 'y' },
      yaxis: { title: { text: 'Rate (Hz)' }, domain: [0, 0.38], rangemode: 'tozero' },
      yaxis2: { title: { text: 'Trial' }, domain: [0.45, 1], autorange: 'reversed', showgrid: false, zeroline: false },
      shapes: [{ type: 'line', xref: 'x', yref: 'paper', x0: 0, x1: 0, y0: 0, y1: 1, line: { color: '#555', width: 1, dash: 'dot' } }],
      annotations: [
        {
          xref: 'paper',
          yref: 'paper',
          x: 1,
          y: 0.4,
          xanchor: 'right',
          yanchor: 'bottom',
          showarrow: false,
          font: { size: 10, color: '#555' },
          text: `bins ${o.binMs} ms${smooth}; band: ${band === 'bootstrap' ? `${Math.round(100 * (o.level ?? 0.95))} % trial bootstrap` : band === 'sem' ? '± 1 SEM' : 'none'}`,
        },
      ],
    },
  };
}
