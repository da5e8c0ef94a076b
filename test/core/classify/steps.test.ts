/**
 * The ramp, jump and cluster pipeline steps through analyseRecording: the
 * contract columns of DESIGN.md section 3 with exactly their names and verdict
 * words, the per-kind jump triples in order, the extra columns, run.json
 * summaries, and sessions without reward/jump events or trials.
 */
import { describe, expect, it } from 'vitest';
import { DEFAULTS } from '../../../core/defaults';
import { analyseRecording } from '../../../core/pipeline/analyse-recording';
import { formatDelimited } from '../../../core/table/format-delimited';
import { emptyEvents, emptyTrials } from '../../../core/model/empty';
import { JUMP_VERDICTS, RAMP_VERDICTS } from '../../../core/table/contract-columns';
import { taskSession } from '../../helpers/task-session';

describe('ramp, jump and cluster steps', () => {
  const rec = taskSession({
    nTrials: 80,
    probeFraction: 0.3,
    units: [
      { rateHz: 10, shape: 1, rampChange: 1 },
      { rateHz: 8, shape: 2, jump: { forward: { amplitude: 3, form: 'transient' } } },
      ...Array.from({ length: 10 }, (_, i) => ({ rateHz: 5 + i, shape: 1 })),
    ],
    seed: 101,
  });
  const res = analyseRecording(rec, DEFAULTS);
  const names = res.table.columns.map((c) => c.name);

  it('writes the contract columns in order, then the jump triples per kind', () => {
    // Contract order (DESIGN.md section 3); the light step's tag columns sit between rate_hz and ramp.
    const head = ['unit', 'n_spikes', 'rate_hz', 'ramp', 'ramp_slope_hz_per_s', 'ramp_p', 'ramp_q'];
    expect(names.filter((n) => head.includes(n))).toEqual(head);
    expect(names.indexOf('ramp_q') - names.indexOf('ramp')).toBe(3);
    expect(names.slice(0, 3)).toEqual(head.slice(0, 3));
    const i = names.indexOf('ramp_q');
    expect(names.slice(i + 1, i + 7)).toEqual([
      'jump_backward', 'jump_backward_delta_hz', 'jump_backward_p', 'jump_forward', 'jump_forward_delta_hz', 'jump_forward_p',
    ]);
    for (const extra of ['ramp_reason', 'ramp_r2', 'ramp_glm_dispersion', 'ramp_slope_standard_hz_per_s', 'ramp_diff_probe_p', 'jump_forward_q', 'jump_forward_shape', 'jump_forward_latency_ms', 'jump_forward_size_rho', 'cluster']) {
      expect(names).toContain(extra);
    }
  });

  it('uses only the contract verdict words', () => {
    const col = (n: string) => res.table.columns.find((c) => c.name === n)!.values as string[];
    for (const v of col('ramp')) expect(RAMP_VERDICTS).toContain(v);
    for (const v of col('jump_forward')) expect(JUMP_VERDICTS).toContain(v);
    expect(col('ramp')[0]).toBe('up');
    expect(col('jump_forward')[1]).toBe('excited');
  });

  it('puts summaries into run.json', () => {
    const s = res.summaries as Record<string, Record<string, unknown>>;
    expect(s.ramp.trials).toBeGreaterThan(40);
    expect(s.ramp.up).toBeGreaterThanOrEqual(1);
    expect((s.jump.kinds as unknown[]).length).toBe(2);
    expect(s.cluster).toHaveProperty('classes');
  });

  it('handles a session without events or trials: ramp flat with the reason, empty numbers, no jump columns', () => {
    const bare = { ...rec, events: emptyEvents(), trials: emptyTrials() };
    const r = analyseRecording(bare, DEFAULTS);
    const cols = r.table.columns.map((c) => c.name);
    expect(cols.some((c) => c.startsWith('jump_'))).toBe(false);
    const ramp = r.table.columns.find((c) => c.name === 'ramp')!.values as string[];
    expect(new Set(ramp)).toEqual(new Set(['flat']));
    const reason = r.table.columns.find((c) => c.name === 'ramp_reason')!.values as string[];
    expect(reason[0]).toBe('no "reward" events');
    const csv = formatDelimited(r.table).split('\n');
    const header = csv[0].split(',');
    const row = csv[1].split(',');
    expect(row[header.indexOf('ramp_p')]).toBe('');
    expect(row[header.indexOf('ramp_q')]).toBe('');
    expect(r.warnings.map((w) => w.code)).toContain('ramp-no-trials');
    expect((r.summaries as Record<string, Record<string, unknown>>).jump.note).toBe('no "jump" events');
  });

  it('warns when some jump events lack a kind (their own group "all"), and counts uncontrolled jumps', () => {
    // blank the kind of the first three jumps; move one jump outside every trial (no matched control)
    const jumps = rec.events.label.flatMap((l, i) => (l === 'jump' ? [i] : []));
    const kind = rec.events.kind.map((k, i) => (jumps.slice(0, 3).includes(i) ? '' : k));
    const time = Float64Array.from(rec.events.time);
    time[jumps[3]] = rec.trials.stop[rec.trials.stop.length - 1] + 0.5;
    const order = Array.from(time.keys()).sort((a, b) => time[a] - time[b]);
    const events = { time: Float64Array.from(order, (i) => time[i]), label: order.map((i) => rec.events.label[i]), trial: Float64Array.from(order, (i) => rec.events.trial[i]), kind: order.map((i) => kind[i]) };
    const r = analyseRecording({ ...rec, events }, DEFAULTS);
    const missing = r.warnings.find((w) => w.code === 'jump-kind-missing')!;
    expect(missing.count).toBe(3);
    expect(missing.message).toBe('3 "jump" events have no kind while the others do; they are analysed as their own group (columns jump_all_*). Give every jump its kind in events.csv.');
    expect(r.table.columns.map((c) => c.name)).toContain('jump_all');
    const unc = r.warnings.find((w) => w.code === 'jump-uncontrolled')!;
    expect(unc.count).toBe(1);
    expect(unc.message).toMatch(/^1 jump had no matched control/);
  });

  it('names the conditions present when the reference condition has no trials', () => {
    const other = taskSession({ nTrials: 20, standardLabel: 'A', otherConditions: [{ label: 'B', fraction: 0.5 }], units: [{ rateHz: 5, shape: 1 }], seed: 102 });
    const r = analyseRecording(other, DEFAULTS);
    const w = r.warnings.find((x) => x.code === 'ramp-no-trials')!;
    expect(w.message).toContain('no "reward" events in trials of condition "standard"');
    expect(w.message).toContain('Conditions present: A, B');
  });
});
