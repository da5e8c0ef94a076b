import { readFile } from 'node:fs/promises';
import type { RectangleLike } from '../electron-api';
import { atomicWrite } from './atomic-write';

/** Window bounds and whether it was maximised. */
export interface WindowState {
  readonly bounds: RectangleLike;
  readonly maximized: boolean;
}

/** First-run size: fits a 1366 x 768 laptop screen. */
export const DEFAULT_WINDOW_STATE: WindowState = { bounds: { x: NaN, y: NaN, width: 1280, height: 760 }, maximized: false };
export const MIN_WIDTH = 960;
export const MIN_HEIGHT = 600;

/**
 * Reads the remembered window state; anything missing, damaged or absurd
 * (non-finite, smaller than the minimum) falls back to the default size.
 * x/y are NaN when the window should be centred by the system.
 */
export async function loadWindowState(file: string): Promise<WindowState> {
  try {
    const raw = JSON.parse(await readFile(file, 'utf8')) as { bounds?: Partial<RectangleLike>; maximized?: unknown };
    const b = raw.bounds ?? {};
    const num = (v: unknown) => (typeof v === 'number' && Number.isFinite(v) ? v : NaN);
    const width = num(b.width);
    const height = num(b.height);
    if (!(width >= MIN_WIDTH && height >= MIN_HEIGHT && width <= 20000 && height <= 20000)) return DEFAULT_WINDOW_STATE;
    return { bounds: { x: num(b.x), y: num(b.y), width, height }, maximized: raw.maximized === true };
  } catch {
    return DEFAULT_WINDOW_STATE;
  }
}

/** Remembers the window state (atomic write). */
export async function saveWindowState(file: string, state: WindowState): Promise<void> {
  await atomicWrite(file, JSON.stringify(state));
}
