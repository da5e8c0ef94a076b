import { readFileSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';

/** The NumPy/SciPy reference values (test/fixtures/kernels/make_kernel_fixtures.py). */
export interface KernelFixtures {
  generator: string;
  versions: Record<string, string>;
  seed: number;
  double_exponential_solutions: {
    name: string;
    time_to_peak_ms: number;
    half_decay_ms: number;
    tau_rise_ms: number;
    tau_decay_ms: number;
    half_rise_ms: number;
  }[];
  prediction: {
    spikes: number[];
    grid_start_s: number;
    rate_hz: number;
    length: number;
    tau_rise_s: number;
    tau_decay_s: number;
    peak_dff: number;
    direct: number[];
    alpha_tau_s: number;
    alpha_peak: number;
    alpha_direct: number[];
  };
  convolve: { a: number[]; b: number[]; full: number[] };
  fft: { re: number[]; im: number[]; out_re: number[]; out_im: number[] };
  interp: { times: number[]; values: number[]; grid_start_s: number; rate_hz: number; length: number; out: (number | null)[] };
  polyfit: { x: number[]; y: number[]; slope: number; intercept: number; r: number };
  gaussian_impulse: { sigma_bins: number; center: number; out: number[] };
}

const here = dirname(fileURLToPath(import.meta.url));
export const FIXTURES: KernelFixtures = JSON.parse(readFileSync(join(here, '../../fixtures/kernels/kernel_fixtures.json'), 'utf8'));

/** Top-level sections that are metadata, not reference values. */
export const META_KEYS = ['generator', 'versions', 'seed'];
