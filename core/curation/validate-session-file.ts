import { InputError } from '../errors';
import { resolveParameters } from '../resolve-parameters';
import { SESSION_FORMAT, SESSION_SCHEMA_VERSION, type SessionFile } from './session-file';
import type { CurationState, UnitCuration } from './types';
import { verdictWords } from './verdict-words';

/**
 * Parses and checks a session file's text. Any problem is an InputError
 * naming the file and the JSON field (e.g. `curation.units."u7".note.text`)
 * and what was expected; nothing is repaired or guessed. Parameters are
 * checked by resolveParameters (unknown keys and wrong types are errors).
 * Unknown top-level fields are errors too (a typo would otherwise be lost on
 * the next save). A newer schemaVersion is refused with a clear message.
 */
export function validateSessionFile(text: string, file: string): SessionFile {
  let json: unknown;
  try {
    json = JSON.parse(text);
  } catch (e) {
    throw new InputError({ file, problem: `not valid JSON (${(e as Error).message})`, fix: 'restore the file from its backup (.bak) or fix the JSON by hand' });
  }
  const fail = (field: string, problem: string, value?: unknown): never => {
    throw new InputError({
      file,
      problem: `field ${field}: ${problem}`,
      ...(value !== undefined ? { value: typeof value === 'string' ? value : (JSON.stringify(value) ?? String(value)) } : {}),
    });
  };
  const obj = (v: unknown, field: string): Record<string, unknown> => {
    if (typeof v !== 'object' || v === null || Array.isArray(v)) fail(field, 'expected a JSON object', v);
    return v as Record<string, unknown>;
  };
  const str = (v: unknown, field: string, nonEmpty = false): string => {
    if (typeof v !== 'string' || (nonEmpty && v.trim() === '')) fail(field, nonEmpty ? 'expected a non-empty string' : 'expected a string', v);
    return v as string;
  };
  const stamp = (v: Record<string, unknown>, field: string) => {
    str(v.by, `${field}.by`, true);
    const at = str(v.at, `${field}.at`);
    if (!/^\d{4}-\d{2}-\d{2}T\d{2}:\d{2}:\d{2}(\.\d+)?Z$/.test(at) || Number.isNaN(Date.parse(at))) fail(`${field}.at`, 'expected an ISO 8601 UTC time such as 2026-03-01T14:05:00.000Z', at);
    return { by: v.by as string, at };
  };
  const root = obj(json, '(top level)');
  const known = ['format', 'schemaVersion', 'source', 'inputs', 'parameters', 'units', 'curation', 'savedAt', 'savedWith'];
  for (const k of Object.keys(root)) if (!known.includes(k)) fail(k, `unknown field (known: ${known.join(', ')})`);
  if (root.format !== SESSION_FORMAT) fail('format', `expected "${SESSION_FORMAT}"; this is not a tagbench session file`, root.format);
  if (typeof root.schemaVersion !== 'number' || !Number.isInteger(root.schemaVersion)) fail('schemaVersion', 'expected an integer', root.schemaVersion);
  if ((root.schemaVersion as number) > SESSION_SCHEMA_VERSION) {
    fail('schemaVersion', `version ${root.schemaVersion} was written by a newer tagbench (this one reads up to ${SESSION_SCHEMA_VERSION}); update tagbench`);
  }
  if (root.schemaVersion !== SESSION_SCHEMA_VERSION) fail('schemaVersion', `unsupported version (expected ${SESSION_SCHEMA_VERSION})`, root.schemaVersion);
  const source = str(root.source, 'source', true);
  if (!Array.isArray(root.inputs)) fail('inputs', 'expected a list of {file, bytes, sha256}', root.inputs);
  const inputs = (root.inputs as unknown[]).map((v, i) => {
    const f = `inputs[${i}]`;
    const o = obj(v, f);
    const name = str(o.file, `${f}.file`, true);
    if (typeof o.bytes !== 'number' || !Number.isInteger(o.bytes) || o.bytes < 0) fail(`${f}.bytes`, 'expected a whole number of bytes', o.bytes);
    const sha = str(o.sha256, `${f}.sha256`);
    if (!/^[0-9a-f]{64}$/.test(sha)) fail(`${f}.sha256`, 'expected 64 lowercase hex digits', sha);
    return { file: name, bytes: o.bytes as number, sha256: sha };
  });
  obj(root.parameters, 'parameters');
  const parameters = resolveParameters([{ file: `${file} (field parameters)`, overrides: root.parameters }]);
  if (!Array.isArray(root.units)) fail('units', 'expected a list of unit ids', root.units);
  const units = (root.units as unknown[]).map((u, i) => str(u, `units[${i}]`, true));
  const unitSet = new Set(units);
  if (unitSet.size !== units.length) fail('units', 'unit ids repeat');
  const cur = obj(root.curation, 'curation');
  for (const k of Object.keys(cur)) if (k !== 'units') fail(`curation.${k}`, 'unknown field (known: units)');
  const cu = obj(cur.units, 'curation.units');
  const outUnits: Record<string, UnitCuration> = {};
  for (const [id, v] of Object.entries(cu)) {
    const f = `curation.units.${JSON.stringify(id)}`;
    if (!unitSet.has(id)) fail(f, 'curation of a unit that is not in "units"');
    const o = obj(v, f);
    for (const k of Object.keys(o)) if (!['labels', 'note', 'include'].includes(k)) fail(`${f}.${k}`, 'unknown field (known: labels, note, include)');
    const labels: Record<string, { value: string; by: string; at: string }> = {};
    for (const [col, lv] of Object.entries(obj(o.labels ?? {}, `${f}.labels`))) {
      const lf = `${f}.labels.${col}`;
      const words = verdictWords(col);
      if (!words) fail(lf, 'not a verdict column (tag, ramp, quality, jump_<kind>)');
      const lo = obj(lv, lf);
      const value = str(lo.value, `${lf}.value`);
      if (!words!.includes(value)) fail(`${lf}.value`, `expected one of ${words!.join(', ')}`, value);
      labels[col] = { value, ...stamp(lo, lf) };
    }
    const u: { labels: typeof labels; note?: { text: string; by: string; at: string }; include?: { value: boolean; by: string; at: string } } = { labels };
    if (o.note !== undefined) {
      const no = obj(o.note, `${f}.note`);
      u.note = { text: str(no.text, `${f}.note.text`, true), ...stamp(no, `${f}.note`) };
    }
    if (o.include !== undefined) {
      const io = obj(o.include, `${f}.include`);
      if (typeof io.value !== 'boolean') fail(`${f}.include.value`, 'expected true or false', io.value);
      u.include = { value: io.value as boolean, ...stamp(io, `${f}.include`) };
    }
    outUnits[id] = u;
  }
  const curation: CurationState = { units: outUnits };
  return {
    format: SESSION_FORMAT,
    schemaVersion: SESSION_SCHEMA_VERSION,
    source,
    inputs,
    parameters,
    units,
    curation,
    savedAt: str(root.savedAt, 'savedAt'),
    savedWith: str(root.savedWith, 'savedWith'),
  };
}
