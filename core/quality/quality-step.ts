import type { AnalysisStep } from '../pipeline/types';
import type { Column } from '../table/types';
import { QUALITY_VERDICTS, qualityVerdict } from './quality-verdict';
import { driftSegments } from './drift-segments';
import { lightWindows } from './light-windows';
import { unitQuality } from './unit-quality';

/**
 * The quality analysis of `run`: one row of metrics and a screening verdict
 * per unit (columns below, names carry units). The summary counts units per
 * verdict and echoes the thresholds used.
 */
export const qualityStep: AnalysisStep = {
  name: 'quality',
  selfContained: true,
  run({ recording, parameters }) {
    const q = parameters.quality;
    const n = recording.units.length;
    const cols = {
      isiCount: new Float64Array(n),
      isiFrac: new Float64Array(n),
      cont: new Float64Array(n),
      presence: new Float64Array(n),
      lv: new Float64Array(n),
      cv2: new Float64Array(n),
      driftCv: new Float64Array(n),
      slope: new Float64Array(n),
      ttp: new Float64Array(n),
      hw: new Float64Array(n),
    };
    const verdicts: string[] = [];
    const reasons: string[] = [];
    const counts: Record<string, number> = Object.fromEntries(QUALITY_VERDICTS.map((v) => [v, 0]));
    let atLeastHalf = 0;
    // light-evoked spikes (the light test window after each pulse) do not count as drift
    const light = lightWindows(recording.pulses.onset, parameters.light.windowStartMs, parameters.light.windowEndMs);
    const segments = driftSegments(recording.span[0], recording.span[1], q.driftSegments, light);
    recording.units.forEach((u, i) => {
      const m = unitQuality(u.spikeTimes, recording.span, q, u.waveformMean, recording.waveformSampleRateHz, segments, u.observedIntervals);
      cols.isiCount[i] = m.isiViolationCount;
      cols.isiFrac[i] = m.isiViolationFraction;
      cols.cont[i] = m.contamination;
      cols.presence[i] = m.presenceRatio;
      cols.lv[i] = m.lv;
      cols.cv2[i] = m.cv2;
      cols.driftCv[i] = m.rateDriftCv;
      cols.slope[i] = m.rateSlopeHzPerMin;
      cols.ttp[i] = m.troughToPeakMs;
      cols.hw[i] = m.halfWidthMs;
      if (m.contaminationAtLeastHalf) atLeastHalf++;
      const v = qualityVerdict(m, q);
      verdicts.push(v.verdict);
      reasons.push(v.reason);
      counts[v.verdict]++;
    });
    const num = (name: string, values: Float64Array, description: string, digits = 4): Column => ({ name, kind: 'number', values, digits, description });
    return {
      columns: [
        num('isi_violations', cols.isiCount, `Number of ISIs shorter than the refractory period (${q.refractoryMs} ms)`),
        num('isi_violation_fraction', cols.isiFrac, 'Violating ISIs / all ISIs'),
        num('contamination', cols.cont, 'Contaminating fraction, Hill, Mehta & Kleinfeld (2011); empty when undefined (>= 0.5, see quality_reason)'),
        num('presence_ratio', cols.presence, `Fraction of ${q.presenceBins} equal time bins holding a spike (only bins the unit was observed in, when the inputs give observation intervals)`),
        num('lv', cols.lv, 'Local variation of ISIs, Shinomoto et al. (2003); 1 for Poisson'),
        num('cv2', cols.cv2, 'CV2 of adjacent ISIs, Holt et al. (1996); 1 for Poisson'),
        num('rate_drift_cv', cols.driftCv, `Coefficient of variation of the rate over ${q.driftSegments} equal segments of the span (light test windows after pulses left out)`),
        num('rate_slope_hz_per_min', cols.slope, 'Least-squares slope of segment rates over time, Hz per minute'),
        num('trough_to_peak_ms', cols.ttp, 'Mean waveform trough-to-peak duration, ms (empty without waveforms)'),
        num('half_width_ms', cols.hw, 'Mean waveform trough width at half depth, ms (empty without waveforms)'),
        { name: 'quality', kind: 'string', values: verdicts, description: 'Quality screen: pass or review (a screen, not a proof)' },
        { name: 'quality_reason', kind: 'string', values: reasons, description: 'Why the quality screen gave its verdict' },
      ],
      summary: {
        counts,
        contaminationAtLeastHalf: atLeastHalf,
        thresholds: {
          minSpikes: q.minSpikes,
          maxContamination: q.maxContamination,
          minPresenceRatio: q.minPresenceRatio,
          maxRateDriftCv: q.maxRateDriftCv,
        },
        refractoryMs: q.refractoryMs,
        censoredMs: q.censoredMs,
      },
    };
  },
};
