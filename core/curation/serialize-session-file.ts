import type { SessionFile } from './session-file';

/**
 * Writes a session file as JSON text: fields in schema order, two-space
 * indent, unit curation sorted by unit id, ending in a newline. The same
 * session always gives the same bytes (diff-friendly, and a save that changes
 * nothing can be detected by comparing text).
 */
export function serializeSessionFile(s: SessionFile): string {
  const units: Record<string, unknown> = {};
  for (const id of Object.keys(s.curation.units).sort()) {
    const u = s.curation.units[id];
    const labels: Record<string, unknown> = {};
    for (const col of Object.keys(u.labels).sort()) {
      const l = u.labels[col];
      labels[col] = { value: l.value, by: l.by, at: l.at };
    }
    units[id] = {
      labels,
      ...(u.note ? { note: { text: u.note.text, by: u.note.by, at: u.note.at } } : {}),
      ...(u.include ? { include: { value: u.include.value, by: u.include.by, at: u.include.at } } : {}),
    };
  }
  const out = {
    format: s.format,
    schemaVersion: s.schemaVersion,
    source: s.source,
    inputs: s.inputs.map((i) => ({ file: i.file, bytes: i.bytes, sha256: i.sha256 })),
    parameters: s.parameters,
    units: s.units,
    curation: { units },
    savedAt: s.savedAt,
    savedWith: s.savedWith,
  };
  return `${JSON.stringify(out, null, 2)}\n`;
}
