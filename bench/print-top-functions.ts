/** A V8 CPU profile (.cpuprofile JSON, as node --cpu-prof and the inspector write it). */
export interface CpuProfile {
  nodes: { id: number; callFrame: { functionName: string; url: string; lineNumber: number } }[];
  samples: number[];
  timeDeltas: number[];
}

/**
 * Prints the top functions of a CPU profile by self time (share and ms), named
 * by function and file (path shortened to core/..., bench/..., node_modules/...,
 * or the bundle's file name) and line. Used by bench/run-bench.ts and
 * bench/steps-bench.ts.
 */
export function printTopFunctions(prof: CpuProfile, top = 15): void {
  const byId = new Map(prof.nodes.map((n) => [n.id, n]));
  const self = new Map<string, number>();
  let total = 0;
  prof.samples.forEach((id, i) => {
    const n = byId.get(id)!;
    const dt = prof.timeDeltas[i] ?? 0;
    total += dt;
    const url = n.callFrame.url.replace(/^file:\/\//, '').replace(/^.*?\/(core|node_modules|bench)\//, '$1/');
    const key = `${n.callFrame.functionName || '(anonymous)'}  ${url}${url ? `:${n.callFrame.lineNumber + 1}` : ''}`;
    self.set(key, (self.get(key) ?? 0) + dt);
  });
  for (const [k, us] of [...self].sort((a, b) => b[1] - a[1]).slice(0, top)) {
    console.log(`  ${((100 * us) / total).toFixed(1).padStart(5)} %  ${(us / 1000).toFixed(0).padStart(7)} ms  ${k}`);
  }
}
