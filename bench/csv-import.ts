/**
 * Micro-benchmark of the streaming CSV parser (DESIGN.md section 7 target:
 * >= 5 M rows/s for `unit,time` rows). Prints figures; never asserts.
 *
 *   npx tsx bench/csv-import.ts [rows=5000000] [chunkMiB=4]
 *
 * Prints wall-clock and CPU-time rates (on a shared, loaded machine the CPU
 * figure is the meaningful one). The text is generated in memory (1,000 integer unit ids, times with 6
 * decimals, as sorters export them) and fed in chunks, as the file reader does;
 * the columns are kept as row blocks (pieces), as importSession keeps the spike table.
 */
import { createDelimitedParser } from '../core/io/create-delimited-parser';

const rows = Number(process.argv[2] ?? 5_000_000);
const chunkBytes = Number(process.argv[3] ?? 4) * 1024 * 1024;

function makeCsv(n: number): Uint8Array {
  const parts: string[] = ['unit,time\n'];
  let t = 0;
  let seed = 12345;
  const rnd = () => ((seed = (seed * 1103515245 + 12345) >>> 0) / 2 ** 32);
  for (let i = 0; i < n; i++) {
    t += rnd() * 0.0004;
    parts.push(`${Math.floor(rnd() * 1000)},${t.toFixed(6)}\n`);
  }
  return new TextEncoder().encode(parts.join(''));
}

const bytes = makeCsv(rows);
const mb = bytes.length / 1e6;
for (let rep = 0; rep < 3; rep++) {
  const before = process.memoryUsage().arrayBuffers;
  const t0 = performance.now();
  const c0 = process.cpuUsage();
  const p = createDelimitedParser({
    file: 'spikes.csv',
    columns: [
      { name: 'unit', kind: 'code', required: true, pieces: true },
      { name: 'time', kind: 'number', required: true, pieces: true },
    ],
  });
  for (let i = 0; i < bytes.length; i += chunkBytes) p.push(bytes.subarray(i, i + chunkBytes));
  const table = p.finish();
  const s = (performance.now() - t0) / 1000;
  const cu = process.cpuUsage(c0);
  const cpu = (cu.user + cu.system) / 1e6;
  const after = process.memoryUsage().arrayBuffers;
  console.log(
    `csv-import: ${table.rowCount.toLocaleString('en')} rows, ${mb.toFixed(1)} MB in ${s.toFixed(3)} s = ` +
      `${(table.rowCount / s / 1e6).toFixed(2)} M rows/s, ${(mb / s).toFixed(0)} MB/s ` +
      `(CPU time ${cpu.toFixed(3)} s = ${(table.rowCount / cpu / 1e6).toFixed(2)} M rows/s of CPU; a loaded machine inflates wall time); ` +
      `parsed columns ${((after - before) / 1e6).toFixed(0)} MB (input text ${mb.toFixed(0)} MB)`,
  );
}
