import { IPC_CHANNELS, MAX_READ_CHUNK_BYTES, MAX_WRITE_BYTES, type IpcChannel } from '../common/ipc-contract';

const isString = (max: number) => (v: unknown) => typeof v === 'string' && v.length > 0 && v.length <= max;
const isIndex = (v: unknown) => typeof v === 'number' && Number.isSafeInteger(v) && v >= 0;
const isData = (v: unknown) =>
  (typeof v === 'string' && v.length <= MAX_WRITE_BYTES) || (v instanceof Uint8Array && v.byteLength <= MAX_WRITE_BYTES);

/** Argument checks per channel: one predicate per position, with what it expects. */
const SHAPES: Record<IpcChannel, readonly [(v: unknown) => boolean, string][]> = {
  'session:pick': [[(v) => v === 'folder' || v === 'nwb', '"folder" or "nwb"']],
  'session:recent': [],
  'session:open-recent': [[isString(64), 'a recent-session id']],
  'file:read': [
    [isString(200), 'a grant id'],
    [isString(1024), 'a file name'],
    [isIndex, 'a byte offset (integer >= 0)'],
    [(v) => isIndex(v) && (v as number) <= MAX_READ_CHUNK_BYTES, `a length of 0 to ${MAX_READ_CHUNK_BYTES} bytes`],
  ],
  'session:save-state': [
    [isString(200), 'a grant id'],
    [(v) => typeof v === 'string' && v.length <= MAX_WRITE_BYTES, 'the state as JSON text'],
  ],
  'export:save': [
    [(v) => isString(255)(v) && !/[\\/\0]/.test(v as string), 'a file name without folders'],
    [isData, 'text or bytes'],
  ],
};

/** True for a channel of the contract. */
export function isIpcChannel(channel: unknown): channel is IpcChannel {
  return typeof channel === 'string' && (IPC_CHANNELS as readonly string[]).includes(channel);
}

/**
 * Checks a message's arguments against the channel's shape: exact count and
 * each position's type and range. Returns null when they fit, else one
 * sentence naming the first misfit.
 */
export function validateArgs(channel: IpcChannel, args: readonly unknown[]): string | null {
  const shape = SHAPES[channel];
  if (args.length !== shape.length) return `${channel} takes ${shape.length} argument(s), got ${args.length}.`;
  for (let i = 0; i < shape.length; i++) {
    const [ok, what] = shape[i];
    if (!ok(args[i])) return `${channel}: argument ${i + 1} must be ${what}.`;
  }
  return null;
}
