/**
 * Version of the simulator's output. Bump it whenever the same scenario
 * would give different spikes (benchmark caches are keyed by it, and the
 * demo's README records it).
 */
export const SIMULATOR_VERSION = '1';
