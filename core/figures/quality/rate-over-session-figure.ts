import { presenceRatio } from '../../quality/presence-ratio';
import { lightWindows } from '../../quality/light-windows';
import { driftSegments } from '../../quality/drift-segments';
import { rateDrift } from '../../quality/rate-drift';
import { BASE_LAYOUT, OKABE_ITO } from '../theme';
import type { UnitFigure } from '../types';

/**
 * Firing rate of a unit over the session: the rate in each presence bin
 * (quality.presenceBins equal bins, thin line) and in each drift segment
 * (quality.driftSegments, thick steps), so presence ratio and drift can be
 * seen, not only read. The segment rates leave out the light test windows
 * after pulses, as the rate_drift_cv column does.
 */
export const rateOverSessionFigure: UnitFigure = {
  id: 'quality-rate-over-session',
  title: 'Firing rate over the session',
  build({ recording, parameters }, i) {
    const [t0, t1] = recording.span;
    if (!(t1 > t0)) return null;
    const q = parameters.quality;
    const u = recording.units[i];
    const fine = rateDrift(u.spikeTimes, driftSegments(t0, t1, Math.max(2, q.presenceBins)));
    const light = lightWindows(recording.pulses.onset, parameters.light.windowStartMs, parameters.light.windowEndMs);
    const coarse = rateDrift(u.spikeTimes, driftSegments(t0, t1, Math.max(2, q.driftSegments), light));
    const pr = presenceRatio(u.spikeTimes, t0, t1, q.presenceBins, u.observedIntervals);
    const w = (t1 - t0) / coarse.ratesHz.length;
    const sx: number[] = [];
    const sy: (number | null)[] = [];
    coarse.ratesHz.forEach((r, k) => {
      sx.push((t0 + k * w) / 60, (t0 + (k + 1) * w) / 60);
      sy.push(Number.isNaN(r) ? null : r, Number.isNaN(r) ? null : r);
    });
    return {
      data: [
        { type: 'scatter', mode: 'lines', x: Array.from(fine.centresS, (t) => t / 60), y: Array.from(fine.ratesHz), name: `${fine.ratesHz.length} bins`, line: { color: OKABE_ITO.skyBlue, width: 1 } },
        { type: 'scatter', mode: 'lines', x: sx, y: sy, name: `${coarse.ratesHz.length} segments${light.startS.length ? ' (light windows left out)' : ''}`, line: { color: OKABE_ITO.blue, width: 3 } },
      ],
      layout: {
        ...BASE_LAYOUT,
        title: { text: `Rate over the session, unit ${u.id}<br><sup>presence ratio ${pr.toFixed(2)}, rate drift CV ${Number.isFinite(coarse.cv) ? coarse.cv.toFixed(2) : 'n/a'}</sup>` },
        xaxis: { title: { text: 'Time (min)' } },
        yaxis: { title: { text: 'Rate (Hz)' }, rangemode: 'tozero' },
      },
    };
  },
};
