/** Waiting on conditions (never fixed sleeps). */

/** Thrown by a condition to stop waiting at once (e.g. the process being waited on has exited). */
export class WaitAborted extends Error {}

/**
 * Re-checks `condition` every `intervalMs` until it returns a truthy value (returned) or `timeoutMs`
 * passes (throws, naming `what` and the last value or error seen). Errors thrown by `condition` count
 * as "not yet", except `WaitAborted`.
 */
export async function waitFor<T>(what: string, timeoutMs: number, condition: () => Promise<T> | T, intervalMs = 200): Promise<NonNullable<T>> {
  const end = Date.now() + timeoutMs;
  let last: unknown;
  for (;;) {
    try {
      const value = await condition();
      if (value) return value as NonNullable<T>;
      last = value;
    } catch (e) {
      if (e instanceof WaitAborted) throw e;
      last = e;
    }
    if (Date.now() >= end) {
      const seen = last instanceof Error ? last.message : JSON.stringify(last);
      throw new Error(`timed out after ${timeoutMs} ms waiting for ${what} (last: ${seen})`);
    }
    await new Promise((resolve) => setTimeout(resolve, intervalMs));
  }
}
