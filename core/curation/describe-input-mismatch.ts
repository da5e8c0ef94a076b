import type { InputMismatch } from './compare-inputs';

/** One paragraph for a person: which input files changed since the session was saved. */
export function describeInputMismatch(m: InputMismatch, sessionFile: string): string {
  const parts: string[] = [];
  for (const c of m.changed) parts.push(`${c.file} changed (SHA-256 ${c.recorded.sha256.slice(0, 12)}... then, ${c.current.sha256.slice(0, 12)}... now)`);
  for (const f of m.missing) parts.push(`${f} is no longer read`);
  for (const f of m.added) parts.push(`${f} is new`);
  return `${sessionFile}: the input files differ from those this session was curated on: ${parts.join('; ')}. The curation may no longer fit these units; check them before relying on it.`;
}
