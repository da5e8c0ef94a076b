import { extname, join, normalize, sep } from 'node:path';

/** Content types of the files a renderer build holds. */
export const CONTENT_TYPES: Readonly<Record<string, string>> = {
  '.html': 'text/html; charset=utf-8',
  '.js': 'text/javascript; charset=utf-8',
  '.mjs': 'text/javascript; charset=utf-8',
  '.css': 'text/css; charset=utf-8',
  '.json': 'application/json; charset=utf-8',
  '.svg': 'image/svg+xml',
  '.png': 'image/png',
  '.ico': 'image/x-icon',
  '.woff2': 'font/woff2',
  '.wasm': 'application/wasm',
  '.csv': 'text/csv; charset=utf-8',
  '.npy': 'application/octet-stream',
  '.nwb': 'application/octet-stream',
  '.bin': 'application/octet-stream',
  '.txt': 'text/plain; charset=utf-8',
  '.map': 'application/json; charset=utf-8',
};

/**
 * Maps a request path of the app's own pages ("/", "/assets/x.js",
 * "/demo/spikes.csv") to a file inside the renderer build folder, or null when
 * it would leave the folder (encoded "..", backslashes, NUL). "/" serves
 * index.html. Shared by the Electron app:// protocol and the loopback web server.
 */
export function resolveAssetPath(buildDir: string, requestPath: string): string | null {
  let p: string;
  try {
    p = decodeURIComponent(requestPath.split('?')[0].split('#')[0]);
  } catch {
    return null;
  }
  if (p.includes('\0') || p.includes('\\') || !p.startsWith('/')) return null;
  if (p.split('/').some((seg) => seg === '..')) return null;
  if (p === '/' || p === '') p = '/index.html';
  const full = normalize(join(buildDir, p));
  const root = normalize(buildDir.endsWith(sep) ? buildDir : buildDir + sep);
  return full.startsWith(root) ? full : null;
}

/** Content type of a file by extension (octet-stream when unknown). */
export function contentTypeOf(path: string): string {
  return CONTENT_TYPES[extname(path).toLowerCase()] ?? 'application/octet-stream';
}

/**
 * The Content-Security-Policy of the app's pages: scripts and workers only from
 * the app itself; no remote content at all. Plotly injects its own style
 * elements, hence 'unsafe-inline' for styles only; images from data:/blob: are
 * the figure exports. 'wasm-unsafe-eval' lets the analysis worker compile the
 * HDF5 library's WebAssembly (NWB files); it allows WebAssembly only, never
 * eval() of JavaScript.
 */
export const CONTENT_SECURITY_POLICY = [
  "default-src 'self'",
  "script-src 'self' 'wasm-unsafe-eval'",
  "worker-src 'self' blob:",
  "style-src 'self' 'unsafe-inline'",
  "img-src 'self' data: blob:",
  "font-src 'self' data:",
  "connect-src 'self' blob: data:",
  "object-src 'none'",
  "base-uri 'none'",
  "form-action 'none'",
  "frame-ancestors 'none'",
].join('; ');

/** Headers sent with every page and asset (Electron protocol and web server alike). */
export function securityHeaders(): Record<string, string> {
  return {
    'Content-Security-Policy': CONTENT_SECURITY_POLICY,
    'X-Content-Type-Options': 'nosniff',
    'Referrer-Policy': 'no-referrer',
    'Cross-Origin-Opener-Policy': 'same-origin',
  };
}
