/**
 * Light-identification benchmark (DESIGN.md section 7 reference session: 1,000 units,
 * ~2 h, 10,000 pulses). Prints timings; tests never time.
 *
 *   npx tsx bench/light-bench.ts [--units 1000] [--full] [--session]
 *
 * Spikes: gamma renewal trains (core/sim/renewal-train.ts), rates log-uniform 0.5-20 Hz;
 * pulses: the simulator's benchmark light block (2,000 single pulses, 400 trains of 10 at
 * 10 Hz and 400 at 20 Hz). Timed: the schedule, the per-unit engine (first-spike scan,
 * SALT, count test; detail off and on), the trust simulation of three grid nodes, and
 * with --full the whole light step (including every trust node). Wall and CPU time.
 * --session: also the light step on the cached reference session of `npm run bench`
 * (bench/bench-session.ts; written once if missing), three times in this process (the
 * first includes compiling the code), as `step light` there measures it.
 */
import { DEFAULTS, type Parameters } from '../core/defaults';
import { createLightScratch, lightResponse } from '../core/light/light-response';
import { lightSchedule } from '../core/light/light-schedule';
import { lightStep } from '../core/light/light-step';
import { loadSession } from '../core/node/load-session';
import { resolveParameters } from '../core/resolve-parameters';
import { ensureBenchSession } from './bench-session';
import { ruleTrust } from '../core/light/rule-trust';
import { simulationIntervals } from '../core/light/simulation-intervals';
import { emptyEvents, emptyTrials } from '../core/model/empty';
import type { Recording, Unit } from '../core/model/types';
import { Rng } from '../core/random/rng';
import { benchScenario } from '../core/sim/bench-scenario';
import { lightSchedule as simLightSchedule } from '../core/sim/light-schedule';
import { renewalTrain } from '../core/sim/renewal-train';

const arg = (name: string, def: number) => {
  const i = process.argv.indexOf(name);
  return i >= 0 ? Number(process.argv[i + 1]) : def;
};
const nUnits = arg('--units', 1000);
const full = process.argv.includes('--full');
const p: Parameters = JSON.parse(JSON.stringify(DEFAULTS));
// Wall time and this process's CPU time (user + system) since the mark: the CPU figure is
// less disturbed by other processes on a shared machine; say the load (uptime) beside both.
let cpu0 = process.cpuUsage();
const mark = () => {
  cpu0 = process.cpuUsage();
  return performance.now();
};
const ms = (t0: number) => {
  const c = process.cpuUsage(cpu0);
  return `${(performance.now() - t0).toFixed(0)} ms (CPU ${((c.user + c.system) / 1000).toFixed(0)} ms)`;
};

const spanS = 7200;
let t0 = mark();
const light = simLightSchedule(benchScenario(7, 10).light!, spanS - 1500, new Rng(3));
const rng = new Rng(11);
const units: Unit[] = [];
let spikes = 0;
for (let u = 0; u < nUnits; u++) {
  const rate = Math.exp(Math.log(0.5) + Math.log(40) * rng.uniform());
  const t = renewalTrain(rng, rate, 0, spanS, 0.5 + 4 * rng.uniform());
  spikes += t.length;
  units.push({ id: String(u), spikeTimes: t, meta: {} });
}
console.log(`data: ${nUnits} units, ${(spikes / 1e6).toFixed(1)} M spikes, ${light.pulses.onset.length} pulses (${ms(t0)} to simulate)`);

t0 = mark();
const sch = lightSchedule(light.pulses, [0, spanS], p.light);
console.log(`schedule: ${ms(t0)} (SALT windows ${sch.windows}, pulses in SALT ${sch.saltPulses.length})`);

const scratch = createLightScratch();
for (const detail of [false, true]) {
  t0 = mark();
  let sink = 0;
  for (const u of units) sink += lightResponse(u.spikeTimes, sch, p.light, detail, scratch).reliability;
  console.log(`engine (scan + SALT + count test), detail ${detail}: ${ms(t0)} for ${nUnits} units x ${sch.n} pulses (checksum ${sink.toFixed(3)})`);
}

const iv = simulationIntervals(sch, p.light.offsetWindowMs / 1000);
for (const [rate, cv] of [[1, 1], [4, 0.5], [16, 2]] as const) {
  t0 = mark();
  const t = ruleTrust(sch, iv, rate, cv, p.light);
  console.log(`trust node ${t.rateHz} Hz, CV ${t.cv}: ${ms(t0)} (${t.nullSimulations} null (${t.screenedOut} stopped at the excess-reliability screens) + power search; false rate ${t.falseRate}, min detectable reliability ${t.minDetectableReliability})`);
}

if (full) {
  const rec: Recording = { units, pulses: light.pulses, events: emptyEvents(), trials: emptyTrials(), span: [0, spanS], spanSource: 'inputs', waveformSampleRateHz: NaN };
  t0 = mark();
  const res = lightStep.run({ recording: rec, parameters: p, columns: new Map() });
  const tr = (res.summary as { trust: { cells: unknown[]; nullSimulationsPerNode: number; powerSimulationsPerStep: number } }).trust;
  console.log(`full light step: ${ms(t0)} (${tr.cells.length} trust nodes, ${tr.nullSimulationsPerNode} null units and ${tr.powerSimulationsPerStep} responders per power step each)`);
}

if (process.argv.includes('--session')) {
  const bs = ensureBenchSession(7, 1000, (m) => console.log(m));
  const imp = await loadSession(bs.npyDir);
  const parameters = resolveParameters(imp.parameterSources);
  const rec = imp.recording;
  let nSpikes = 0;
  for (const u of rec.units) nSpikes += u.spikeTimes.length;
  for (let k = 1; k <= 3; k++) {
    t0 = mark();
    const res = lightStep.run({ recording: rec, parameters, columns: new Map() });
    const tr = (res.summary as { trust: { nodes: number } }).trust;
    console.log(`light step on the reference session (${rec.units.length} units, ${(nSpikes / 1e6).toFixed(1)} M spikes, ${rec.pulses.onset.length} pulses, ${tr.nodes} trust nodes), run ${k}: ${ms(t0)}`);
  }
}
