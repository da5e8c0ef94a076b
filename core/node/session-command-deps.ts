import { readFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import { userInfo } from 'node:os';
import { loadSession } from './load-session';
import type { ImportSource } from './open-session';
import { toolVersion } from './tool-version';

/**
 * What the session commands (curate, export, report) need from the outside
 * world, injected so tests can run them on simulated sessions and a fixed
 * clock. The CLI wires the real ones (see defaultSessionDeps).
 */
export interface SessionCommandDeps {
  /** Reads a session folder or NWB file (the import area's loader). */
  readonly importSource: ImportSource;
  /** tagbench's version, for run.json, session files and the report. */
  readonly toolVersion: string;
  readonly now: () => Date;
  /** Default for --by: the login name. */
  readonly user: () => string;
  /** The minified plotly.js source embedded in the report. */
  readonly plotlySource: () => string;
}

/** The login name, or "unknown" where the system does not say. */
export function loginName(): string {
  try {
    return process.env.TAGBENCH_USER || userInfo().username || 'unknown';
  } catch {
    return 'unknown';
  }
}

/** Reads plotly.js-dist-min's minified bundle from node_modules (it is a dependency of the app). */
export function readPlotlySource(): string {
  const require = createRequire(import.meta.url);
  return readFileSync(require.resolve('plotly.js-dist-min/plotly.min.js'), 'utf8');
}

/** The real dependencies: the import area's loader, package.json's version, the clock, the login name. */
export function defaultSessionDeps(): SessionCommandDeps {
  return {
    importSource: (path, o) => loadSession(path, { sharedMemory: true, importHelper: o?.importHelper }),
    toolVersion: toolVersion(),
    now: () => new Date(),
    user: loginName,
    plotlySource: readPlotlySource,
  };
}
