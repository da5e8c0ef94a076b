import { classifyJumps } from '../../classify/classify-jumps';
import { columnSafe } from '../../classify/column-safe';
import { BASE_LAYOUT, GROUP_COLORS, OKABE_ITO, type FigureSpec } from '../theme';
import type { FigureContext, UnitFigure } from '../types';

/**
 * "Jump answers": for each jump kind, the unit's event-averaged PSTH minus
 * the matched control (reference trials at the same time-in-trial), Hz, from
 * the pre window to the end of the late window, with the pre, answer and
 * late windows shaded and the verdict and shape in the legend. Drawn on
 * ~50 ms bins (sums of the analysis bins of psthBinS). Null when the
 * session has no jump events. Recomputes with classifyJumps on this unit
 * alone (the PSTH does not depend on other units; the verdict is read from
 * the table, where BH ran across all units).
 */
export const jumpAnswersFigure: UnitFigure = {
  id: 'jump-answers',
  title: 'Jump answers',
  build(ctx: FigureContext, unitIndex: number): FigureSpec | null {
    const p = ctx.parameters.jump;
    const one = { ...ctx.recording, units: [ctx.recording.units[unitIndex]] };
    const r = classifyJumps(one, p);
    if (r.kinds.length === 0) return null;
    const text = (name: string) => {
      const c = ctx.table.columns.find((x) => x.name === name);
      return c && c.kind === 'string' ? c.values[unitIndex] : '';
    };
    // Drawn on bins of about 50 ms (whole multiples of the analysis bin): 10 ms bins are too noisy to read.
    const factor = Math.max(1, Math.round(0.05 / r.psthBinS));
    const showBinS = factor * r.psthBinS;
    const nShow = Math.floor(r.kinds[0].units[0].psth.length / factor);
    const data: Record<string, unknown>[] = r.kinds.map((k, i) => {
      const u = k.units[0];
      const K = columnSafe(k.kind);
      const verdict = text(`jump_${K}`);
      const shape = text(`jump_${K}_shape`);
      return {
        type: 'scatter',
        mode: 'lines',
        name: `${k.kind || 'all'} (${k.nEvents} jumps): ${verdict || 'not classified'}${shape ? `, ${shape}` : ''}`,
        x: Array.from({ length: nShow }, (_, j) => r.psthStartS + (j + 0.5) * showBinS),
        y: Array.from({ length: nShow }, (_, j) => {
          let s = 0;
          for (let b = j * factor; b < (j + 1) * factor; b++) s += u.psth[b];
          return s / factor;
        }),
        line: { color: GROUP_COLORS[i % GROUP_COLORS.length], width: 2, shape: 'hvh' },
      };
    });
    const band = (a: number, b: number, color: string) => ({
      type: 'rect', xref: 'x', yref: 'paper', x0: a, x1: b, y0: 0, y1: 1, fillcolor: color, opacity: 0.12, line: { width: 0 }, layer: 'below',
    });
    return {
      data,
      layout: {
        ...BASE_LAYOUT,
        title: { text: `Unit ${ctx.recording.units[unitIndex].id}: answers to "${p.event}" (control-subtracted)` },
        xaxis: { title: { text: `time from ${p.event} (s)` } },
        yaxis: { title: { text: 'rate change vs matched control (Hz)' }, zeroline: true },
        shapes: [
          band(p.preStartS, p.preEndS, '#7f7f7f'),
          band(p.postStartS, p.postEndS, OKABE_ITO.orange),
          band(p.lateStartS, p.lateEndS, OKABE_ITO.skyBlue),
        ],
        annotations: [
          { x: (p.preStartS + p.preEndS) / 2, y: 1, yref: 'paper', text: 'pre', showarrow: false, yanchor: 'bottom' },
          { x: (p.postStartS + p.postEndS) / 2, y: 1, yref: 'paper', text: 'answer', showarrow: false, yanchor: 'bottom' },
          { x: (p.lateStartS + p.lateEndS) / 2, y: 1, yref: 'paper', text: 'late', showarrow: false, yanchor: 'bottom' },
        ],
      },
    };
  },
};
