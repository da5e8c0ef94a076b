import { mkdtemp, mkdir, writeFile } from 'node:fs/promises';
import { request } from 'node:http';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { CONTENT_SECURITY_POLICY, resolveAssetPath } from '../../electron/app-protocol';
import { findElectron } from '../../electron/find-electron';
import { menuTemplate } from '../../electron/menu-template';
import type { MenuItemOptionsLike } from '../../electron/electron-api';
import { serveAsset } from '../../electron/serve-asset';
import { startWebServer } from '../../electron/web-server';

async function build(): Promise<string> {
  const dir = await mkdtemp(join(tmpdir(), 'tagbench-build-'));
  await mkdir(join(dir, 'assets'));
  await writeFile(join(dir, 'index.html'), '<!doctype html><title>t</title>');
  await writeFile(join(dir, 'assets', 'app.js'), 'console.log(1)');
  return dir;
}

describe('app assets', () => {
  it('maps request paths inside the build and refuses escapes', () => {
    expect(resolveAssetPath('/b', '/')).toBe('/b/index.html');
    expect(resolveAssetPath('/b', '/assets/app.js?x=1')).toBe('/b/assets/app.js');
    expect(resolveAssetPath('/b', '/../etc/passwd')).toBeNull();
    expect(resolveAssetPath('/b', '/%2e%2e/etc/passwd')).toBeNull();
    expect(resolveAssetPath('/b', '/a%5c..%5cx')).toBeNull();
    expect(resolveAssetPath('/b', '/%00')).toBeNull();
    expect(resolveAssetPath('/b', '/%E0%A4%A')).toBeNull();
  });
  it('serves files with the CSP and a content type; 404 and 405 otherwise', async () => {
    const dir = await build();
    const ok = await serveAsset(dir, 'GET', '/assets/app.js');
    expect(ok.status).toBe(200);
    expect(ok.headers['Content-Type']).toBe('text/javascript; charset=utf-8');
    expect(ok.headers['Content-Security-Policy']).toBe(CONTENT_SECURITY_POLICY);
    expect(CONTENT_SECURITY_POLICY).toContain("script-src 'self' 'wasm-unsafe-eval';");
    expect(CONTENT_SECURITY_POLICY).not.toMatch(/'unsafe-eval'|script-src[^;]*'unsafe-inline'/);
    expect(new TextDecoder().decode(ok.body)).toBe('console.log(1)');
    expect((await serveAsset(dir, 'GET', '/nope.js')).status).toBe(404);
    expect((await serveAsset(dir, 'POST', '/')).status).toBe(405);
  });
  it('the loopback server listens on 127.0.0.1 and refuses foreign Host headers', async () => {
    const dir = await build();
    const server = await startWebServer(dir, 0);
    try {
      expect(server.url).toBe(`http://127.0.0.1:${server.port}/`);
      const get = (host: string) =>
        new Promise<{ status: number; body: string }>((resolve, reject) => {
          const req = request({ host: '127.0.0.1', port: server.port, path: '/', headers: { host } }, (res) => {
            let body = '';
            res.on('data', (c) => (body += c));
            res.on('end', () => resolve({ status: res.statusCode ?? 0, body }));
          });
          req.on('error', reject);
          req.end();
        });
      expect(await get(`127.0.0.1:${server.port}`)).toEqual({ status: 200, body: '<!doctype html><title>t</title>' });
      expect((await get(`evil.example:${server.port}`)).status).toBe(421);
    } finally {
      await server.close();
    }
  });
});

describe('desktop launch helpers', () => {
  it('finds no Electron binary when the package is absent or its binary missing', () => {
    expect(findElectron(() => {
      throw new Error('Cannot find module');
    })).toEqual({ reason: 'the electron package is not installed' });
    expect(findElectron(() => '/no/such/electron')).toEqual({ reason: 'the Electron binary is missing (/no/such/electron)' });
    expect(findElectron(() => process.execPath)).toEqual({ path: process.execPath });
  });
  it('the menu gives every command an accelerator and sends it to the page', () => {
    const sent: string[] = [];
    const flat = (items: MenuItemOptionsLike[]): MenuItemOptionsLike[] => items.flatMap((i) => [i, ...flat(i.submenu ?? [])]);
    const items = flat(menuTemplate('linux', (c) => sent.push(c))).filter((i) => i.click);
    for (const i of items) i.click!();
    expect(sent).toContain('next-unit');
    expect(sent).toContain('undo');
    expect(items.filter((i) => i.label !== 'Open demo session').every((i) => typeof i.accelerator === 'string')).toBe(true);
    const accels = items.map((i) => i.accelerator).filter(Boolean);
    expect(new Set(accels).size).toBe(accels.length - 1); // Export appears in File and Go with one key
    expect(menuTemplate('darwin', () => undefined)[0].role).toBe('appMenu');
  });
});
