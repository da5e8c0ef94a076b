import { createServer, type Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import { serveAsset } from './serve-asset';

/** A running loopback server for the renderer build. */
export interface WebServer {
  readonly url: string;
  readonly port: number;
  close(): Promise<void>;
}

/**
 * Serves a production build of the renderer on 127.0.0.1 only (never another
 * interface), with the same files and security headers as the desktop app's
 * app:// protocol. Requests whose Host header is not this loopback address are
 * refused (a guard against DNS rebinding). port 0 picks a free port; when the
 * wanted port is taken, the next free one above it is used (up to 20 tries).
 */
export async function startWebServer(buildDir: string, port = 0): Promise<WebServer> {
  let server: Server | null = null;
  let bound = 0;
  for (let attempt = 0; attempt < 20; attempt++) {
    const tryPort = port === 0 ? 0 : port + attempt;
    const s = createServer((req, res) => {
      const host = req.headers.host ?? '';
      if (host !== `127.0.0.1:${bound}` && host !== `localhost:${bound}`) {
        res.writeHead(421, { 'Content-Type': 'text/plain; charset=utf-8' }).end('Wrong host\n');
        return;
      }
      const pathname = new URL(req.url ?? '/', `http://${host}`).pathname;
      serveAsset(buildDir, req.method ?? 'GET', pathname).then(
        (r) => res.writeHead(r.status, r.headers).end(r.body),
        () => res.writeHead(500).end(),
      );
    });
    try {
      await new Promise<void>((resolve, reject) => {
        s.once('error', reject);
        s.listen(tryPort, '127.0.0.1', () => resolve());
      });
      server = s;
      bound = (s.address() as AddressInfo).port;
      break;
    } catch (e) {
      if ((e as NodeJS.ErrnoException).code !== 'EADDRINUSE' || port === 0) throw e;
    }
  }
  if (!server) throw new Error(`No free port from ${port} to ${port + 19} on 127.0.0.1.`);
  const srv = server;
  return {
    url: `http://127.0.0.1:${bound}/`,
    port: bound,
    close: () => new Promise<void>((resolve) => srv.close(() => resolve())),
  };
}
