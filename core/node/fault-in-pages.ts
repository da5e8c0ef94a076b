/**
 * The pages of the shared spike array faulted in on the helper thread while
 * the importer fills the array on the main thread.
 *
 * Why: the first write to each 4 KiB page of fresh memory costs a page
 * fault. On the virtual machines this was measured on, a fault cost 9-16 us
 * (a 150 MiB spike array: 0.35-0.6 s, about half the import of the reference
 * session of `npm run bench`). The helper thread (startSpareThread) is idle
 * at that moment apart from hashing, so it takes the faults: it writes to
 * each page in the order in which the importer will reach it, ahead of it.
 *
 * The write is Atomics.add(word, 0): an atomic read-modify-write that leaves
 * the word as it is. The importer's own stores to the same word (plain
 * float64 stores, naturally aligned) either come before it, and are read and
 * written back unchanged, or after it; no value can be lost, and the
 * imported values are the same with or without this (tested bit for bit).
 * A read would not do: reading an untouched page maps the shared zero page,
 * and the first write still faults.
 *
 * Order: buildRecording fills group g's range starts[g] .. starts[g+1] - 1
 * in file order (SharedSpikeMemory), so a time-sorted spike file advances in
 * every range at the same relative pace; a page is needed when the file has
 * been read as far as the page's relative position in its group's range.
 * Pages are sorted by that position (a counting sort over 4,096 buckets; a
 * page shared by two groups counts at the earlier need). For a file sorted by
 * unit the order is not the fill order, and the two threads simply share the
 * faults.
 */
import type { Worker } from 'node:worker_threads';
import type { SharedSpikeMemory } from '../io/build-recording';

/** Below this size of the spike array (8 MiB: ~2,000 pages, a few ms of faults) no request is sent. Our choice. */
export const FAULT_IN_MIN_BYTES = 8 * 1024 * 1024;

/** Page size the touches step by (4 KiB: x86-64 and most Linux ARM; larger pages just get several touches). */
export const PAGE_BYTES = 4096;

/** What the main thread posts to run-steps-worker.ts to fault in the spike memory. */
export interface FaultInRequest extends SharedSpikeMemory {
  readonly kind: 'fault-in';
}

/**
 * Indices of the pages (of `pageElements` float64 elements each) of an array
 * of starts[starts.length - 1] elements, in the order a time-sorted fill
 * reaches them (see above). Every page appears once.
 */
export function fillOrderPages(starts: Float64Array, pageElements: number, buckets = 4096): Int32Array {
  const n = starts.length ? starts[starts.length - 1] : 0;
  const pages = Math.ceil(n / pageElements);
  const bucket = new Int32Array(pages).fill(buckets - 1);
  for (let g = 0; g + 1 < starts.length; g++) {
    const s = starts[g];
    const count = starts[g + 1] - s;
    if (count <= 0) continue;
    const first = Math.floor(s / pageElements);
    const last = Math.floor((starts[g + 1] - 1) / pageElements);
    bucket[first] = 0; // the group's first page is needed at once
    for (let j = first + 1; j <= last; j++) {
      const b = Math.min(buckets - 1, Math.floor(((j * pageElements - s) / count) * buckets));
      if (b < bucket[j]) bucket[j] = b;
    }
  }
  // counting sort by bucket, ties in page order
  const at = new Int32Array(buckets + 1);
  for (let j = 0; j < pages; j++) at[bucket[j] + 1]++;
  for (let b = 0; b < buckets; b++) at[b + 1] += at[b];
  const order = new Int32Array(pages);
  for (let j = 0; j < pages; j++) order[at[bucket[j]]++] = j;
  return order;
}

/** Faults in every page of the spike memory (the worker's side); returns the pages touched. */
export function faultInPages(memory: SharedSpikeMemory, pageBytes = PAGE_BYTES): number {
  const words = new Int32Array(memory.buffer, 0, memory.buffer.byteLength >> 2);
  const step = pageBytes >> 2;
  const order = fillOrderPages(memory.starts, pageBytes / 8);
  for (let k = 0; k < order.length; k++) {
    const w = order[k] * step;
    if (w < words.length) Atomics.add(words, w, 0);
  }
  return order.length;
}

/**
 * The main thread's side: asks the helper thread to fault in the spike
 * memory, when it is large enough to be worth it. No answer is awaited: the
 * faults are only taken earlier, the values do not depend on them.
 */
export function requestFaultIn(worker: Worker, memory: SharedSpikeMemory): void {
  if (memory.buffer.byteLength < FAULT_IN_MIN_BYTES) return;
  const request: FaultInRequest = { kind: 'fault-in', buffer: memory.buffer, starts: memory.starts };
  worker.postMessage(request);
}
