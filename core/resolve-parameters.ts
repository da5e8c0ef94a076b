import { DEFAULTS, type Parameters } from './defaults';
import { InputError } from './errors';

/**
 * Merges parameter overrides (from session.json "parameters" or --config)
 * onto the defaults. Applied left to right: later sources win.
 *
 * Unknown sections or keys, and values whose type differs from the default's,
 * are input errors naming the file and the key (a typo must never be ignored
 * silently: the user would publish numbers computed with the default).
 * A default of null accepts a number or null.
 */
export function resolveParameters(
  sources: readonly { file: string; overrides: unknown }[],
): Parameters {
  const out = JSON.parse(JSON.stringify(DEFAULTS)) as Parameters;
  for (const { file, overrides } of sources) {
    if (overrides === undefined || overrides === null) continue;
    if (typeof overrides !== 'object' || Array.isArray(overrides)) {
      throw new InputError({ file, problem: 'parameters must be a JSON object of sections', fix: 'write e.g. {"light": {"windowEndMs": 8}}' });
    }
    for (const [section, values] of Object.entries(overrides as Record<string, unknown>)) {
      if (!(section in out)) {
        throw new InputError({
          file,
          column: section,
          problem: 'unknown parameter section',
          fix: `use one of ${Object.keys(out).join(', ')}`,
        });
      }
      if (typeof values !== 'object' || values === null || Array.isArray(values)) {
        throw new InputError({ file, column: section, problem: 'a parameter section must be a JSON object' });
      }
      const target = (out as Record<string, Record<string, unknown>>)[section];
      const defaults = (DEFAULTS as Record<string, Record<string, unknown>>)[section];
      for (const [key, value] of Object.entries(values as Record<string, unknown>)) {
        if (!(key in defaults)) {
          throw new InputError({
            file,
            column: `${section}.${key}`,
            problem: 'unknown parameter',
            fix: `known parameters of "${section}": ${Object.keys(defaults).join(', ')}`,
          });
        }
        const def = defaults[key];
        const ok =
          def === null
            ? value === null || (typeof value === 'number' && Number.isFinite(value))
            : Array.isArray(def)
              ? Array.isArray(value)
              : typeof value === typeof def && (typeof value !== 'number' || Number.isFinite(value));
        if (!ok) {
          throw new InputError({
            file,
            column: `${section}.${key}`,
            value: JSON.stringify(value),
            problem: `expected ${def === null ? 'a number or null' : Array.isArray(def) ? 'a list' : `a finite ${typeof def}`}`,
          });
        }
        target[key] = JSON.parse(JSON.stringify(value));
      }
    }
  }
  return out;
}
