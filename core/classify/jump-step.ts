import type { AnalysisStep } from '../pipeline/types';
import type { Column } from '../table/types';
import { classifyJumps } from './classify-jumps';
import { columnSafe } from './column-safe';

/**
 * Pipeline step "jump": for each jump kind K (the `kind` column of the jump
 * events, "all" when absent) the contract columns jump_K, jump_K_delta_hz,
 * jump_K_p, then jump_K_q, jump_K_reason, jump_K_shape and the latency, peak,
 * late-window and size figures. A session without jump events gets no jump
 * columns (the contract asks for kinds present) and a note in run.json.
 */
export const jumpStep: AnalysisStep = {
  name: 'jump',
  selfContained: true,
  run({ recording, parameters }) {
    const jp = parameters.jump;
    const r = classifyJumps(recording, jp);
    const columns: Column[] = [];
    const used = new Set<string>();
    for (const k of r.kinds) {
      let K = columnSafe(k.kind);
      while (used.has(K)) K += '_';
      used.add(K);
      const num = (suffix: string, description: string, pick: (i: number) => number): Column => ({
        name: `jump_${K}_${suffix}`,
        kind: 'number',
        values: Float64Array.from(k.units, (_, i) => pick(i)),
        description,
      });
      columns.push(
        { name: `jump_${K}`, kind: 'string', values: k.verdict, description: `Answer to "${k.kind || jp.event}" jumps: excited, suppressed or none (BH q < ${jp.alpha})` },
        num('delta_hz', 'Mean change after the jump, [post) minus [pre), minus the matched control change, Hz', (i) => k.units[i].deltaHz),
        num('p', 'Two-sided p of the answer: rank-sum (Mann-Whitney) of the per-jump changes against reference-trial changes at the jumps\' times-in-trial; signed-rank of the per-jump changes when there is no matched control', (i) => k.units[i].p),
        num('q', 'Benjamini-Hochberg adjustment across units (this kind)', (i) => k.q[i]),
        { name: `jump_${K}_reason`, kind: 'string', values: k.reason, description: 'Why the jump verdict was given' },
        { name: `jump_${K}_shape`, kind: 'string', values: k.shape, description: 'transient, partial, step or unclear (empty when none)' },
        num('late_delta_hz', 'Mean controlled change in the late window, Hz', (i) => k.units[i].lateDeltaHz),
        num('transience', '(early - late) / (|early| + |late|): 1 returns to baseline, 0 lasting step', (i) => k.units[i].transience),
        num('peak_delta_hz', 'Peak change of the control-subtracted PSTH in the answer window, Hz', (i) => k.units[i].peakDeltaHz),
        num('peak_z', 'Peak change in SDs of the pre-window PSTH bins', (i) => k.units[i].peakZ),
        num('peak_ms', 'Time of the peak after the jump, ms', (i) => k.units[i].peakS * 1000),
        num('latency_ms', `Answer onset: first of ${jp.latencyRunBins} bins beyond ${jp.zThreshold} SD, ms`, (i) => k.units[i].latencyS * 1000),
        num('n_events', 'Jumps of this kind', (i) => k.units[i].nEvents),
      );
      if (k.hasSize) {
        columns.push(
          num('size_rho', `Spearman rho of the controlled change vs jump size ("${jp.sizeCovariate}")`, (i) => k.units[i].sizeRho),
          num('size_p', 'Two-sided p of size_rho', (i) => k.units[i].sizeP),
        );
      }
    }
    const uncontrolled = r.kinds.reduce((s, k) => s + k.nEvents - k.nControlled, 0);
    // Some jump events carry a kind and some do not: the unkinded ones form their own group "all".
    const unkinded = r.kinds.length > 1 ? r.kinds.find((k) => k.kind === '') : undefined;
    return {
      columns,
      summary: {
        event: jp.event,
        note: r.note,
        windowsS: { pre: [jp.preStartS, jp.preEndS], post: [jp.postStartS, jp.postEndS], late: [jp.lateStartS, jp.lateEndS] },
        controlCondition: jp.controlCondition,
        referenceTrials: r.nReferenceTrials,
        alpha: jp.alpha,
        kinds: r.kinds.map((k) => ({
          kind: k.kind,
          events: k.nEvents,
          controlledEvents: k.nControlled,
          referenceSamples: k.nReferenceSamples,
          test: k.nReferenceSamples > 0 ? 'rank-sum against reference-trial samples' : 'signed-rank, no matched control',
          excited: k.verdict.filter((v) => v === 'excited').length,
          suppressed: k.verdict.filter((v) => v === 'suppressed').length,
          none: k.verdict.filter((v) => v === 'none').length,
        })),
      },
      warnings: [
        ...(uncontrolled > 0
          ? [{
              code: 'jump-uncontrolled',
              message: `${uncontrolled} jump${uncontrolled === 1 ? '' : 's'} had no matched control (no trial, no reference trials, or reference trials too short); their changes are used without control.`,
              count: uncontrolled,
            }]
          : []),
        ...(unkinded
          ? [{
              code: 'jump-kind-missing',
              message: `${unkinded.nEvents} "${jp.event}" events have no kind while the others do; they are analysed as their own group (columns jump_all_*). Give every jump its kind in events.csv.`,
              count: unkinded.nEvents,
            }]
          : []),
      ],
    };
  },
};
