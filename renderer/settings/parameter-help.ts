/**
 * One-line explanations of analysis parameters that core/defaults.ts does not
 * document in a comment of their own (the Settings screen prefers the
 * comment in core/defaults.ts and falls back to this table). Keyed
 * "section.key"; test/renderer/settings/parameter-docs.test.ts fails when any
 * parameter of DEFAULTS has neither.
 */
export const PARAMETER_HELP: Readonly<Record<string, string>> = {
  'span.startS': 'Start of the recording span; empty = 0 s (or the session file / NWB observation intervals).',
  'span.stopS': 'End of the recording span; empty = the latest time in any input.',
  'light.windowStartMs': 'Start of the light test window after pulse onset.',
  'light.windowEndMs': 'End of the light test window after pulse onset; SALT compares this window with light-free baseline windows of the same length.',
  'ramp.event': 'Event label the ramp window is aligned on.',
  'ramp.windowStartS': 'Start of the ramp window relative to that event (negative = before it).',
  'ramp.windowEndS': 'End of the ramp window relative to that event (the window is [start, end)).',
  'ramp.condition': 'Only trials of this condition enter the ramp fit.',
  'ramp.binS': 'Bin width of the spike counts the ramp is fitted to.',
  'ramp.alpha': 'False discovery rate (Benjamini-Hochberg q) below which a slope counts as up or down.',
  'jump.event': 'Event label of the task-state jumps; answers are grouped by the event kind.',
  'jump.postStartS': 'Start of the window after the jump.',
  'jump.postEndS': 'End of the window after the jump.',
  'jump.preStartS': 'Start of the baseline window before the jump.',
  'jump.preEndS': 'End of the baseline window before the jump.',
  'jump.alpha': 'False discovery rate (Benjamini-Hochberg q) of the paired before/after comparison.',
  'quality.acgWindowMs': 'Half-width of the autocorrelogram window.',
};
