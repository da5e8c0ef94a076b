// npm start's choice between the desktop app and the browser fallback (electron/find-electron.ts).
import { describe, expect, it } from 'vitest';
import { findElectron } from '../../electron/find-electron';

describe('findElectron', () => {
  it('names the reason when the Electron binary cannot be had, and the path when it can', () => {
    expect(findElectron(() => {
      throw new Error('Cannot find module');
    })).toEqual({ reason: 'the electron package is not installed' });
    expect(findElectron(() => ({}))).toEqual({ reason: 'the electron package did not name its binary' });
    expect(findElectron(() => '/nonexistent/electron')).toEqual({ reason: 'the Electron binary is missing (/nonexistent/electron)' });
    expect(findElectron(() => process.execPath)).toEqual({ path: process.execPath });
  });
});
