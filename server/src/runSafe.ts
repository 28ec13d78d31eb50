/**
 * `runSafe`: the one wrapper every request handler goes through. It yields once so that a
 * `$/cancelRequest` already on the wire is seen, answers a cancelled request with
 * `RequestCancelled`, passes deliberate protocol errors (`ResponseError`) through, and turns any
 * other exception into a logged message plus the handler's fallback, so one bad document can
 * never take the server down.
 */
import { LSPErrorCodes, ResponseError, type CancellationToken } from 'vscode-languageserver';

/** Runs one request handler safely; see the module comment. */
export type RunSafe = <T>(
  token: CancellationToken,
  fallback: T,
  fn: () => T | Promise<T>,
  what?: string,
) => Promise<T | ResponseError<never>>;

const cancelled = () => new ResponseError<never>(LSPErrorCodes.RequestCancelled, 'Request cancelled');
const nextTurn = () => new Promise<void>((resolve) => setImmediate(resolve));

/** Creates `runSafe` logging failures through `logError` (the connection console in the server). */
export function createRunSafe(logError: (message: string) => void): RunSafe {
  return async (token, fallback, fn, what = 'request') => {
    await nextTurn();
    if (token.isCancellationRequested) return cancelled();
    try {
      const result = await fn();
      return token.isCancellationRequested ? cancelled() : result;
    } catch (e) {
      if (e instanceof ResponseError) return e as ResponseError<never>;
      logError(`${what} failed: ${e instanceof Error ? (e.stack ?? e.message) : String(e)}`);
      return fallback;
    }
  };
}
