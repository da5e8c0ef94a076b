/**
 * Explanations and units of every analysis parameter, read from the doc
 * comments of core/defaults.ts (the one table of defaults), so the Analysis
 * settings screen can never drift from the code: each `/** ... *\/` comment
 * above a key of a section becomes that parameter's explanation, and the
 * section's comment its heading's explanation. Units come from the key's
 * suffix (windowMs -> ms), the house naming rule. A comment above a run of
 * keys (no blank line or other comment between) documents each key of the run
 * ("Window around the event, s." above windowStartS and windowStopS).
 */
export interface ParameterDoc {
  readonly section: string;
  readonly key: string;
  readonly text: string;
}

/** Parses `export const DEFAULTS = { section: { /** doc *\/ key: value, ... }, ... }` source text. */
export function parseParameterDocs(source: string): Map<string, ParameterDoc> {
  const out = new Map<string, ParameterDoc>();
  const start = source.indexOf('export const DEFAULTS');
  if (start < 0) return out;
  const lines = source.slice(start).split('\n');
  let section: string | null = null;
  let depth = 0;
  let pending: string[] = [];
  let inComment = false;
  for (const raw of lines.slice(1)) {
    const line = raw.trim();
    if (inComment || line.startsWith('/**')) {
      const body = line.replace(/^\/\*\*\s?/, '').replace(/\*\/\s*$/, '').replace(/^\*\s?/, '').trim();
      if (!inComment) pending = [];
      if (body) pending.push(body);
      inComment = !line.endsWith('*/');
      continue;
    }
    if (line.startsWith('//')) continue;
    if (line === '') {
      pending = [];
      continue;
    }
    const key = /^([A-Za-z_$][\w$]*)\s*:/.exec(line)?.[1];
    if (depth === 0 && key && line.endsWith('{')) {
      section = key;
      out.set(`${section}.`, { section, key: '', text: pending.join(' ') });
      depth = 1;
    } else if (depth === 1 && key && section) {
      out.set(`${section}.${key}`, { section, key, text: pending.join(' ') });
      if (line.endsWith('{') || line.endsWith('[')) depth = 2;
      // A comment above a run of keys (no blank line between) documents each of them.
      continue;
    } else if (depth === 2 && (line.startsWith('}') || line.startsWith(']'))) {
      depth = 1;
    } else if (depth === 1 && line.startsWith('}')) {
      depth = 0;
      section = null;
    } else if (depth === 0 && line.startsWith('}')) {
      break;
    }
    pending = [];
  }
  return out;
}

const UNIT_SUFFIXES: readonly [RegExp, string][] = [
  [/Ms$/, 'ms'],
  [/S$/, 's'],
  [/Hz$/, 'Hz'],
  [/Mw$/, 'mW'],
  [/Um$/, 'µm'],
  [/Uv$/, 'µV'],
  [/Pct$/, '%'],
];

/** Unit of a parameter from its name's suffix ("" when unitless). */
export function unitOfKey(key: string): string {
  for (const [re, unit] of UNIT_SUFFIXES) if (re.test(key)) return unit;
  return '';
}
