import { solveDoubleExponential } from './solve-double-exponential';
import type { KernelEntry, MatchedPair, PublishedKinetics, SourceStatus } from './types';

interface Spec {
  name: string;
  aliases?: string[];
  family: 'calcium' | 'dopamine';
  published: PublishedKinetics;
  matched: MatchedPair;
  peakDff: number | null;
  source: string;
  preparation: string;
  status: SourceStatus;
  hillN?: { value: number; status: SourceStatus };
  note?: string;
}

const ZHANG_2023 = 'Zhang et al. (2023) Nature 615:884, one action potential (public data table)';
const ZHANG_PREP = 'cultured rat hippocampal neurons, field stimulation, 1 AP';
const CHEN_2013 = 'Chen et al. (2013) Nature 499:295';
const CHEN_PREP = 'mouse V1 layer 2/3 pyramidal neurons in vivo, 1 AP (loose-seal recording)';

const SPECS: Spec[] = [
  // Verified values: REFERENCES.md "Indicator kernels" (Zhang et al. 2023 data table).
  { name: 'jGCaMP8f', family: 'calcium', published: { halfRiseMs: 7.1, timeToPeakMs: 24.8, halfDecayMs: 67.4 }, matched: 'timeToPeak+halfDecay', peakDff: 0.41, source: ZHANG_2023, preparation: ZHANG_PREP, status: 'verified' },
  { name: 'jGCaMP8m', family: 'calcium', published: { halfRiseMs: 7.1, timeToPeakMs: 29.0, halfDecayMs: 118.3 }, matched: 'timeToPeak+halfDecay', peakDff: 0.76, source: ZHANG_2023, preparation: ZHANG_PREP, status: 'verified' },
  { name: 'jGCaMP8s', family: 'calcium', published: { halfRiseMs: 10.1, timeToPeakMs: 57.0, halfDecayMs: 306.7 }, matched: 'timeToPeak+halfDecay', peakDff: 1.11, source: ZHANG_2023, preparation: ZHANG_PREP, status: 'verified' },
  { name: 'jGCaMP7f', family: 'calcium', published: { halfRiseMs: 24.8, timeToPeakMs: 99.5, halfDecayMs: 181.9 }, matched: 'timeToPeak+halfDecay', peakDff: 0.21, source: `${ZHANG_2023} (jGCaMP7f as control); sensor from Dana et al. (2019) Nat Methods 16:649`, preparation: ZHANG_PREP, status: 'verified' },
  // From memory (REFERENCES.md ranges; midpoints taken): verify before relying on them.
  {
    name: 'jGCaMP7s', family: 'calcium', published: { timeToPeakMs: 150, halfDecayMs: 550 }, matched: 'timeToPeak+halfDecay', peakDff: null,
    source: 'Dana et al. (2019) Nat Methods 16:649', preparation: 'not recorded (values approximate, comparable to GCaMP6s in vivo)', status: 'from memory',
    note: 'Approximate kinetics recalled, not checked against the paper; supply a custom kernel for quantitative work.',
  },
  { name: 'GCaMP6f', family: 'calcium', published: { timeToPeakMs: 47.5, halfDecayMs: 145 }, matched: 'timeToPeak+halfDecay', peakDff: null, source: CHEN_2013, preparation: CHEN_PREP, status: 'from memory', hillN: { value: 2.27, status: 'from memory' } },
  { name: 'GCaMP6m', family: 'calcium', published: { timeToPeakMs: 80, halfDecayMs: 275 }, matched: 'timeToPeak+halfDecay', peakDff: null, source: CHEN_2013, preparation: CHEN_PREP, status: 'from memory', hillN: { value: 2.96, status: 'from memory' }, note: 'Time to peak not in REFERENCES.md; recalled as between 6f and 6s.' },
  { name: 'GCaMP6s', family: 'calcium', published: { timeToPeakMs: 175, halfDecayMs: 525 }, matched: 'timeToPeak+halfDecay', peakDff: null, source: CHEN_2013, preparation: CHEN_PREP, status: 'from memory', hillN: { value: 2.9, status: 'from memory' } },
  // Dopamine sensors: published on/off time constants of the sensor to applied dopamine (from memory).
  {
    name: 'dLight1', aliases: ['dLight1.1', 'dLight1.2'], family: 'dopamine', published: { tauOnMs: 10, tauOffMs: 95 }, matched: 'tauOn+tauOff', peakDff: null,
    source: 'Patriarchi et al. (2018) Science 360:eaat4422', preparation: 'sensor kinetics to applied dopamine (tau_on ~10 ms, tau_off ~90-100 ms)', status: 'from memory',
    note: 'Sensor kinetics only: release, diffusion and reuptake add their own time course, so as a per-spike kernel this is illustrative.',
  },
  { name: 'GRAB-DA1m', family: 'dopamine', published: { tauOnMs: 60, tauOffMs: 700 }, matched: 'tauOn+tauOff', peakDff: null, source: 'Sun et al. (2018) Cell 174:481', preparation: 'sensor kinetics to applied dopamine', status: 'from memory', note: 'Sensor kinetics only; illustrative as a per-spike kernel.' },
  { name: 'GRAB-DA1h', family: 'dopamine', published: { tauOnMs: 140, tauOffMs: 2500 }, matched: 'tauOn+tauOff', peakDff: null, source: 'Sun et al. (2018) Cell 174:481', preparation: 'sensor kinetics to applied dopamine', status: 'from memory', note: 'Sensor kinetics only; illustrative as a per-spike kernel.' },
  { name: 'GRAB-DA2m', family: 'dopamine', published: { tauOnMs: 40, tauOffMs: 1300 }, matched: 'tauOn+tauOff', peakDff: null, source: 'Sun et al. (2020) Nat Methods 17:1156', preparation: 'sensor kinetics to applied dopamine', status: 'from memory', note: 'Sensor kinetics only; illustrative as a per-spike kernel.' },
];

function derive(s: Spec): KernelEntry {
  let tau: { tauRiseS: number; tauDecayS: number };
  const p = s.published;
  if (s.matched === 'tauOn+tauOff') tau = { tauRiseS: p.tauOnMs! / 1000, tauDecayS: p.tauOffMs! / 1000 };
  else if (s.matched === 'timeToPeak+halfDecay') tau = solveDoubleExponential({ timeToPeakS: p.timeToPeakMs! / 1000, halfDecayS: p.halfDecayMs! / 1000 });
  else tau = solveDoubleExponential({ halfRiseS: p.halfRiseMs! / 1000, halfDecayS: p.halfDecayMs! / 1000 });
  if (!(tau.tauRiseS > 0 && tau.tauDecayS > tau.tauRiseS)) throw new Error(`kernel library: ${s.name} has no two-exponential solution`);
  const { aliases: _a, ...rest } = s;
  return { ...rest, ...tau };
}

/**
 * The indicator library: each entry's rise/decay constants are derived here,
 * at load, from the two published quantities it names (`matched`), so the
 * table and its derivation cannot drift apart. Markers per REFERENCES.md:
 * jGCaMP8f/m/s and jGCaMP7f verified; the rest from memory.
 */
export const KERNEL_LIBRARY: readonly KernelEntry[] = SPECS.map(derive);

const BY_NAME = new Map<string, KernelEntry>();
SPECS.forEach((s, i) => {
  for (const n of [s.name, ...(s.aliases ?? [])]) BY_NAME.set(n.toLowerCase(), KERNEL_LIBRARY[i]);
});

/** Library entry by name or alias, case-insensitive; undefined when unknown. */
export function findKernelEntry(name: string): KernelEntry | undefined {
  return BY_NAME.get(name.trim().toLowerCase());
}
