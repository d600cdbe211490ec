/**
 * What every request handler shares: parameter checks that answer InvalidParams with a plain message,
 * cancellation (a request cancelled before or while it runs is answered with RequestCancelled), and one
 * wrapper so that no exception reaches the protocol library: an unexpected error is logged as one line
 * and answered with null.
 */
import { ErrorCodes, LSPErrorCodes, ResponseError, type CancellationToken } from 'vscode-languageserver';
import type { Position, Range } from '../service/positions';

export const isPosition = (p: unknown): p is Position =>
  !!p &&
  typeof (p as Position).line === 'number' &&
  typeof (p as Position).character === 'number' &&
  Number.isFinite((p as Position).line) &&
  Number.isFinite((p as Position).character);
export const isRange = (r: unknown): r is Range => !!r && isPosition((r as Range).start) && isPosition((r as Range).end);

export const invalidParams = (message: string) => new ResponseError(ErrorCodes.InvalidParams, message);
export const cancelled = () => new ResponseError(LSPErrorCodes.RequestCancelled, 'request cancelled');

/** `params.textDocument.uri`, or InvalidParams. */
export function uriOf(params: unknown): string {
  const uri = (params as { textDocument?: { uri?: unknown } } | null)?.textDocument?.uri;
  if (typeof uri !== 'string') throw invalidParams('textDocument.uri must be a string');
  return uri;
}

/** `params.position`, or InvalidParams. */
export function positionOf(params: unknown): Position {
  const p = (params as { position?: unknown } | null)?.position;
  if (!isPosition(p)) throw invalidParams('position must be {line, character} with numbers');
  return p;
}

/** One line for the log: the message and where it was thrown, no stack. */
export function oneLine(e: unknown): string {
  if (!(e instanceof Error)) return String(e);
  const at = e.stack
    ?.split('\n')
    .find((l) => l.trim().startsWith('at '))
    ?.trim();
  return `${e.name}: ${e.message.split('\n')[0]}${at ? ` (${at})` : ''}`;
}

/** Let the messages already received (a cancellation among them) be read before work starts. */
const nextTurn: () => Promise<void> =
  typeof setImmediate === 'function' ? () => new Promise((r) => setImmediate(r)) : () => new Promise((r) => setTimeout(r, 0));

export type Handler<P, R> = (params: P, token: CancellationToken) => R | Promise<R>;

export function makeRequestWrapper(log: (line: string) => void) {
  return <P, R>(name: string, fn: Handler<P, R>) =>
    async (params: P, token: CancellationToken): Promise<R | null> => {
      await nextTurn();
      if (token.isCancellationRequested) throw cancelled();
      try {
        const result = await fn(params, token);
        if (token.isCancellationRequested) throw cancelled();
        return result;
      } catch (e) {
        if (e instanceof ResponseError) throw e;
        log(`ionwright: ${name} failed: ${oneLine(e)}`);
        return null;
      }
    };
}
