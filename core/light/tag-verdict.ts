import type { Parameters } from '../defaults';
import { formatNumber } from '../table/format-number';
import type { ArtefactFlag } from './artefact-flags';
import { formatP } from './format-p';
import type { LightResponse } from './light-response';
import { ruleSaltP } from './rule-salt-p';
import { saltPChoice } from './salt-p-choice';

/** Verdict word of the contract (DESIGN.md section 3) and its reason. */
export interface TagVerdict {
  readonly tag: 'tagged' | 'borderline' | 'untagged';
  readonly reason: string;
}

/**
 * The identification rule (DESIGN.md section 4, configurable in parameters.light):
 *
 * `tagged` when all hold: SALT p < alphaSalt; an excitatory answer (reliability
 * above the baseline windows' spike probability); mean first-spike latency
 * <= maxLatencyMs, and so is the baseline-corrected latency of the excess
 * answers (an indirect answer diluted by early spontaneous spikes must not
 * pass); excess reliability >= minEvokedReliability; waveform r >= minWaveformR
 * when waveforms exist; no artefact flag.
 *
 * The documented SALT pitfall (REFERENCES.md) is handled on purpose: when the
 * count test finds an excitatory answer (p < alphaCount, excess reliability
 * >= minEvokedReliability) while SALT's test distance is not above its null
 * median, SALT is blind to it (its support restriction scores an answer that
 * fills classes the baseline never visits as identical to baseline, p up to 1),
 * and the count test stands in for SALT; every other criterion still applies,
 * so a zero-jitter answer stays `borderline` (artefact signature).
 *
 * `borderline`: significant and excitatory but failing any criterion above
 * (late / indirect, unreliable, poor waveform match, artefact suspect); or SALT
 * cannot run, or its chosen p cannot reach alphaSalt on this schedule
 * (light.saltP = 'calibrated' with 1 / (J + 1) >= alphaSalt), and the count
 * test finds an excitatory answer.
 *
 * `untagged`: everything else, including light-inhibited units (SALT
 * significant with fewer answers than baseline) and sessions without pulses
 * ("no laser pulses").
 *
 * SALT p: the one saltPChoice picks for the schedule (light.saltP; 'auto':
 * the rank-calibrated p when 1 / (J + 1) < alphaSalt, else the published p);
 * the reason names it and, when the choice needs explaining (too few
 * baseline windows), says why.
 *
 * Reason: "p=0.0004 (published SALT), latency 3.1 ms, jitter 0.6 ms,
 * reliability 0.62", led by what failed. A p at the test's resolution is
 * written with it, never as 0: "p<=0.0099 (calibrated SALT; resolution
 * 1/101)", "p<0.0002 (published SALT; resolution 1/4950)".
 */
export function tagVerdict(r: LightResponse, waveformR: number, flags: readonly ArtefactFlag[], p: Parameters['light'], saltProblem = ''): TagVerdict {
  if (r.pulses === 0) return { tag: 'untagged', reason: 'no laser pulses' };
  const f = (x: number, d = 2) => (Number.isNaN(x) ? 'n/a' : formatNumber(x, d));
  const choice = saltPChoice(r.saltWindows, p);
  const saltP = ruleSaltP(r, choice.kind);
  const res = choice.kind === 'calibrated' ? 1 / r.salt.rows : 1 / r.salt.nullCount;
  const atRes = saltP <= res * (1 + 1e-12);
  const pText = Number.isNaN(saltP)
    ? 'SALT not run'
    : `${formatP(saltP, res, 0, choice.kind === 'published', 3)} (${choice.kind} SALT${atRes ? `; resolution 1/${choice.kind === 'calibrated' ? r.salt.rows : r.salt.nullCount}` : ''})`;
  const why = choice.note && !Number.isNaN(saltP) ? `; ${choice.note}` : '';
  const facts = `${pText}, latency ${f(r.meanLatencyS * 1000)} ms, jitter ${f(r.jitterS * 1000)} ms, reliability ${f(r.reliability)}${why}`;
  const excess = r.reliability - r.baselineReliability;
  const excitatory = Number.isNaN(r.baselineReliability) ? r.countP < p.alphaCount : excess > 0;
  if (Number.isNaN(saltP)) {
    const notRun = saltProblem || 'SALT not run';
    if (excitatory && r.countP < p.alphaCount) return { tag: 'borderline', reason: `${notRun}; count test ${formatP(r.countP)}; ${facts}` };
    return { tag: 'untagged', reason: `${notRun}; ${facts}` };
  }
  if (!choice.canPass) {
    // The chosen p cannot reach alphaSalt on this schedule: as when SALT cannot run.
    if (excitatory && r.countP < p.alphaCount) return { tag: 'borderline', reason: `SALT cannot decide; count test ${formatP(r.countP)}; ${facts}` };
    return { tag: 'untagged', reason: `SALT cannot decide; ${facts}` };
  }
  const sig = saltP < p.alphaSalt;
  if (sig && !excitatory) {
    return { tag: 'untagged', reason: `light-inhibited (reliability ${f(r.reliability)} vs baseline ${f(r.baselineReliability)}); ${facts}` };
  }
  // The documented SALT pitfall: its support restriction scores an answer that
  // puts (nearly) every pulse in classes the baseline windows never visit as
  // identical to baseline. The count test then stands in for SALT.
  const saltBlind = !sig && excitatory && r.countP < p.alphaCount && excess >= p.minEvokedReliability && !(r.salt.testDistance > r.salt.nullMedian);
  if (sig || saltBlind) {
    const fails: string[] = [];
    const late = r.meanLatencyS * 1000 > p.maxLatencyMs;
    const lateEvoked = r.evokedLatencyS * 1000 > p.maxLatencyMs;
    if (late || lateEvoked) {
      fails.push(`late answer (${late ? `mean latency ${f(r.meanLatencyS * 1000)} ms` : `excess spikes at ${f(r.evokedLatencyS * 1000)} ms`} > ${p.maxLatencyMs} ms; indirect?)`);
    }
    if (!(excess >= p.minEvokedReliability)) fails.push(`unreliable (excess reliability ${f(excess)} < ${p.minEvokedReliability})`);
    for (const fl of flags) if (fl.code !== 'waveform-mismatch') fails.push(`artefact suspect: ${fl.text}`);
    if (waveformR < p.minWaveformR) fails.push(`waveform match r=${f(waveformR)} < ${p.minWaveformR}`);
    const blind = saltBlind
      ? `SALT blind to this answer (test distance ${f(r.salt.testDistance, 3)} <= null median: support restriction), count test ${formatP(r.countP)} used instead; `
      : '';
    if (fails.length === 0) return { tag: 'tagged', reason: `${blind}${facts}` };
    return { tag: 'borderline', reason: `${fails.join('; ')}; ${blind}${facts}` };
  }
  return { tag: 'untagged', reason: `no significant light answer; ${facts}` };
}
