/**
 * Groups laser pulses into trains from their inter-pulse intervals (IPIs) and
 * infers each train's frequency.
 *
 * Rule (our own, documented in README "Input formats"): walking the pulses in
 * onset order, a pulse joins the current train when its IPI to the previous
 * pulse is at most `maxIpiS` (default 0.5 s, i.e. trains of 2 Hz and faster)
 * and, once the train has an IPI, within `ipiTolerance` (default 25 %) of
 * the train's first IPI; otherwise it starts a new train. A train of one pulse
 * is a single pulse: frequency NaN. A train's frequency is 1 / median IPI, Hz.
 * Train ids are 0, 1, 2, ... in onset order.
 *
 * Input: onsets in seconds, sorted ascending (the caller sorts). Empty input
 * gives empty outputs. Pure, O(n log n) worst case (medians), O(n) typical.
 */
export function assignTrains(
  onsetS: Float64Array,
  maxIpiS = 0.5,
  ipiTolerance = 0.25,
): { train: Int32Array; frequencyHz: Float64Array } {
  const n = onsetS.length;
  const train = new Int32Array(n);
  const frequencyHz = new Float64Array(n).fill(NaN);
  let id = -1;
  let start = 0;
  let firstIpi = NaN;
  const close = (from: number, to: number) => {
    // pulses [from, to) form one train
    if (to - from < 2) return;
    const ipis = new Float64Array(to - from - 1);
    for (let i = from + 1; i < to; i++) ipis[i - from - 1] = onsetS[i] - onsetS[i - 1];
    ipis.sort();
    const m = ipis.length;
    const med = m % 2 ? ipis[(m - 1) >> 1] : (ipis[m / 2 - 1] + ipis[m / 2]) / 2;
    const f = med > 0 ? 1 / med : NaN;
    for (let i = from; i < to; i++) frequencyHz[i] = f;
  };
  for (let i = 0; i < n; i++) {
    const ipi = i > 0 ? onsetS[i] - onsetS[i - 1] : Infinity;
    let joins = i > 0 && ipi <= maxIpiS;
    if (joins && i - start >= 2 && Math.abs(ipi - firstIpi) > ipiTolerance * firstIpi) joins = false;
    if (!joins) {
      close(start, i);
      id++;
      start = i;
      firstIpi = NaN;
    } else if (i - start === 1) {
      firstIpi = ipi;
    }
    train[i] = id;
  }
  close(start, n);
  return { train, frequencyHz };
}
