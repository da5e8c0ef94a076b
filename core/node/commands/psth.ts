import { eventResponse, type EventResponse } from '../../align/event-response';
import { warpedResponse } from '../../align/warped-response';
import type { AlignmentSpec } from '../../align/select-alignment';
import type { GroupBy, OrderBy, PsthOptions, Smoothing } from '../../align/types';
import { InputError } from '../../errors';
import type { ImportResult } from '../../io/import-result';
import { resolveParameters } from '../../resolve-parameters';
import { formatNumber } from '../../table/format-number';
import { writeOutputFile } from '../write-output-file';
import { parseCliArgs } from '../parse-cli-args';
import { numberOption, rangeOption } from './option-values';
import type { Command } from './types';

const NAME = 'psth';
const VALUED = ['--unit', '--event', '--warp', '--kind', '--condition', '--window', '--bin', '--smooth', '--band', '--by', '--order', '--baseline', '--seed', '--resamples', '--out'];

const USAGE = [
  'Usage: tagbench psth <session-dir|file.nwb> --unit U (--event LABEL | --pulses) [options]',
  '',
  'Raster counts and peri-event time histograms (PSTH) of one unit (or every unit',
  'with --unit all) around an event label, or around laser pulse onsets.',
  '',
  '  --unit U            unit id as in the session, or "all"',
  '  --event LABEL       align on events with this label (default from parameters: reward)',
  '  --pulses            align on laser pulse onsets instead (kind = "single" or "10 Hz", ...)',
  '  --kind K            keep only events of this kind',
  '  --condition C       keep only trials of this condition',
  '  --window a,b        window around the event, s (default -3,2)',
  '  --bin MS            bin width, ms (default 50)',
  '  --smooth KIND:MS    gaussian:50 (SD), exponential:MS (causal), boxcar:MS (full width), or none',
  '  --band B            sem (mean +- 1 SEM; default), bootstrap (95 % percentile, trials resampled), none',
  '  --resamples N       bootstrap resamples (default 1000); --seed N sets their seed (default 1)',
  '  --by G              group trials: condition (default), kind, none, or covariate:NAME (3 quantile bins)',
  '  --order O           trial order in the raster: time (default), condition, covariate:NAME',
  '  --baseline a,b      baseline window, s: adds a z-score column',
  '  --warp A,B[,C...]   time-warped PSTH between anchor events per trial (e.g. sweep_on,reward;',
  '                      trial_start / trial_stop allowed): piecewise linear onto the median template;',
  '                      --window a,b then means a s before the first and b s after the last anchor',
  '                      (default -1,1), --by condition|none; rates corrected for stretched bins',
  '  --out FILE          write .csv (one row per group and bin) or .json (with the raster); default: CSV on stdout',
  '',
  'CSV columns: unit, event, group, n_trials, bin_start_s, bin_center_s, rate_hz, sem_hz,',
  'lower_hz, upper_hz, z. Rates are spikes per second averaged over trials.',
].join('\n');

/**
 * `tagbench psth`: PSTHs of one unit or all units around an event, by group,
 * as CSV or JSON (core/align/event-response.ts does the work). `load` opens
 * the session (the CLI passes loadSession; tests pass an in-memory loader).
 * Options are checked before anything is written; the output file is written
 * atomically.
 */
export function createPsthCommand(load: (path: string) => Promise<ImportResult>): Command {
  return {
    name: NAME,
    summary: 'PSTHs (and raster counts) of a unit around an event label or the laser pulses, by condition or kind',
    usage: USAGE,
    async run(argv, io) {
      const a = parseCliArgs(argv, NAME, VALUED, ['--help', '-h', '--pulses']);
      if (a.flags.has('--help') || a.flags.has('-h')) {
        io.stdout(`${USAGE}\n`);
        return 0;
      }
      if (a.positionals.length !== 1) throw new InputError({ file: `tagbench ${NAME}`, problem: 'expects one session folder or .nwb file', fix: 'run "tagbench psth <session> --unit U --event LABEL"' });
      const opt = (k: string): string | undefined => a.options[k];
      const unitArg = opt('--unit');
      if (!unitArg) throw new InputError({ file: `tagbench ${NAME}`, column: '--unit', problem: 'which unit?', fix: 'give --unit with a unit id, or --unit all' });
      const out = opt('--out');
      if (out && !/\.(csv|json)$/i.test(out)) throw new InputError({ file: `tagbench ${NAME}`, column: '--out', value: out, problem: 'the output must end in .csv or .json' });
      if (a.flags.has('--pulses') && opt('--event')) throw new InputError({ file: `tagbench ${NAME}`, problem: 'give either --event or --pulses, not both' });

      const session = await load(a.positionals[0]);
      const rec = session.recording;
      const parameters = resolveParameters(session.parameterSources);
      const d = parameters.align;
      const psth: Partial<PsthOptions> = {};
      if (opt('--window')) {
        const [s, e] = rangeOption(opt('--window')!, '--window', NAME);
        Object.assign(psth, { windowStartS: s, windowStopS: e });
      }
      if (opt('--bin')) {
        const b = numberOption(opt('--bin')!, '--bin', NAME);
        if (!(b > 0)) throw new InputError({ file: `tagbench ${NAME}`, column: '--bin', value: opt('--bin')!, problem: 'the bin width must be positive (ms)' });
        Object.assign(psth, { binMs: b });
      }
      if (opt('--smooth')) Object.assign(psth, { smoothing: parseSmoothing(opt('--smooth')!) });
      if (opt('--band')) {
        const b = opt('--band')!;
        if (!['sem', 'bootstrap', 'none'].includes(b)) throw new InputError({ file: `tagbench ${NAME}`, column: '--band', value: b, problem: 'expected sem, bootstrap or none' });
        Object.assign(psth, { band: b });
      }
      if (opt('--seed')) Object.assign(psth, { seed: Math.trunc(numberOption(opt('--seed')!, '--seed', NAME)) });
      if (opt('--resamples')) {
        const n = Math.trunc(numberOption(opt('--resamples')!, '--resamples', NAME));
        if (!(n >= 10)) throw new InputError({ file: `tagbench ${NAME}`, column: '--resamples', value: opt('--resamples')!, problem: 'use at least 10 resamples' });
        Object.assign(psth, { nBoot: n });
      }
      if (opt('--baseline')) {
        const [s, e] = rangeOption(opt('--baseline')!, '--baseline', NAME);
        Object.assign(psth, { baselineStartS: s, baselineStopS: e });
      }
      if (opt('--warp')) return runWarped(a.positionals[0], session, opt, io, psth);
      const groupBy = parseGroup(opt('--by') ?? d.groupBy);
      const orderBy = parseOrder(opt('--order') ?? 'time');

      const event = a.flags.has('--pulses') ? null : (opt('--event') ?? d.event);
      const align: AlignmentSpec = {
        ...(event === null ? { pulses: true as const } : { event }),
        ...(opt('--kind') !== undefined ? { kind: opt('--kind')! } : {}),
        ...(opt('--condition') !== undefined ? { condition: opt('--condition')! } : {}),
      };
      if (event === null && rec.pulses.onset.length === 0) throw new InputError({ file: session.name, problem: 'the session has no laser pulses', fix: 'align on an event with --event LABEL' });
      if (event !== null && !rec.events.label.includes(event)) {
        const labels = [...new Set(rec.events.label)];
        throw new InputError({
          file: session.name,
          value: event,
          problem: 'no events with this label',
          fix: labels.length ? `labels in this session: ${labels.slice(0, 20).join(', ')}` : 'the session has no events (events.csv)',
        });
      }
      let units: number[];
      if (unitArg === 'all') units = rec.units.map((_, i) => i);
      else {
        const i = rec.units.findIndex((u) => u.id === unitArg);
        if (i < 0) {
          const ids = rec.units.map((u) => u.id);
          throw new InputError({ file: session.name, column: '--unit', value: unitArg, problem: 'no such unit', fix: `units include ${ids.slice(0, 12).join(', ')}${ids.length > 12 ? ', ...' : ''}` });
        }
        units = [i];
      }
      const responses = units.map((u) => eventResponse(rec, parameters, { unitIndex: u, align, groupBy, orderBy, psth }));
      const first = responses[0];
      if (first && first.set.times.length === 0) {
        throw new InputError({ file: session.name, problem: `no ${event === null ? 'pulses' : `"${event}" events`} left after the --kind / --condition filters` });
      }
      const text = out && /\.json$/i.test(out) ? toJson(responses) : toCsv(responses);
      if (out) {
        writeOutputFile(out, text);
        const g = first.groups.map((x) => `${x.label} (${x.psth.nTrials})`).join(', ');
        io.stderr(`psth: ${responses.length} unit(s), ${first.source}, groups ${g}; wrote ${out}\n`);
      } else io.stdout(text);
      return 0;
    },
  };
}

async function runWarped(
  path: string,
  session: ImportResult,
  opt: (k: string) => string | undefined,
  io: { stdout: (t: string) => void; stderr: (t: string) => void },
  psth: Partial<PsthOptions>,
): Promise<number> {
  const rec = session.recording;
  const where = `tagbench ${NAME}`;
  for (const k of ['--event', '--pulses', '--kind', '--condition', '--smooth', '--band', '--baseline', '--order']) {
    if (opt(k) !== undefined) throw new InputError({ file: where, column: k, problem: 'not used with --warp', fix: 'drop it, or run without --warp' });
  }
  const labels = opt('--warp')!.split(',').map((x) => x.trim());
  if (labels.length < 2 || labels.some((x) => x === '')) throw new InputError({ file: where, column: '--warp', value: opt('--warp')!, problem: 'give at least two anchor event labels, comma-separated' });
  const known = new Set([...rec.events.label, 'trial_start', 'trial_stop']);
  const unknown = labels.filter((x) => !known.has(x));
  if (unknown.length) throw new InputError({ file: path, column: '--warp', value: unknown.join(','), problem: 'no events with this label', fix: `labels in this session: ${[...new Set(rec.events.label)].slice(0, 20).join(', ')}` });
  if (rec.trials.start.length === 0) throw new InputError({ file: path, problem: 'time-warping needs trials (trials.csv)' });
  const by = opt('--by') ?? 'condition';
  if (by !== 'condition' && by !== 'none') throw new InputError({ file: where, column: '--by', value: by, problem: 'with --warp, group by condition or none' });
  const unitArg = opt('--unit')!;
  const units = unitArg === 'all' ? rec.units.map((_, i) => i) : [rec.units.findIndex((u) => u.id === unitArg)];
  if (units[0] === -1) throw new InputError({ file: path, column: '--unit', value: unitArg, problem: 'no such unit' });
  const preS = psth.windowStartS !== undefined ? -psth.windowStartS : 1;
  const postS = psth.windowStopS ?? 1;
  if (!(preS >= 0 && postS >= 0)) throw new InputError({ file: where, column: '--window', problem: 'with --warp the window must start at or before 0 and stop at or after 0 (seconds around the anchors)' });
  const responses = units.map((u) => warpedResponse(rec, u, labels, { binMs: psth.binMs ?? 50, preS, postS, groupBy: by }));
  const r0 = responses[0];
  if (!r0 || r0.groups.length === 0) throw new InputError({ file: path, column: '--warp', value: labels.join(','), problem: 'no trial has every anchor in increasing order' });
  const lines = ['unit,anchors,group,n_trials,bin_start_s,bin_center_s,rate_hz,sem_hz'];
  for (const r of responses) {
    for (const g of r.groups) {
      const p = g.psth;
      for (let j = 0; j < p.rateHz.length; j++) {
        lines.push([quote(r.unitId), quote(labels.join('>')), quote(g.label), String(g.nTrials), formatNumber(p.binStartS[j]), formatNumber(p.binStartS[j] + p.binS / 2), formatNumber(p.rateHz[j]), formatNumber(p.semHz[j])].join(','));
      }
    }
  }
  const text = `${lines.join('\n')}\n`;
  const out = opt('--out');
  const tpl = Array.from(r0.template, (t, k) => `${labels[k]} at ${formatNumber(t)} s`).join(', ');
  const note = `psth --warp: template ${tpl}; ${r0.invalidTrials} trial(s) without every anchor in order left out`;
  if (out) {
    if (!/\.csv$/i.test(out)) throw new InputError({ file: where, column: '--out', value: out, problem: 'with --warp the output is CSV (.csv)' });
    writeOutputFile(out, text);
    io.stderr(`${note}; wrote ${out}\n`);
  } else {
    io.stdout(text);
    io.stderr(`${note}\n`);
  }
  return 0;
}

function parseSmoothing(v: string): Smoothing {
  if (v === 'none') return { kind: 'none', widthMs: 0 };
  const m = /^(gaussian|exponential|boxcar):([0-9.eE+-]+)$/.exec(v);
  const w = m ? Number(m[2]) : NaN;
  if (!m || !(w > 0)) throw new InputError({ file: `tagbench ${NAME}`, column: '--smooth', value: v, problem: 'expected gaussian:MS, exponential:MS, boxcar:MS or none', fix: 'e.g. --smooth gaussian:25' });
  return { kind: m[1] as Smoothing['kind'], widthMs: w };
}

function parseGroup(v: string): GroupBy {
  if (v === 'none' || v === 'condition' || v === 'kind') return { by: v };
  if (v.startsWith('covariate:') && v.length > 10) return { by: 'covariate', name: v.slice(10) };
  throw new InputError({ file: `tagbench ${NAME}`, column: '--by', value: v, problem: 'expected condition, kind, none or covariate:NAME' });
}

function parseOrder(v: string): OrderBy {
  if (v === 'time' || v === 'condition') return { by: v };
  if (v.startsWith('covariate:') && v.length > 10) return { by: 'covariate', name: v.slice(10) };
  throw new InputError({ file: `tagbench ${NAME}`, column: '--order', value: v, problem: 'expected time, condition or covariate:NAME' });
}

const CSV_HEADER = 'unit,event,group,n_trials,bin_start_s,bin_center_s,rate_hz,sem_hz,lower_hz,upper_hz,z';

function quote(s: string): string {
  return /[",\n\r]/.test(s) ? `"${s.replace(/"/g, '""')}"` : s;
}

function toCsv(rs: readonly EventResponse[]): string {
  const lines = [CSV_HEADER];
  for (const r of rs) {
    for (const g of r.groups) {
      const p = g.psth;
      for (let j = 0; j < p.rateHz.length; j++) {
        lines.push(
          [
            quote(r.unitId),
            quote(r.source),
            quote(g.label),
            String(p.nTrials),
            formatNumber(p.binStartS[j]),
            formatNumber(p.binCenterS[j]),
            formatNumber(p.rateHz[j]),
            formatNumber(p.semHz[j]),
            formatNumber(p.lowerHz[j]),
            formatNumber(p.upperHz[j]),
            p.zScore ? formatNumber(p.zScore[j]) : '',
          ].join(','),
        );
      }
    }
  }
  return `${lines.join('\n')}\n`;
}

function toJson(rs: readonly EventResponse[]): string {
  const num = (a: ArrayLike<number>) => Array.from(a, (v) => (Number.isFinite(v) ? v : null));
  return `${JSON.stringify(
    {
      options: rs[0]?.options ?? null,
      units: rs.map((r) => ({
        unit: r.unitId,
        event: r.source,
        groups: r.groups.map((g) => ({
          group: g.label,
          nTrials: g.psth.nTrials,
          band: g.psth.band,
          alignTimesS: num(Array.from(g.rows, (q) => r.set.times[q])),
          binCenterS: num(g.psth.binCenterS),
          rateHz: num(g.psth.rateHz),
          semHz: num(g.psth.semHz),
          lowerHz: num(g.psth.lowerHz),
          upperHz: num(g.psth.upperHz),
          zScore: g.psth.zScore ? num(g.psth.zScore) : null,
          raster: { offsets: Array.from(g.raster.offsets), timesS: num(g.raster.times) },
        })),
      })),
    },
    null,
    1,
  )}\n`;
}
