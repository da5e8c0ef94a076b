/**
 * Reads a 1-D NWB TimeSeries (NWB 2.x schema core/nwb.base.yaml): sample
 * times from `timestamps` (s) or from `starting_time` (s) + its `rate`
 * attribute (Hz); values = data * `conversion` + `offset` (attributes of
 * `data`; defaults 1 and 0), in the series' `unit`.
 *
 * Multi-column data ([times, channels]) are reduced to the largest value of
 * each sample, with a note in `reduced` (a laser trace with one column per
 * fibre is on when any fibre is on).
 *
 * Errors (InputError naming the file and series): not a group with `data`;
 * neither timestamps nor starting_time + a positive rate; timestamps and
 * data of different lengths; non-numeric data.
 */
import { InputError } from '../../errors';
import type { Hdf5File } from './hdf5-access';
import { textAttr } from './text-attr';
import { toFloat64 } from './to-float64';

export interface TimeSeriesData {
  readonly path: string;
  readonly neurodataType: string;
  /** Sample times, s. */
  readonly times: Float64Array;
  /** Sampling rate, Hz, when the series gives starting_time + rate (undefined for timestamps). */
  readonly rateHz?: number;
  /** Values in `unit` (conversion and offset applied). */
  readonly values: Float64Array;
  readonly unit: string;
  readonly description: string;
  /** True when multi-column data were reduced to their per-sample maximum. */
  readonly reduced: boolean;
}

export function readTimeSeries(h5: Hdf5File, file: string, path: string): TimeSeriesData {
  const dataPath = `${path}/data`;
  if (h5.kind(path) !== 'group' || h5.kind(dataPath) !== 'dataset') {
    throw new InputError({ file, value: path, problem: 'there is no time series (a group with a data dataset) at this path', fix: `run "tagbench inspect ${file}" to list the series the file holds` });
  }
  const info = h5.info(dataPath);
  if (!['float', 'int', 'uint', 'bool'].includes(info.elementClass)) {
    throw new InputError({ file, column: dataPath, problem: `the series data are ${info.elementClass}, not numbers` });
  }
  const n = info.shape[0] ?? 1;
  const width = info.shape.slice(1).reduce((p, k) => p * k, 1);
  const raw = toFloat64(h5.read(dataPath), file, dataPath);
  let values: Float64Array;
  if (width === 1) values = raw;
  else {
    values = new Float64Array(n);
    for (let i = 0; i < n; i++) {
      let m = -Infinity;
      for (let j = 0; j < width; j++) m = Math.max(m, raw[i * width + j]);
      values[i] = m;
    }
  }
  const conversion = numAttr(h5, dataPath, 'conversion', 1);
  const offset = numAttr(h5, dataPath, 'offset', 0);
  if (conversion !== 1 || offset !== 0) for (let i = 0; i < n; i++) values[i] = values[i] * conversion + offset;

  let times: Float64Array;
  let rateHz: number | undefined;
  const tsPath = `${path}/timestamps`;
  const stPath = `${path}/starting_time`;
  if (h5.kind(tsPath) === 'dataset') {
    times = toFloat64(h5.read(tsPath), file, tsPath);
    if (times.length !== n) {
      throw new InputError({ file, column: tsPath, problem: `the series has ${times.length} timestamps but ${n} data samples`, fix: 'write one timestamp per sample' });
    }
  } else if (h5.kind(stPath) === 'dataset') {
    const t0 = toFloat64(h5.read(stPath), file, stPath)[0];
    const rate = numAttr(h5, stPath, 'rate', NaN);
    if (!(rate > 0) || !Number.isFinite(t0)) {
      throw new InputError({ file, column: stPath, value: `starting_time ${t0}, rate ${rate}`, problem: 'the series needs a finite starting_time and a positive rate attribute (Hz)' });
    }
    times = new Float64Array(n);
    for (let i = 0; i < n; i++) times[i] = t0 + i / rate;
    rateHz = rate;
  } else {
    throw new InputError({ file, value: path, problem: 'the series has neither timestamps nor starting_time', fix: 'write timestamps (s) or starting_time with a rate (Hz)' });
  }
  return {
    path,
    neurodataType: textAttr(h5, path, 'neurodata_type'),
    times,
    ...(rateHz !== undefined ? { rateHz } : {}),
    values,
    unit: textAttr(h5, dataPath, 'unit'),
    description: textAttr(h5, path, 'description'),
    reduced: width > 1,
  };
}

function numAttr(h5: Hdf5File, path: string, name: string, fallback: number): number {
  const v = h5.attr(path, name);
  if (typeof v === 'number') return v;
  if (typeof v === 'bigint') return Number(v);
  if (v && ArrayBuffer.isView(v) && (v as ArrayLike<number>).length) return Number((v as ArrayLike<number | bigint>)[0]);
  return fallback;
}
