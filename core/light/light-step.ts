import type { Parameters } from '../defaults';
import { InputError } from '../errors';
import type { RawSource, Unit, Warning } from '../model/types';
import type { AnalysisStep } from '../pipeline/types';
import type { Column } from '../table/types';
import { artefactFlags } from './artefact-flags';
import { createLightScratch, lightResponse } from './light-response';
import { lightFreeSpikes } from './light-free-spikes';
import { lightSchedule } from './light-schedule';
import { ruleSaltP } from './rule-salt-p';
import { ruleTrust, type RuleTrust } from './rule-trust';
import { saltPChoice } from './salt-p-choice';
import { simulationIntervals } from './simulation-intervals';
import { tagVerdict } from './tag-verdict';
import { trustCell, type TrustCorner } from './trust-cell';
import { waveformMatch } from './waveform-match';

/** Checks the light parameters; a bad value is an input error naming the key. */
function checkParameters(p: Parameters['light']): void {
  const bad = (key: string, value: unknown, problem: string) => {
    throw new InputError({ file: 'parameters', column: `light.${key}`, value: String(value), problem, fix: 'correct it in session.json or the --config file' });
  };
  if (!(p.windowEndMs > p.windowStartMs)) bad('windowEndMs', p.windowEndMs, 'the test window must end after it starts');
  if (!(p.saltBinMs > 0) || p.saltBinMs > p.windowEndMs - p.windowStartMs) bad('saltBinMs', p.saltBinMs, 'the SALT bin must be positive and fit the test window');
  if (!(p.saltBaselineMs >= 0)) bad('saltBaselineMs', p.saltBaselineMs, 'must be >= 0');
  if (!(p.lightGuardMs >= 0)) bad('lightGuardMs', p.lightGuardMs, 'must be >= 0');
  for (const k of ['alphaSalt', 'alphaCount', 'trustPower', 'saltMinPulseFraction'] as const) if (!(p[k] > 0 && p[k] <= 1)) bad(k, p[k], 'must lie in (0, 1]');
  if (!['auto', 'calibrated', 'published'].includes(p.saltP)) bad('saltP', p.saltP, 'must be "auto", "calibrated" or "published"');
  if (!(p.artefactJitterMs > 0)) bad('artefactJitterMs', p.artefactJitterMs, 'must be > 0');
  if (!(p.offsetWindowMs > 0)) bad('offsetWindowMs', p.offsetWindowMs, 'must be > 0');
  for (const k of ['trustNullSimulations', 'trustPowerSimulations', 'trustBudget', 'waveformChannels', 'waveformMaxSpikes', 'waveformMinSpikes', 'saltMinWindows'] as const) {
    if (!(Number.isInteger(p[k]) && p[k] >= 0)) bad(k, p[k], 'must be a whole number >= 0');
  }
}

/**
 * The raw-file column of the unit's channel (metadata `channel`): looked up in
 * the raw file's channel map when session.json gives one, else read as a
 * 0-based column index. -1 without a channel, -2 when it names no column.
 */
function metaChannel(u: Unit, raw: RawSource): number {
  const v = u.meta.channel;
  if (v === undefined || v === '') return -1;
  if (raw.channelIds) {
    const i = raw.channelIds.indexOf(String(v));
    return i >= 0 ? i : -2;
  }
  const c = Number(v);
  return Number.isInteger(c) ? c : -2;
}

/**
 * Light identification of every unit (issue 3): per-pulse answer, SALT,
 * frequency following, waveform match from the raw recording, artefact flags,
 * the verdict, and the trust simulation of the rule on this session's own
 * pulse schedule. Columns: the contract's tag, tag_latency_ms, tag_jitter_ms,
 * tag_reliability, tag_p, then the light columns described in README.md
 * ("Light identification"). Session summary goes to run.json under "light".
 *
 * Sessions without pulses: every unit `untagged` with reason "no laser
 * pulses" (the contract's words stay valid for scripts), numbers empty.
 */
export const lightStep: AnalysisStep = {
  name: 'light',
  run({ recording, parameters }) {
    const p = parameters.light;
    checkParameters(p);
    const units = recording.units;
    const nU = units.length;
    const sch = lightSchedule(recording.pulses, recording.span, p);
    const choice = saltPChoice(sch.windows, p);
    const warnings: Warning[] = [];
    const num = () => new Float64Array(nU).fill(NaN);
    const tag: string[] = new Array(nU).fill('untagged');
    const reason: string[] = new Array(nU).fill('no laser pulses');
    const artefact: string[] = new Array(nU).fill('');
    const latency = num();
    const jitter = num();
    const reliability = num();
    const saltP = num();
    const saltPublished = num();
    const saltCalibrated = num();
    const medianLatency = num();
    const evokedLatency = num();
    const evokedJitter = num();
    const saltI = num();
    const countP = num();
    const perPulse = num();
    const baseline = num();
    const evokedMinus = num();
    const baseRel = num();
    const waveR = num();
    const waveCh = num();
    const falseRate = num();
    const minRel = num();
    const isiCv = num();
    const nf = sch.frequencyKeys.length;
    const fRel = Array.from({ length: nf }, num);
    const fLat = Array.from({ length: nf }, num);

    const cells = new Map<string, { trust: RuleTrust; units: number }>();
    const nodeInput = new Map<string, [number, number]>();
    const cornersOf: TrustCorner[][] = new Array(nU);
    let nullSims = 0;
    let powerSims = 0;
    let badChannels = 0;
    let waveformProblems = 0;
    if (sch.n > 0) {
      const scratch = createLightScratch();
      const intervals = simulationIntervals(sch, p.offsetWindowMs / 1000);
      for (let u = 0; u < nU; u++) {
        const unit = units[u];
        // Per-pulse latencies only for the waveform match (raw data); 'summary' allocates nothing per pulse.
        const r = lightResponse(unit.spikeTimes, sch, p, recording.raw ? true : 'summary', scratch);
        const free = lightFreeSpikes(unit.spikeTimes, sch.lightIntervals, recording.raw !== undefined);
        let wr = NaN;
        if (recording.raw) {
          let ch = metaChannel(unit, recording.raw);
          if (ch < -1 || ch >= recording.raw.channelCount) {
            badChannels++;
            ch = -1;
          }
          const evoked: number[] = [];
          for (let i = 0; i < sch.n; i++) if (r.latencyS![i] === r.latencyS![i]) evoked.push(sch.onset[i] + r.latencyS![i]);
          const wm = waveformMatch(recording.raw, evoked, free.spikes, p, ch);
          wr = wm.r;
          if (wm.channels.length) waveCh[u] = wm.channels[0];
          if (wm.problem) waveformProblems++;
        }
        const flags = artefactFlags(r, wr, p);
        const v = tagVerdict(r, wr, flags, p, sch.saltProblem);
        tag[u] = v.tag;
        reason[u] = v.reason;
        artefact[u] = flags.map((f) => f.code).join(';');
        latency[u] = r.meanLatencyS * 1000;
        jitter[u] = r.jitterS * 1000;
        reliability[u] = r.reliability;
        // tag_p never 0: a published p of 0 (below its resolution) is written as 1/#null.
        const rp = ruleSaltP(r, choice.kind);
        saltP[u] = rp === 0 ? 1 / r.salt.nullCount : rp;
        saltPublished[u] = r.salt.p;
        saltCalibrated[u] = r.salt.pCalibrated;
        medianLatency[u] = r.medianLatencyS * 1000;
        evokedLatency[u] = r.evokedLatencyS * 1000;
        evokedJitter[u] = r.evokedJitterS * 1000;
        saltI[u] = r.salt.informationDifference;
        countP[u] = r.countP;
        perPulse[u] = r.evokedPerPulse;
        baseline[u] = r.baselineHz;
        evokedMinus[u] = r.evokedMinusBaselineHz;
        baseRel[u] = r.baselineReliability;
        waveR[u] = wr;
        isiCv[u] = free.isiCv;
        for (let f = 0; f < nf; f++) {
          fRel[f][u] = r.frequencyReliability![f];
          fLat[f][u] = r.frequencyLatencyS![f] * 1000;
        }
        const corners = trustCell(r.baselineHz, free.isiCv);
        cornersOf[u] = corners;
        for (const c of corners) {
          const key = `${c.rateHz}|${c.cv}`;
          if (!nodeInput.has(key)) nodeInput.set(key, [c.rateHz, c.cv]);
        }
      }
      // Trust simulation, once per grid node that some unit needs, within the session's budget.
      const perNode = p.trustBudget / Math.max(1, nodeInput.size * sch.n);
      nullSims = Math.min(p.trustNullSimulations, Math.max(50, Math.floor(perNode)));
      powerSims = Math.min(p.trustPowerSimulations, Math.max(10, Math.floor(nullSims / 5)));
      const tp = { ...p, trustNullSimulations: nullSims, trustPowerSimulations: powerSims };
      const keys = [...nodeInput.keys()].sort((a, b) => nodeInput.get(a)![0] - nodeInput.get(b)![0] || nodeInput.get(a)![1] - nodeInput.get(b)![1]);
      for (const key of keys) {
        const [rate, cv] = nodeInput.get(key)!;
        cells.set(key, { trust: ruleTrust(sch, intervals, rate, cv, tp, scratch), units: 0 });
      }
      // Each unit: bilinear interpolation between its nodes (NaN detectable reliability if any node has none).
      for (let u = 0; u < nU; u++) {
        let fr = 0;
        let mr = 0;
        let nearest = cornersOf[u][0];
        for (const c of cornersOf[u]) if (c.weight > nearest.weight) nearest = c;
        cells.get(`${nearest.rateHz}|${nearest.cv}`)!.units++;
        for (const c of cornersOf[u]) {
          const node = cells.get(`${c.rateHz}|${c.cv}`)!;
          fr += c.weight * node.trust.falseRate;
          mr += c.weight * node.trust.minDetectableReliability;
        }
        falseRate[u] = fr;
        minRel[u] = mr;
      }
    } else {
      warnings.push({ code: 'no-laser-pulses', message: 'The session has no laser pulses: every unit is "untagged" with reason "no laser pulses".', count: 1 });
    }
    if (sch.n > 0 && sch.saltProblem) warnings.push({ code: 'salt-not-run', message: `SALT was not run: ${sch.saltProblem}.`, count: 1 });
    if (sch.n > 0 && !sch.saltProblem && sch.saltPulses.length < sch.n) {
      warnings.push({
        code: 'salt-pulses-left-out',
        message: `${sch.n - sch.saltPulses.length} of ${sch.n} pulses did not get a block of ${sch.windows} light-free baseline windows of their own (later pulses of trains, or pulses too close together) and were left out of SALT (kept for latency, reliability and following).`,
        count: sch.n - sch.saltPulses.length,
      });
    }
    // Only a p that can never pass is a warning; the automatic choice of the published p is
    // stated in every reason and in the summary (salt.pUsed, salt.pNote).
    if (sch.n > 0 && !sch.saltProblem && !choice.canPass) {
      warnings.push({ code: 'salt-p-resolution', message: `${choice.note}: no unit can be "tagged" by SALT; give more light-free time between pulses (or fewer, sparser trains), or set light.saltP to "published" or "auto".`, count: 1 });
    }
    if (badChannels) warnings.push({ code: 'waveform-channel-invalid', message: `Unit channel metadata not a channel of the raw file (${recording.raw?.channelIds ? 'not in raw.channel_map' : 'read as a 0-based column; give raw.channel_map in session.json when the file holds other channels'}); the largest-amplitude channel was used instead.`, count: badChannels });
    if (waveformProblems) warnings.push({ code: 'waveform-match-missing', message: 'Some units had too few evoked or spontaneous spikes (or a flat waveform) for a waveform match; their tag_waveform_r is empty.', count: waveformProblems });

    const ms = (name: string, values: Float64Array, description: string, digits = 4): Column => ({ name, kind: 'number', values, digits, description });
    const columns: Column[] = [
      { name: 'tag', kind: 'string', values: tag, description: 'Light-identification verdict: tagged, borderline or untagged (a statistical screen, not proof of identity)' },
      ms('tag_latency_ms', latency, 'Mean first-spike latency after pulse onset in the test window, ms'),
      ms('tag_jitter_ms', jitter, 'SD of first-spike latency, ms'),
      ms('tag_reliability', reliability, 'Share of pulses with >= 1 spike in the test window'),
      ms('tag_p', saltP, `SALT p-value the rule uses (light.saltP = ${p.saltP}: here the ${choice.kind} p); never 0: a p below the resolution is written as the resolution`),
      { name: 'tag_reason', kind: 'string', values: reason, description: 'Why the verdict: what failed, then SALT p, latency, jitter, reliability' },
      ms('tag_median_latency_ms', medianLatency, 'Median first-spike latency, ms'),
      ms('tag_evoked_latency_ms', evokedLatency, 'Mean latency of the excess spikes in the test window (baseline subtracted), ms'),
      ms('tag_evoked_jitter_ms', evokedJitter, 'SD of the excess spikes latency (baseline subtracted), ms'),
      ms('tag_salt_p_published', saltPublished, 'SALT p as published (Kvitsiani et al. 2013): #(null distances >= median test distance) / #null; conservative; 0 = below 1/#null'),
      ms('tag_salt_p_calibrated', saltCalibrated, 'Rank-calibrated SALT p: share of the J + 1 histograms whose median distance to the others is >= the test histogram\'s; >= 1/(J + 1)'),
      ms('tag_salt_i', saltI, 'SALT information difference (median test distance minus median null distance)'),
      ms('tag_count_p', countP, 'Exact Poisson test of the test-window spike count against the baseline rate (one-sided, excess)'),
      ms('tag_evoked_per_pulse', perPulse, 'Spikes in the test window per pulse'),
      ms('tag_baseline_hz', baseline, 'Baseline rate from the SALT baseline windows (light-free time before the pulses), Hz'),
      ms('tag_evoked_minus_baseline_hz', evokedMinus, 'Rate in the test window minus the baseline rate, Hz'),
      ms('tag_baseline_reliability', baseRel, 'Share of baseline windows (same length as the test window) with >= 1 spike'),
      ms('tag_waveform_r', waveR, 'Pearson r of light-evoked and spontaneous mean waveforms cut from the raw file (empty without raw data)'),
      ms('tag_waveform_channel', waveCh, 'Column of the raw file (0-based, in file order) the waveform comparison starts from'),
      { name: 'tag_artefact', kind: 'string', values: artefact, description: 'Artefact suspicions: zero-jitter, too-early, offset-locked, waveform-mismatch (";"-separated; empty = none)' },
      ms('tag_false_rate', falseRate, 'Expected share of light-insensitive units like this one (rate, ISI CV) that the rule calls tagged on this pulse schedule (simulated)'),
      ms('tag_min_detectable_reliability', minRel, 'Smallest reliability of a direct answer the rule finds with the set power on this pulse schedule (simulated; empty = not even 1)'),
      ms('tag_isi_cv', isiCv, 'ISI coefficient of variation in light-free time (used by the trust simulation)'),
    ];
    for (let f = 0; f < nf; f++) {
      const key = sch.frequencyKeys[f];
      const what = key === 'single' ? 'single pulses' : `pulses of ${key.replace('p', '.').replace('hz', ' Hz')} trains`;
      columns.push(ms(`tag_reliability_${key}`, fRel[f], `Reliability on ${what}`));
      columns.push(ms(`tag_latency_${key}_ms`, fLat[f], `Mean first-spike latency on ${what}, ms`));
    }

    const cellList = [...cells.values()].map((c) => ({ ...c.trust, unitsNearest: c.units }));
    let expected = 0;
    let counted = 0;
    for (let u = 0; u < nU; u++) if (falseRate[u] === falseRate[u]) {
      expected += falseRate[u];
      counted++;
    }
    const freqPulses = new Array(nf).fill(0);
    for (let i = 0; i < sch.n; i++) freqPulses[sch.frequencyIndex[i]]++;
    const summary = {
      pulses: sch.n,
      frequencies: sch.frequencyKeys.map((key, f) => ({ key, hz: Number.isNaN(sch.frequencies[f]) ? null : sch.frequencies[f], pulses: freqPulses[f] })),
      lightGroups: sch.groupCount,
      lightFreeS: sch.lightFreeS,
      salt: {
        windows: sch.windows,
        windowMs: sch.windowS * 1000,
        binMs: sch.binS * 1000,
        pulsesUsed: sch.saltPulses.length,
        nullDistances: (sch.windows * (sch.windows - 1)) / 2,
        problem: sch.saltProblem || null,
        pSetting: p.saltP,
        pUsed: sch.windows > 0 ? choice.kind : null,
        pResolution: sch.windows > 0 ? choice.resolution : null,
        calibratedPResolution: sch.windows > 0 ? 1 / (sch.windows + 1) : null,
        pNote: choice.note || null,
      },
      verdicts: {
        tagged: tag.filter((t) => t === 'tagged').length,
        borderline: tag.filter((t) => t === 'borderline').length,
        untagged: tag.filter((t) => t === 'untagged').length,
      },
      trust: {
        grid: 'nodes at rates 2^k Hz (k = -3 ... 8) x ISI CV 0.5, 1, 2; each unit bilinear in (log2 rate, log2 CV) between its nodes',
        nodes: cells.size,
        seed: p.seed,
        nullSimulationsPerNode: nullSims,
        nullUnitsSimulated: nullSims * [...cells.values()].filter((c) => c.trust.nullSimulations > 0).length,
        powerSimulationsPerStep: powerSims,
        budget: p.trustBudget,
        responderModel: `one added spike per pulse with probability R at ${p.trustPowerLatencyMs} +- ${p.trustPowerJitterMs} ms (Gaussian); power ${p.trustPower}`,
        expectedFalseTagged: counted ? expected : null,
        meanFalseRate: counted ? expected / counted : null,
        cells: cellList,
      },
    };
    return { columns, summary, warnings };
  },
};
