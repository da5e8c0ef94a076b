/**
 * Writes the bundled demo session, deterministically from a fixed seed:
 *   sample-data/demo/          the session folder (CSV form, README "Input formats")
 *   sample-data/demo-truth.csv what the simulator put into every unit
 *   sample-data/README.md      how it was made and what a run should show
 * Run: npm run demo  (optional: --seed N --out DIR, for other sessions of
 * the same scenario; the bundled demo uses the defaults).
 */
import { mkdirSync, writeFileSync } from 'node:fs';
import { join, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';
import { writeOutputFolder } from '../core/node/write-output-folder';
import { DEMO_SEED, demoScenario } from '../core/sim/demo-scenario';
import { sessionFiles, type SessionFile } from '../core/sim/session-files';
import { simulateSession } from '../core/sim/simulate-session';
import { SIMULATOR_VERSION } from '../core/sim/simulator-version';
import { truthTable } from '../core/sim/truth-table';
import type { SimulatedSession, UnitTruth } from '../core/sim/types';
import { DEFAULTS } from '../core/defaults';

export interface DemoBuild {
  readonly sim: SimulatedSession;
  /** Files of the session folder. */
  readonly session: SessionFile[];
  readonly truthCsv: string;
  readonly readme: string;
}

export function buildDemo(seed = DEMO_SEED): DemoBuild {
  const sim = simulateSession(demoScenario(seed));
  const session = sessionFiles(sim, {
    spikes: 'csv',
    description:
      'Invented demo session: head-fixed mouse, auditory countdown with jumps, 64-channel probe in the dorsal raphe, 6-minute light block. ' +
      `Simulated by tagbench's seeded simulator (version ${SIMULATOR_VERSION}, seed ${seed}); no real recording.`,
  });
  return { sim, session, truthCsv: truthTable(sim.truth), readme: demoReadme(sim, seed, session) };
}

const ids = (ts: readonly UnitTruth[]) => (ts.length ? ts.map((t) => t.unit).join(', ') : '(none)');
const f1 = (x: number) => x.toFixed(1);
const f2 = (x: number) => x.toFixed(2);

export function demoReadme(sim: SimulatedSession, seed: number, session: readonly SessionFile[]): string {
  const rec = sim.recording;
  const T = sim.truth;
  const span = rec.span[1] - rec.span[0];
  const spikes = rec.units.reduce((a, u) => a + u.spikeTimes.length, 0);
  const singles = Array.from(rec.pulses.frequencyHz).filter((f) => Number.isNaN(f)).length;
  const trainFreqs = [...new Set(Array.from(rec.pulses.frequencyHz).filter((f) => !Number.isNaN(f)))];
  const trainsAt = (f: number) => new Set(Array.from(rec.pulses.train).filter((_, i) => rec.pulses.frequencyHz[i] === f)).size;
  const conds = new Map<string, number>();
  for (const c of rec.trials.condition) conds.set(c, (conds.get(c) ?? 0) + 1);
  const jumps = new Map<string, number>();
  rec.events.label.forEach((l, i) => l === 'jump' && jumps.set(rec.events.kind[i], (jumps.get(rec.events.kind[i]) ?? 0) + 1));
  const by = (c: string) => T.filter((t) => t.lightClass === c);
  const direct = by('direct');
  const maxLat = DEFAULTS.light.maxLatencyMs;
  const hard = direct.filter((t) => t.latencyMs > maxLat || t.reliability < 0.3);
  const size = (f: SessionFile) => (typeof f.data === 'string' ? new TextEncoder().encode(f.data).length : f.data.length);
  const kinds = [...new Set(T.flatMap((t) => Object.keys(t.jump)))].sort();
  const L: string[] = [];
  L.push('# Sample data: the demo session');
  L.push('');
  L.push('Everything here is **simulated** by tagbench\'s own seeded simulator (`core/sim`) for an **invented** scenario;');
  L.push('it is not a recording and holds no real data. This file is written by `npm run demo` together with the data;');
  L.push('do not edit it by hand.');
  L.push('');
  L.push('## The invented scenario');
  L.push('');
  L.push('A head-fixed mouse does an auditory countdown: a tone sweeps up in pitch for 4 s and a drop of sweetened water');
  L.push('(`reward`) follows at the top. On `fast` trials the sweep lasts 2.5 s. On `probe` trials the sweep jumps ahead');
  L.push('(`jump`, kind `forward`: reward comes 1.5 s early) or back (kind `backward`: 1.5 s late). Units come from a');
  L.push('64-channel probe in the dorsal raphe of a mouse whose serotonergic neurons carry a light-gated cation channel; a');
  L.push('light block ends the session: 5 ms blue pulses, single pulses near 1 Hz, then 10-pulse trains at 10 and 20 Hz.');
  L.push('');
  L.push('## How it was generated');
  L.push('');
  L.push('```');
  L.push('npm run demo        # scripts/make-demo.ts');
  L.push('```');
  L.push('');
  L.push(`Seed ${seed}, simulator version ${SIMULATOR_VERSION}, scenario \`demoScenario()\` in core/sim/demo-scenario.ts`);
  L.push('(population from `populationUnits(48, seed, DEMO_MIX)`). The same command always writes the same bytes;');
  L.push('a test (test/scripts/make-demo.test.ts) regenerates the demo and compares it with the committed files.');
  L.push('');
  L.push('## Files');
  L.push('');
  L.push('| file | holds |');
  L.push('|---|---|');
  const desc: Record<string, string> = {
    'spikes.csv': `\`unit,time\`: ${spikes} spikes of ${rec.units.length} units, in time order, seconds (6 decimals; times on a 30 kHz clock)`,
    'pulses.csv': `\`onset,duration,train,frequency,power\`: ${rec.pulses.onset.length} pulses (s, s, train id, Hz or empty for single pulses, mW)`,
    'events.csv': `\`time,event,trial,kind\`: ${rec.events.time.length} events (\`sweep_on\`, \`jump\` with kind \`forward\`/\`backward\`, \`reward\`)`,
    'trials.csv': `\`trial,start,stop,condition,sweep_s,jump_shift_s\`: ${rec.trials.trial.length} trials`,
    'unit_info.csv': '`unit,channel,depth_um`: peak channel and depth of each unit',
    'waveforms.npy': `mean waveform per unit (float64, ${rec.units.length} x ${sim.spec.waveformSamples} samples at ${sim.spec.waveformSampleRateHz} Hz, microvolts; row r = unit_info row r)`,
    'session.json': `recording span [0, ${f2(rec.span[1])}] s, waveform file and sample rate, description`,
  };
  for (const f of session) L.push(`| demo/${f.name} (${(size(f) / 1024).toFixed(0)} KiB) | ${desc[f.name] ?? ''} |`);
  L.push('| demo-truth.csv | what the simulator put into each unit (outside the session folder, so the app does not read it) |');
  L.push('');
  L.push('## What is in it');
  L.push('');
  L.push(`- Span ${f1(span)} s (${f1(span / 60)} min); ${rec.units.length} units; ${spikes} spikes.`);
  L.push(`- Trials: ${[...conds].map(([c, n]) => `${n} \`${c}\``).join(', ')}; jumps: ${[...jumps].map(([k, n]) => `${n} \`${k}\``).join(', ')}.`);
  L.push(`- Pulses: ${singles} single pulses, then ${trainFreqs.map((f) => `${trainsAt(f)} trains at ${f} Hz`).join(' and ')} (10 pulses each), 5 ms, 5 mW.`);
  L.push('');
  L.push('## What a run should show (by unit id)');
  L.push('');
  L.push('These are the simulated truths. The analyses are statistical screens: a weak or late simulated responder can');
  L.push('honestly come out `borderline` or `untagged`, and noise can make a flat unit look like a weak ramp.');
  L.push('');
  L.push('Light (the default test window and identification rule, README "Light identification"):');
  L.push('');
  L.push(`- **Direct (light-identified)**: ${ids(direct)}. Nominal latency / jitter / reliability on single pulses:`);
  for (const t of direct) L.push(`  - unit ${t.unit}: ${f1(t.latencyMs)} ms / ${f1(t.jitterMs)} ms / ${f2(t.reliability)}, spontaneous ${f1(t.rateHz)} Hz`);
  L.push(`- Expected hard cases among them (latency above the rule's ${maxLat} ms, or reliability below 0.3): ${ids(hard)}.`);
  L.push(`- **Indirect (synaptic, late, must not count as identified)**: ${ids(by('indirect'))}`);
  for (const t of by('indirect')) L.push(`  - unit ${t.unit}: ${f1(t.latencyMs)} ms / ${f1(t.jitterMs)} ms / ${f2(t.reliability)}`);
  L.push(`- **Light-inhibited**: ${ids(by('inhibited'))}`);
  L.push(`- **Photoelectric artefact** (onset/offset-locked, near-zero jitter, unlike a spike): ${ids(by('artefact'))}`);
  L.push(`- No light answer: ${ids(by('none'))}`);
  L.push('');
  L.push('Ramp before reward (`standard` trials, [-3, 0) s; slope of the expected rate computed exactly from the simulated rate):');
  L.push('');
  for (const dir of ['up', 'down'] as const) {
    const us = T.filter((t) => t.ramp === dir);
    L.push(`- **${dir}**: ${us.map((t) => `${t.unit} (${f2(t.rampSlopeHzPerS)} Hz/s)`).join(', ') || '(none)'}`);
  }
  L.push(`- flat: all others.`);
  L.push('');
  L.push('Jumps ([0, 0.3) s vs [-0.3, 0) s around `jump`; "ramp" means a ramping unit following the sweep\'s jump with a lasting step):');
  L.push('');
  for (const k of kinds) {
    for (const a of ['excited', 'suppressed'] as const) {
      const us = T.filter((t) => t.jump[k]?.answer === a);
      L.push(`- \`${k}\` **${a}**: ${us.map((t) => `${t.unit} (${t.jump[k].mechanism}, ${t.jump[k].expectedDeltaHz >= 0 ? '+' : ''}${f2(t.jump[k].expectedDeltaHz)} Hz)`).join(', ') || '(none)'}`);
    }
  }
  L.push('- all others: none.');
  L.push('');
  L.push('Some units also answer reward delivery (after the ramp window) and every unit drifts slowly (SD of log rate up to 0.15');
  L.push('over 30 s steps); see demo-truth.csv for every number, and core/sim/population-units.ts for the ranges drawn from.');
  L.push('');
  return L.join('\n');
}

function main(): void {
  const args = process.argv.slice(2);
  const opt = (name: string) => {
    const i = args.indexOf(name);
    return i >= 0 ? args[i + 1] : undefined;
  };
  const root = resolve(fileURLToPath(import.meta.url), '../..');
  const seed = opt('--seed') !== undefined ? Number(opt('--seed')) : DEMO_SEED;
  const outRoot = resolve(opt('--out') ?? join(root, 'sample-data'));
  const t0 = performance.now();
  const demo = buildDemo(seed);
  mkdirSync(outRoot, { recursive: true });
  writeOutputFolder(join(outRoot, 'demo'), Object.fromEntries(demo.session.map((f) => [f.name, f.data])), { replace: 'any' });
  writeFileSync(join(outRoot, 'demo-truth.csv'), demo.truthCsv);
  writeFileSync(join(outRoot, 'README.md'), demo.readme);
  console.log(`demo session written to ${join(outRoot, 'demo')} (seed ${seed}, ${((performance.now() - t0) / 1000).toFixed(1)} s)`);
}

if (process.argv[1] && resolve(process.argv[1]) === fileURLToPath(import.meta.url)) main();
