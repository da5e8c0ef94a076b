/**
 * spikes.csv text (header `unit,time`, then one `id,seconds` row per spike)
 * in chunks of `rowsPerChunk` rows, so a writer can stream a 20-million-row
 * file to disk without building one giant string. Times are written with
 * `decimals` digits after the point (default 6: 1 microsecond, finer than
 * any sorter's sample clock). Rows follow the order given (use
 * spikeTimeOrder for the time order sorters write).
 */
export function* spikesCsvChunks(
  unitIds: readonly string[],
  unit: Int32Array,
  time: Float64Array,
  rowsPerChunk = 100_000,
  decimals = 6,
): Generator<string> {
  yield 'unit,time\n';
  const n = unit.length;
  for (let start = 0; start < n; start += rowsPerChunk) {
    const end = Math.min(n, start + rowsPerChunk);
    const parts: string[] = new Array(end - start);
    for (let i = start; i < end; i++) parts[i - start] = `${unitIds[unit[i]]},${time[i].toFixed(decimals)}\n`;
    yield parts.join('');
  }
}
