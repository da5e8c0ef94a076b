import type { Trace } from './trace';

/**
 * True for a trace drawn as vertical tick markers only (a raster: scatter or
 * scattergl, markers without lines, symbol "line-ns" or "line-ns-open").
 */
export function isTickTrace(trace: Trace): boolean {
  const mode = String(trace.mode ?? 'markers');
  const symbol = (trace.marker as { symbol?: unknown } | undefined)?.symbol;
  return (trace.type === 'scatter' || trace.type === 'scattergl') && mode.includes('markers') && !mode.includes('lines') && typeof symbol === 'string' && symbol.startsWith('line-ns');
}
