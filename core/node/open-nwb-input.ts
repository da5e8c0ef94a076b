/**
 * The NWB branch of loadSession (the single dispatch point for NWB input):
 * hands the file and the session.json "nwb" section, untouched, to the NWB
 * reader (core/node/nwb/load-nwb-session.ts, which validates the section),
 * with the span and tolerance resolved from every parameter source
 * (session.json "parameters", then --config), and records those sources in
 * the result so `run` applies the same parameters as for a folder.
 */
import { resolveParameters } from '../resolve-parameters';
import type { ImportOptions } from '../io/import-session';
import type { ImportResult } from '../io/import-result';
import { loadNwbSession } from './nwb/load-nwb-session';

export async function openNwbInput(path: string, section: unknown, options: ImportOptions, manifestFile = 'session.json'): Promise<ImportResult> {
  const sources = options.parameterSources ?? [];
  const p = resolveParameters(sources);
  const result = await loadNwbSession(path, {
    ...(section !== undefined ? { section } : {}),
    file: manifestFile,
    ...(p.span.startS !== null || p.span.stopS !== null ? { span: { startS: p.span.startS, stopS: p.span.stopS } } : {}),
    toleranceS: p.span.toleranceS,
  });
  return { ...result, parameterSources: sources };
}
