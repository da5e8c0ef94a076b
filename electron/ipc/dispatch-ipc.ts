import { isInputError } from '../../core/errors';
import type { IpcResult } from '../common/ipc-contract';
import type { IpcMainInvokeEventLike } from '../electron-api';
import type { Handlers } from './create-handlers';
import { HandlerError } from './handler-error';
import { isIpcChannel, validateArgs } from './validate-args';
import { APP_ORIGIN, isTrustedSender } from './validate-sender';

/**
 * Handles one invoke message: checks sender, channel and argument shapes,
 * runs the handler and wraps the outcome as {ok, value} | {ok, error}.
 * Refusals and user-fixable problems carry their one-sentence message;
 * anything else (a bug or an unexpected system error) is reported by its
 * system message without a stack, and logged with the stack through `log`.
 */
export async function dispatchIpc(
  handlers: Handlers,
  event: IpcMainInvokeEventLike,
  channel: unknown,
  args: readonly unknown[],
  log: (message: string) => void = (m) => console.error(m),
  origin: string = APP_ORIGIN,
): Promise<IpcResult<unknown>> {
  if (!isTrustedSender(event, origin)) return { ok: false, error: 'Refused: the message did not come from the workbench window.' };
  if (!isIpcChannel(channel)) return { ok: false, error: `Refused: unknown channel ${JSON.stringify(String(channel)).slice(0, 80)}.` };
  const bad = validateArgs(channel, args);
  if (bad) return { ok: false, error: `Refused: ${bad}` };
  try {
    const fn = handlers[channel] as (...a: readonly unknown[]) => Promise<unknown>;
    return { ok: true, value: await fn(...args) };
  } catch (e) {
    if (e instanceof HandlerError || isInputError(e)) return { ok: false, error: e.message };
    const err = e as NodeJS.ErrnoException;
    log(`${channel} failed: ${err?.stack ?? String(e)}`);
    const code = typeof err?.code === 'string' ? ` (${err.code})` : '';
    return { ok: false, error: `Could not complete ${channel}${code}: ${String(err?.message ?? e).split('\n')[0]}` };
  }
}
