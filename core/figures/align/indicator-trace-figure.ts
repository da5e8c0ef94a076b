import type { AmplitudeFit } from '../../kernels/fit-amplitude-offset';
import type { SampleGrid } from '../../kernels/types';
import { BASE_LAYOUT, OKABE_ITO, type FigureSpec } from '../theme';

export interface IndicatorTraceInput {
  /** Who the prediction is for, e.g. "unit 12" or "population (48 units)". */
  readonly label: string;
  readonly kernelName: string;
  readonly grid: SampleGrid;
  readonly predicted: Float64Array;
  /** "dF/F" when the kernel's single-spike amplitude is known, else "single-spike peaks". */
  readonly predictedUnit: string;
  /** Measured trace on the same grid (resampleLinear), with the least-squares fit of the prediction to it. */
  readonly measured?: { readonly values: Float64Array; readonly fit: AmplitudeFit; readonly unit: string };
}

/**
 * Predicted indicator trace over time, and the measured trace when given. With
 * a measured trace the prediction is drawn scaled and shifted by the
 * least-squares fit (a x predicted + b) on the measured axis, and the legend
 * reports a, b and r. Plain Plotly JSON.
 */
export function indicatorTraceFigure(p: IndicatorTraceInput): FigureSpec {
  const t = Array.from({ length: p.grid.length }, (_, k) => p.grid.startS + k / p.grid.rateHz);
  const data: Record<string, unknown>[] = [];
  const m = p.measured;
  if (m) {
    data.push({ type: 'scattergl', mode: 'lines', name: `measured (${m.unit})`, x: t, y: Array.from(m.values), line: { color: OKABE_ITO.black, width: 1 } });
    const f = m.fit;
    const scaled = Array.from(p.predicted, (v) => f.amplitude * v + f.offset);
    data.push({
      type: 'scattergl',
      mode: 'lines',
      name: `predicted, ${p.kernelName} (a = ${fmt(f.amplitude)}, b = ${fmt(f.offset)}, r = ${fmt(f.r)})`,
      x: t,
      y: scaled,
      line: { color: OKABE_ITO.vermillion, width: 1.5 },
    });
  } else {
    data.push({ type: 'scattergl', mode: 'lines', name: `predicted, ${p.kernelName}`, x: t, y: Array.from(p.predicted), line: { color: OKABE_ITO.vermillion, width: 1.5 } });
  }
  return {
    data,
    layout: {
      ...BASE_LAYOUT,
      title: { text: `Predicted ${p.kernelName} signal: ${p.label}` },
      xaxis: { title: { text: 'Time (s)' } },
      yaxis: { title: { text: m ? m.unit : p.predictedUnit } },
    },
  };
}

function fmt(x: number): string {
  return Number.isFinite(x) ? String(Number(x.toPrecision(3))) : 'n/a';
}
