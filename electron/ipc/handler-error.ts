/**
 * A refusal or failure a handler reports to the renderer as
 * {ok: false, error: message}. The message is one sentence for a person
 * (it never holds a stack trace).
 */
export class HandlerError extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'HandlerError';
  }
}
