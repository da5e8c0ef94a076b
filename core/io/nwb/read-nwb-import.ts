/**
 * An open NWB file as a session import: the ImportResult of a session folder
 * (sourceKind "nwb") except `inputs`, which the host adds (it knows how to
 * hash the file: Node streams it from disk, the browser worker hashes the
 * picked bytes). Shared by core/node/load-nwb-session.ts and the analysis
 * worker (renderer/worker/import-session-files.ts), so both open an NWB file
 * with the same checks, roles, span and warnings.
 *
 * `section` is the session.json "nwb" section as given (undefined for a bare
 * .nwb file); it is validated here (parseNwbManifest). Parameters come from
 * `parameterSources` as for folders; only the span (and its tolerance) is
 * used while reading. options.sharedMemory: see buildRecording (default false).
 * Errors are InputError paragraphs naming the file.
 */
import { DEFAULTS, type Parameters } from '../../defaults';
import { resolveParameters } from '../../resolve-parameters';
import type { ImportResult } from '../import-result';
import type { Hdf5File } from './hdf5-access';
import { parseNwbManifest } from './parse-nwb-manifest';
import { readNwbSession } from './read-nwb-session';

export function readNwbImport(
  h5: Hdf5File,
  file: string,
  section: unknown,
  parameterSources: readonly { file: string; overrides: unknown }[],
  options: { readonly sharedMemory?: boolean } = {},
): Omit<ImportResult, 'inputs'> {
  const manifestFile = 'session.json';
  const manifest = parseNwbManifest(section, manifestFile);
  const parameters = resolveParameters(parameterSources);
  const span = spanFrom(parameters, parameterSources);
  const session = readNwbSession(h5, file, { manifest, manifestFile, ...(span ? { span } : {}), toleranceS: parameters.span.toleranceS, sharedMemory: options.sharedMemory ?? false });
  return {
    recording: session.recording,
    warnings: session.warnings,
    parameterSources: [...parameterSources],
    sourceKind: 'nwb',
    name: file.replace(/\.nwb$/i, ''),
  };
}

/** The explicit span from the parameters (undefined = not set), with the file that set it last. */
function spanFrom(p: Parameters, sources: readonly { file: string; overrides: unknown }[]) {
  if (p.span.startS === DEFAULTS.span.startS && p.span.stopS === DEFAULTS.span.stopS) return undefined;
  let file = 'session.json';
  for (const s of sources) {
    const sec = (s.overrides as { span?: Record<string, unknown> } | null)?.span;
    if (sec && ('startS' in sec || 'stopS' in sec)) file = s.file;
  }
  return { startS: p.span.startS, stopS: p.span.stopS, file };
}
