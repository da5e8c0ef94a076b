import { readFileSync } from 'node:fs';
import { basename } from 'node:path';
import { InputError } from '../../errors';
import type { ImportResult } from '../../io/import-result';
import { eventLockedTrace } from '../../kernels/event-locked-trace';
import { fitAmplitudeOffset, type AmplitudeFit } from '../../kernels/fit-amplitude-offset';
import { gridSearchKernel } from '../../kernels/grid-search-kernel';
import { hillSaturation } from '../../kernels/hill-saturation';
import { findKernelEntry, KERNEL_LIBRARY } from '../../kernels/kernel-library';
import { predictTrains } from '../../kernels/predict-trains';
import { readSeries } from '../../kernels/read-series';
import { resampleLinear } from '../../kernels/resample-linear';
import type { Kernel, SampleGrid } from '../../kernels/types';
import { resolveParameters } from '../../resolve-parameters';
import { formatNumber, formatTimeS } from '../../table/format-number';
import { writeOutputFile } from '../write-output-file';
import { parseCliArgs } from '../parse-cli-args';
import { numberOption, rangeOption } from './option-values';
import type { Command } from './types';

const NAME = 'predict';
const VALUED = ['--kernel', '--kernel-file', '--kernel-rate', '--amplitude', '--unit', '--rate', '--window', '--hill', '--measured', '--measured-rate', '--measured-start', '--measured-column', '--event', '--event-window', '--aligned-out', '--out'];
const MAX_SAMPLES = 50_000_000;

const USAGE = [
  'Usage: tagbench predict <session-dir|file.nwb> --kernel NAME [options] --out trace.csv',
  '',
  'Convolves spike trains with a fluorescence-indicator kernel into a predicted',
  'dF/F trace (exact recursive filtering for exponential kernels), optionally',
  'compared with a measured photometry or imaging trace.',
  '',
  `  --kernel NAME        library kernel: ${KERNEL_LIBRARY.map((e) => e.name).join(', ')}`,
  '                       or double:RISE_MS,DECAY_MS (difference of exponentials), alpha:TAU_MS',
  '  --kernel-file FILE   sampled kernel (.csv with a "value" column, or 1-D .npy), with --kernel-rate HZ',
  '                       unless the CSV has a "time" column',
  '  --amplitude DFF      single-spike peak dF/F (default: the library value, else 1 = units of one spike)',
  '  --unit U             unit id, "all" (one column per unit) or "population" (the mean; default)',
  '  --rate HZ            sample rate of the prediction (default 30)',
  '  --window a,b         time span to predict, s (default: the recording span, or the measured trace)',
  '  --hill N,HALF,MAX    Hill saturation y = MAX x^N / (x^N + HALF^N) (illustrative unless fitted)',
  '  --measured FILE      measured trace: .csv with "time" (s) and "value" columns, or .npy',
  '                       (N x 2 time,value; or 1-D with --measured-rate HZ [--measured-start S]);',
  '                       --measured-column NAME picks the value column',
  '  --search             with --measured: grid search of rise/decay constants (x0.25 .. x4 of the kernel)',
  '  --event LABEL        also write event-locked averages of the prediction (and the measured trace)',
  '                       around every event with this label to --aligned-out FILE.csv',
  '                       (window --event-window a,b in s, default -3,2): offset_s, n, predicted_mean,',
  '                       predicted_sem[, measured_mean, measured_sem, n_measured]',
  '  --out FILE.csv       output: time_s, predicted columns (and measured, predicted_fitted)',
  '',
  'Library constants come from published half-rise / time-to-peak / half-decay values;',
  'see the README table for sources and which values are marked "from memory".',
].join('\n');

/**
 * `tagbench predict`: predicted indicator traces from spike trains, and the
 * least-squares comparison with a measured trace. `load` opens the session
 * (the CLI passes loadSession; tests pass an in-memory loader).
 */
export function createPredictCommand(load: (path: string) => Promise<ImportResult>): Command {
  return {
    name: NAME,
    summary: 'Predicted dF/F of units or the population through an indicator kernel, compared with a measured trace',
    usage: USAGE,
    async run(argv, io) {
      const a = parseCliArgs(argv, NAME, VALUED, ['--help', '-h', '--search']);
      if (a.flags.has('--help') || a.flags.has('-h')) {
        io.stdout(`${USAGE}\n`);
        return 0;
      }
      const where = `tagbench ${NAME}`;
      const opt = (k: string): string | undefined => a.options[k];
      if (a.positionals.length !== 1) throw new InputError({ file: where, problem: 'expects one session folder or .nwb file', fix: 'run "tagbench predict <session> --kernel jGCaMP8m --out trace.csv"' });
      const out = opt('--out');
      if (!out || !/\.csv$/i.test(out)) throw new InputError({ file: where, column: '--out', value: out ?? '', problem: 'give the output file, ending in .csv' });
      if (opt('--kernel') && opt('--kernel-file')) throw new InputError({ file: where, problem: 'give either --kernel or --kernel-file, not both' });
      const rate = opt('--rate') ? numberOption(opt('--rate')!, '--rate', NAME) : undefined;
      if (rate !== undefined && !(rate > 0)) throw new InputError({ file: where, column: '--rate', value: opt('--rate')!, problem: 'the sample rate must be positive (Hz)' });
      if (a.flags.has('--search') && !opt('--measured')) throw new InputError({ file: where, column: '--search', problem: '--search needs a measured trace (--measured FILE)' });

      const session = await load(a.positionals[0]);
      const rec = session.recording;
      const parameters = resolveParameters(session.parameterSources);
      const { kernel, name: kernelName, amplitudeKnown } = buildKernel(opt, parameters.align.kernel);
      const hill = opt('--hill') ? parseHill(opt('--hill')!) : null;

      // Which trains.
      const unitArg = opt('--unit') ?? 'population';
      let columns: { name: string; trains: Float64Array[]; weight: number }[];
      if (unitArg === 'population') columns = [{ name: 'predicted', trains: rec.units.map((u) => u.spikeTimes), weight: rec.units.length ? 1 / rec.units.length : 0 }];
      else if (unitArg === 'all') columns = rec.units.map((u) => ({ name: `predicted_${u.id}`, trains: [u.spikeTimes], weight: 1 }));
      else {
        const u = rec.units.find((x) => x.id === unitArg);
        if (!u) throw new InputError({ file: session.name, column: '--unit', value: unitArg, problem: 'no such unit', fix: 'give a unit id, "all" or "population"' });
        columns = [{ name: 'predicted', trains: [u.spikeTimes], weight: 1 }];
      }
      if (rec.units.length === 0) throw new InputError({ file: session.name, problem: 'the session has no units' });

      // Measured trace and grid.
      let measured: { values: Float64Array; unit: string } | null = null;
      let series: ReturnType<typeof readSeries> | null = null;
      if (opt('--measured')) {
        const file = opt('--measured')!;
        series = readSeries(readBytes(file), basename(file), {
          ...(opt('--measured-rate') ? { rateHz: numberOption(opt('--measured-rate')!, '--measured-rate', NAME) } : {}),
          ...(opt('--measured-start') ? { startS: numberOption(opt('--measured-start')!, '--measured-start', NAME) } : {}),
          ...(opt('--measured-column') ? { valueColumn: opt('--measured-column')! } : {}),
          rateName: '--measured-rate HZ (and --measured-start S)',
        });
        if (series.times.length < 3) throw new InputError({ file, problem: 'the measured trace needs at least 3 samples' });
      }
      const gridRate = rate ?? (series && Number.isFinite(series.rateHz) ? series.rateHz : parameters.align.predictRateHz);
      let [t0, t1] = series ? [series.times[0], series.times[series.times.length - 1]] : rec.span;
      if (opt('--window')) [t0, t1] = rangeOption(opt('--window')!, '--window', NAME);
      const length = Math.floor((t1 - t0) * gridRate + 1e-9) + 1;
      if (!(length > 0)) throw new InputError({ file: where, column: '--window', problem: 'the span to predict is empty' });
      if (length * (columns.length + 2) > MAX_SAMPLES) {
        throw new InputError({ file: where, column: '--rate', value: String(gridRate), problem: `the output would hold ${length} samples x ${columns.length} columns`, fix: 'lower --rate, shorten --window, or predict fewer units' });
      }
      const grid: SampleGrid = { startS: t0, rateHz: gridRate, length };
      if (series) measured = { values: resampleLinear(series.times, series.values, grid), unit: 'as measured' };

      const traces = columns.map((c) => {
        const y = predictTrains(c.trains, kernel, grid, c.weight);
        return hill ? hillSaturation(y, hill) : y;
      });

      const header = ['time_s', ...columns.map((c) => c.name)];
      let fit: AmplitudeFit | null = null;
      let fitted: Float64Array | null = null;
      const notes: string[] = [];
      if (measured) {
        if (traces.length !== 1) throw new InputError({ file: where, column: '--unit', value: unitArg, problem: 'a measured trace is compared with one prediction', fix: 'use --unit U or --unit population' });
        fit = fitAmplitudeOffset(traces[0], measured.values);
        fitted = traces[0].map((v) => fit!.amplitude * v + fit!.offset);
        header.push('measured', 'predicted_fitted');
        notes.push(`fit: measured = ${fmt(fit.amplitude)} x predicted + ${fmt(fit.offset)}; r = ${fmt(fit.r)}; residual RMS ${fmt(fit.residualRms)}; n = ${fit.n} samples`);
        if (a.flags.has('--search')) {
          if (kernel.kind !== 'double-exponential') throw new InputError({ file: where, column: '--search', problem: 'the grid search varies a two-exponential kernel', fix: 'use a library kernel or double:RISE,DECAY' });
          const f = [0.25, 0.5, 1, 2, 4];
          const s = gridSearchKernel(
            mergeTrains(columns[0].trains),
            measured.values,
            grid,
            f.map((x) => x * kernel.tauRiseS),
            f.map((x) => x * kernel.tauDecayS),
          );
          notes.push(`grid search: best rise ${fmt(s.best.tauRiseS * 1000)} ms, decay ${fmt(s.best.tauDecayS * 1000)} ms, r = ${fmt(s.best.fit.r)}`);
        }
      }
      let aligned: string | null = null;
      const alignedOut = opt('--aligned-out');
      if (opt('--event') || alignedOut) {
        if (!opt('--event') || !alignedOut || !/\.csv$/i.test(alignedOut)) {
          throw new InputError({ file: where, column: '--event', problem: '--event and --aligned-out FILE.csv go together' });
        }
        if (traces.length !== 1) throw new InputError({ file: where, column: '--unit', value: unitArg, problem: 'event-locked averages are written for one prediction', fix: 'use --unit U or --unit population' });
        const label = opt('--event')!;
        const times = Float64Array.from(rec.events.time.filter((_, i) => rec.events.label[i] === label));
        if (times.length === 0) throw new InputError({ file: session.name, column: '--event', value: label, problem: 'no events with this label', fix: `labels in this session: ${[...new Set(rec.events.label)].slice(0, 20).join(', ')}` });
        const [w0, w1] = opt('--event-window') ? rangeOption(opt('--event-window')!, '--event-window', NAME) : [parameters.align.windowStartS, parameters.align.windowStopS];
        const pe = eventLockedTrace(traces[0], t0, gridRate, times, w0, w1);
        const me = measured ? eventLockedTrace(measured.values, t0, gridRate, times, w0, w1) : null;
        const rows = [['offset_s', 'n', 'predicted_mean', 'predicted_sem', ...(me ? ['measured_mean', 'measured_sem', 'n_measured'] : [])].join(',')];
        for (let c = 0; c < pe.offsetS.length; c++) {
          rows.push(
            [formatNumber(pe.offsetS[c]), String(pe.count[c]), formatNumber(pe.mean[c]), formatNumber(pe.sem[c]), ...(me ? [formatNumber(me.mean[c]), formatNumber(me.sem[c]), String(me.count[c])] : [])].join(','),
          );
        }
        aligned = `${rows.join('\n')}\n`;
        notes.push(`aligned on ${label}: ${times.length} events, window ${w0} to ${w1} s; wrote ${alignedOut}`);
      }
      const lines: string[] = [header.join(',')];
      for (let k = 0; k < length; k++) {
        const row = [formatTimeS(t0 + k / gridRate)];
        for (const y of traces) row.push(formatNumber(y[k]));
        if (measured) row.push(formatNumber(measured.values[k]), formatNumber(fitted![k]));
        lines.push(row.join(','));
      }
      writeOutputFile(out, `${lines.join('\n')}\n`);
      if (aligned !== null) writeOutputFile(alignedOut!, aligned);
      const unitNote = amplitudeKnown ? 'dF/F' : 'units of one spike\'s peak (single-spike amplitude not published; give --amplitude)';
      io.stderr([`predict: ${kernelName}, ${columns.length} column(s), ${length} samples at ${fmt(gridRate)} Hz, in ${unitNote}; wrote ${out}`, ...notes].join('\n') + '\n');
      return 0;
    },
  };
}

function readBytes(file: string): Uint8Array {
  try {
    return new Uint8Array(readFileSync(file));
  } catch {
    throw new InputError({ file, problem: 'cannot read the file', fix: 'check the path' });
  }
}

function buildKernel(opt: (k: string) => string | undefined, fallback: string): { kernel: Kernel; name: string; amplitudeKnown: boolean } {
  const where = `tagbench ${NAME}`;
  const amp = opt('--amplitude') ? numberOption(opt('--amplitude')!, '--amplitude', NAME) : undefined;
  if (amp !== undefined && !(amp > 0)) throw new InputError({ file: where, column: '--amplitude', value: opt('--amplitude')!, problem: 'the single-spike amplitude must be positive' });
  const file = opt('--kernel-file');
  if (file) {
    const s = readSeries(readBytes(file), basename(file), { ...(opt('--kernel-rate') ? { rateHz: numberOption(opt('--kernel-rate')!, '--kernel-rate', NAME) } : {}), rateName: '--kernel-rate HZ' });
    if (!Number.isFinite(s.rateHz)) throw new InputError({ file, column: 'time', problem: 'a sampled kernel must be evenly sampled', fix: 'resample it, or give --kernel-rate for a value-only file' });
    let peak = 0;
    for (const v of s.values) if (Math.abs(v) > Math.abs(peak)) peak = v;
    if (!(Math.abs(peak) > 0) || s.values.some((v) => !Number.isFinite(v))) throw new InputError({ file, problem: 'the kernel must have finite values that are not all zero' });
    return { kernel: { kind: 'sampled', values: s.values, sampleRateHz: s.rateHz, gain: amp !== undefined ? amp / peak : 1 }, name: `kernel from ${basename(file)}`, amplitudeKnown: true };
  }
  const spec = opt('--kernel') ?? fallback;
  const m = /^(double|alpha):(.+)$/.exec(spec);
  if (m) {
    const nums = m[2].split(',').map((x) => numberOption(x, '--kernel', NAME) / 1000);
    if (m[1] === 'double') {
      if (nums.length !== 2 || !(nums[0] > 0) || !(nums[1] > nums[0])) throw new InputError({ file: where, column: '--kernel', value: spec, problem: 'expected double:RISE_MS,DECAY_MS with 0 < rise < decay' });
      return { kernel: { kind: 'double-exponential', tauRiseS: nums[0], tauDecayS: nums[1], peakDff: amp ?? 1 }, name: spec, amplitudeKnown: amp !== undefined };
    }
    if (nums.length !== 1 || !(nums[0] > 0)) throw new InputError({ file: where, column: '--kernel', value: spec, problem: 'expected alpha:TAU_MS with TAU_MS > 0' });
    return { kernel: { kind: 'alpha', tauS: nums[0], peakDff: amp ?? 1 }, name: spec, amplitudeKnown: amp !== undefined };
  }
  const e = findKernelEntry(spec);
  if (!e) throw new InputError({ file: where, column: '--kernel', value: spec, problem: 'unknown kernel', fix: `use one of ${KERNEL_LIBRARY.map((x) => x.name).join(', ')}, double:RISE_MS,DECAY_MS, alpha:TAU_MS or --kernel-file` });
  const peak = amp ?? e.peakDff;
  return { kernel: { kind: 'double-exponential', tauRiseS: e.tauRiseS, tauDecayS: e.tauDecayS, peakDff: peak ?? 1 }, name: `${e.name} (${e.status})`, amplitudeKnown: peak !== null };
}

function parseHill(v: string): { n: number; halfDff: number; maxDff: number } {
  const p = v.split(',').map((x) => numberOption(x, '--hill', NAME));
  if (p.length !== 3 || !p.every((x) => x > 0)) throw new InputError({ file: `tagbench ${NAME}`, column: '--hill', value: v, problem: 'expected N,HALF,MAX, all positive' });
  return { n: p[0], halfDff: p[1], maxDff: p[2] };
}

/** One sorted train from several (for the grid search, which takes one train). */
function mergeTrains(trains: readonly Float64Array[]): Float64Array {
  if (trains.length === 1) return trains[0];
  let n = 0;
  for (const t of trains) n += t.length;
  const out = new Float64Array(n);
  let k = 0;
  for (const t of trains) {
    out.set(t, k);
    k += t.length;
  }
  return out.sort();
}

function fmt(x: number): string {
  return Number.isFinite(x) ? String(Number(x.toPrecision(4))) : 'n/a';
}
