import type { IpcMainInvokeEventLike } from '../electron-api';

/** Origin the app's own pages are served from (custom protocol, see electron/app-protocol.ts). */
export const APP_ORIGIN = 'app://tagbench';

/**
 * True when an IPC message comes from a frame showing the app's own pages
 * (Electron's checklist: validate the sender of every IPC message). Frames of
 * any other origin, detached frames and unparsable URLs are refused.
 */
export function isTrustedSender(event: IpcMainInvokeEventLike, origin: string = APP_ORIGIN): boolean {
  const url = event.senderFrame?.url;
  if (typeof url !== 'string') return false;
  try {
    const u = new URL(url);
    return `${u.protocol}//${u.host}` === origin;
  } catch {
    return false;
  }
}
