import { readFile } from 'node:fs/promises';
import { contentTypeOf, resolveAssetPath, securityHeaders } from './app-protocol';

/** A response for the app's own pages, independent of the server that sends it. */
export interface AssetResponse {
  readonly status: 200 | 404 | 405;
  readonly headers: Record<string, string>;
  readonly body: Uint8Array;
}

/**
 * Answers a request for one of the renderer build's files: the Electron
 * app:// protocol and the loopback web server both call this, so the desktop
 * app and browser mode serve identical pages with identical security headers.
 * Only GET and HEAD; anything outside the build folder is a 404.
 */
export async function serveAsset(buildDir: string, method: string, pathname: string): Promise<AssetResponse> {
  const headers = securityHeaders();
  if (method !== 'GET' && method !== 'HEAD') {
    return { status: 405, headers: { ...headers, Allow: 'GET, HEAD', 'Content-Type': 'text/plain; charset=utf-8' }, body: new TextEncoder().encode('Method not allowed\n') };
  }
  const path = resolveAssetPath(buildDir, pathname);
  if (path) {
    try {
      const body = new Uint8Array(await readFile(path));
      return {
        status: 200,
        headers: { ...headers, 'Content-Type': contentTypeOf(path), 'Cache-Control': 'no-cache' },
        body: method === 'HEAD' ? new Uint8Array(0) : body,
      };
    } catch {
      /* fall through to 404 */
    }
  }
  return { status: 404, headers: { ...headers, 'Content-Type': 'text/plain; charset=utf-8' }, body: new TextEncoder().encode('Not found\n') };
}
