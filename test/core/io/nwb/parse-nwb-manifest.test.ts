// The `nwb` section of session.json (our own format, documented in README
// "NWB files"); paths follow HDF5 / NWB naming (absolute, "/" separated).
import { describe, expect, it } from 'vitest';
import { isInputError } from '../../../../core/errors';
import { parseNwbManifest } from '../../../../core/io/nwb/parse-nwb-manifest';

function message(section: unknown): string {
  try {
    parseNwbManifest(section, 'session.json');
  } catch (e) {
    expect(isInputError(e)).toBe(true);
    return (e as Error).message;
  }
  throw new Error('expected an InputError');
}

describe('parseNwbManifest', () => {
  it('reads every key, normalising paths to absolute', () => {
    const m = parseNwbManifest({
      file: 'rec.nwb',
      units: 'processing/ecephys/units',
      trials: { table: '/intervals/trials', condition_column: 'block' },
      pulses: { table: '/intervals/laser', power_column: 'p', power_unit: 'W', train_column: 'tr', frequency_column: 'hz' },
      events: [
        { table: '/intervals/events', label_column: 'name', time_column: 'timestamp', kind_column: 'kind', trial_column: 'trial' },
        { series: '/acquisition/lick', label: 'lick', threshold: 2.5 },
        { trials_column: 'reward_time', label: 'reward' },
      ],
      waveform_sample_rate_hz: 30000,
    });
    expect(m).toEqual({
      file: 'rec.nwb',
      units: '/processing/ecephys/units',
      trials: { table: '/intervals/trials', conditionColumn: 'block' },
      pulses: { table: '/intervals/laser', powerColumn: 'p', powerUnit: 'W', trainColumn: 'tr', frequencyColumn: 'hz' },
      events: [
        { table: '/intervals/events', labelColumn: 'name', timeColumn: 'timestamp', kindColumn: 'kind', trialColumn: 'trial' },
        { series: '/acquisition/lick', label: 'lick', threshold: 2.5 },
        { trialsColumn: 'reward_time', label: 'reward' },
      ],
      waveformSampleRateHz: 30000,
    });
  });
  it('takes a trials path as a string, false to turn roles off, and nothing as {}', () => {
    expect(parseNwbManifest({ trials: '/intervals/trials', pulses: false, events: false })).toEqual({ trials: { table: '/intervals/trials' }, pulses: false, events: false });
    expect(parseNwbManifest(undefined)).toEqual({});
    expect(parseNwbManifest({ pulses: { series: '/stimulus/presentation/laser', threshold_mw: 1 } })).toEqual({ pulses: { series: '/stimulus/presentation/laser', highThresholdMw: 1, lowThresholdMw: 1 } });
    expect(parseNwbManifest({ pulses: { series: '/l', high_threshold_mw: 3, low_threshold_mw: 2, min_width_ms: 1, train_max_ipi_s: 0.2 } })).toEqual({
      pulses: { series: '/l', highThresholdMw: 3, lowThresholdMw: 2, minWidthMs: 1, trainMaxIpiS: 0.2 },
    });
  });
  it.each([
    [{ unit: '/units' }, 'session.json, column "nwb.unit": unknown key'],
    [{ pulses: { table: '/a', series: '/b' } }, 'either "table" or "series"'],
    [{ pulses: { table: '/a', power_unit: 'kW' } }, 'must be "mW" or "W"'],
    [{ pulses: { series: '/a', threshold_mw: -1 } }, 'must be a positive number'],
    [{ pulses: { series: '/a', high_threshold_mw: 3 } }, 'give both high_threshold_mw and low_threshold_mw'],
    [{ pulses: { series: '/a', high_threshold_mw: 2, low_threshold_mw: 3 } }, 'must not exceed high_threshold_mw'],
    [{ pulses: { series: '/a', threshold_mw: 2, low_threshold_mw: 3 } }, 'not both'],
    [{ pulses: {} }, 'needs "table"'],
    [{ events: { table: '/a' } }, 'must be a list'],
    [{ events: [{ label: 'x' }] }, 'nwb.events[0]'],
    [{ waveform_sample_rate_hz: '30k' }, 'must be a number'],
    [[1, 2], 'must be an object'],
  ])('rejects %j', (section, fragment) => {
    expect(message(section)).toContain(fragment);
  });
});
