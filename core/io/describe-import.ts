/**
 * A readable summary of an imported session (the `inspect` command; the app
 * can show the same text): inputs, span, units and spikes, laser pulses and
 * trains, events by label (and kind), trials by condition, metadata,
 * waveforms, raw voltage, warnings. Plain text, one fact per line.
 */
import type { ImportResult } from './import-result';

export function describeImport(r: ImportResult): string {
  const rec = r.recording;
  const out: string[] = [];
  const n = (x: number) => x.toLocaleString('en-US');
  const s = (x: number, d = 3) => String(Number(x.toPrecision(d + 3)));
  out.push(`Session: ${r.name} (${r.sourceKind === 'nwb' ? 'NWB file' : 'folder'})`);
  out.push(`Inputs: ${r.inputs.map((f) => `${f.file} (${bytes(f.bytes)})`).join(', ')}`);
  const [t0, t1] = rec.span;
  const from = rec.spanSource === 'inputs' ? 'latest time in the inputs' : rec.spanSource === 'manifest' ? 'set by the parameters' : 'NWB observation intervals';
  out.push(`Span: ${s(t0)} to ${s(t1)} s (${duration(t1 - t0)}; ${from})`);

  const counts = rec.units.map((u) => u.spikeTimes.length).sort((a, b) => a - b);
  const total = counts.reduce((a, b) => a + b, 0);
  const len = t1 - t0;
  out.push(`Units: ${rec.units.length}; spikes: ${n(total)}`);
  if (counts.length) {
    const med = counts.length % 2 ? counts[(counts.length - 1) / 2] : (counts[counts.length / 2 - 1] + counts[counts.length / 2]) / 2;
    out.push(`  spikes per unit: min ${n(counts[0])}, median ${n(med)}, max ${n(counts[counts.length - 1])}; median rate ${s(med / len, 2)} Hz`);
  }
  const metaKeys = new Set<string>();
  for (const u of rec.units) for (const k of Object.keys(u.meta)) metaKeys.add(k);
  if (metaKeys.size) out.push(`  unit metadata: ${[...metaKeys].join(', ')}`);
  const withW = rec.units.filter((u) => u.waveformMean);
  if (withW.length) out.push(`  mean waveforms: ${withW.length} units x ${withW[0].waveformMean!.length} samples at ${s(rec.waveformSampleRateHz)} Hz`);

  const p = rec.pulses;
  if (p.onset.length === 0) out.push('Laser pulses: none');
  else {
    const trains = new Map<number, { n: number; f: number }>();
    for (let i = 0; i < p.onset.length; i++) {
      const t = trains.get(p.train[i]) ?? { n: 0, f: p.frequencyHz[i] };
      t.n++;
      trains.set(p.train[i], t);
    }
    let singles = 0;
    const byKind = new Map<string, { trains: number; pulses: number }>();
    for (const t of trains.values()) {
      if (t.n === 1) singles++;
      else {
        const key = Number.isFinite(t.f) ? `${s(t.f, 2)} Hz` : 'unknown frequency';
        const e = byKind.get(key) ?? { trains: 0, pulses: 0 };
        e.trains++;
        e.pulses += t.n;
        byKind.set(key, e);
      }
    }
    const durs = Array.from(p.duration).filter((d) => d === d);
    const range = (v: number[], k: number, unit: string) => {
      const lo = s(Math.min(...v) * k, 2);
      const hi = s(Math.max(...v) * k, 2);
      return lo === hi ? `${lo} ${unit}` : `${lo} to ${hi} ${unit}`;
    };
    const durText = durs.length ? `; duration ${range(durs, 1000, 'ms')}` : '; duration not given';
    const pw = Array.from(p.powerMw).filter((d) => d === d);
    const pwText = pw.length ? `; power ${range(pw, 1, 'mW')}` : '';
    out.push(`Laser pulses: ${n(p.onset.length)}, ${s(p.onset[0])} to ${s(p.onset[p.onset.length - 1])} s${durText}${pwText}`);
    out.push(`  single pulses: ${n(singles)}`);
    for (const [k, e] of [...byKind].sort()) out.push(`  trains at ${k}: ${e.trains} (${n(e.pulses)} pulses)`);
  }

  const ev = rec.events;
  if (ev.time.length === 0) out.push('Events: none');
  else {
    const labels = new Map<string, Map<string, number>>();
    ev.label.forEach((l, i) => {
      const m = labels.get(l) ?? new Map<string, number>();
      m.set(ev.kind[i], (m.get(ev.kind[i]) ?? 0) + 1);
      labels.set(l, m);
    });
    out.push(`Events: ${n(ev.time.length)}`);
    for (const [l, kinds] of [...labels].sort((a, b) => (a[0] < b[0] ? -1 : 1))) {
      const total = [...kinds.values()].reduce((a, b) => a + b, 0);
      const named = [...kinds].filter(([k]) => k !== '');
      out.push(`  ${l}: ${n(total)}${named.length ? ` (kind ${named.map(([k, c]) => `${k} ${n(c)}`).join(', ')})` : ''}`);
    }
  }

  const tr = rec.trials;
  if (tr.trial.length === 0) out.push('Trials: none');
  else {
    const cond = new Map<string, number>();
    for (const c of tr.condition) cond.set(c, (cond.get(c) ?? 0) + 1);
    out.push(`Trials: ${n(tr.trial.length)}`);
    for (const [c, k] of [...cond].sort()) out.push(`  ${c === '' ? '(no condition)' : c}: ${n(k)}`);
    const cov = Object.keys(tr.covariates);
    if (cov.length) out.push(`  covariates: ${cov.join(', ')}`);
  }
  if (rec.behaviour) {
    const b = rec.behaviour;
    const m = b.time.length;
    out.push(`Behaviour: ${n(m)} samples, ${s(b.time[0])} to ${s(b.time[m - 1])} s (median interval ${s(medianStep(b.time) * 1000)} ms); variables: ${[...b.variables.keys()].join(', ')}`);
  }
  if (rec.raw) {
    const r2 = rec.raw;
    out.push(`Raw voltage: ${r2.file}, ${r2.channelCount} channels at ${s(r2.sampleRateHz)} Hz, ${n(r2.frameCount)} frames (${duration(r2.frameCount / r2.sampleRateHz)}) from ${s(r2.startS)} s, ${s(r2.gainUvPerBit)} uV per bit`);
  }
  // Session metadata from the inputs (e.g. NWB identifier, stimulus site) and NWB observation intervals.
  if (rec.meta && Object.keys(rec.meta).length) out.push(`Session metadata: ${Object.entries(rec.meta).map(([k, v]) => `${k} = ${v}`).join('; ')}`);
  const observed = rec.units.filter((u) => u.observedIntervals);
  if (observed.length) out.push(`  observation intervals: ${observed.length} units (${observed.filter((u) => u.observedIntervals!.length > 2).length} with gaps)`);
  if (r.warnings.length === 0) out.push('Warnings: none');
  else {
    out.push(`Warnings: ${r.warnings.length}`);
    for (const w of r.warnings) out.push(`  [${w.code}] ${w.message}`);
  }
  return `${out.join('\n')}\n`;
}

function bytes(b: number): string {
  if (b < 1024) return `${b} B`;
  if (b < 1024 ** 2) return `${(b / 1024).toFixed(1)} KiB`;
  if (b < 1024 ** 3) return `${(b / 1024 ** 2).toFixed(1)} MiB`;
  return `${(b / 1024 ** 3).toFixed(2)} GiB`;
}

function duration(sec: number): string {
  if (sec < 120) return `${Number(sec.toPrecision(4))} s`;
  if (sec < 7200) return `${(sec / 60).toFixed(1)} min`;
  return `${(sec / 3600).toFixed(2)} h`;
}

/** Median interval between consecutive sorted times (NaN with fewer than two). */
function medianStep(t: Float64Array): number {
  if (t.length < 2) return NaN;
  const d = new Float64Array(t.length - 1);
  for (let i = 1; i < t.length; i++) d[i - 1] = t[i] - t[i - 1];
  d.sort();
  const h = d.length >> 1;
  return d.length % 2 ? d[h] : (d[h - 1] + d[h]) / 2;
}
