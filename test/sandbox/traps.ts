/**
 * In-process traps on everything a sheet must never reach: the file system, child processes,
 * sockets, HTTP, DNS, workers and `fetch`. While armed, every call is recorded and refused.
 * An escape from the expression sandbox would have to get `require` or `process` first and would
 * then use these module objects (the same objects every importer sees), so the traps catch it.
 * Test-only.
 */
import { createRequire } from 'node:module';

const require = createRequire(import.meta.url);

const MODULES: Record<string, string[] | 'all'> = {
  fs: 'all',
  'fs/promises': 'all',
  child_process: 'all',
  net: ['connect', 'createConnection', 'createServer'],
  tls: ['connect', 'createServer'],
  dgram: ['createSocket'],
  http: ['request', 'get', 'createServer'],
  https: ['request', 'get', 'createServer'],
  http2: ['connect', 'createServer'],
  dns: ['lookup', 'resolve', 'resolve4', 'resolve6'],
  worker_threads: ['Worker'],
  vm: ['runInThisContext', 'runInNewContext', 'Script', 'compileFunction'],
};

/** Arms the traps; returns the calls seen so far and a function that disarms them. */
export function armTraps(): { calls: string[]; disarm(): void } {
  const calls: string[] = [];
  const restore: (() => void)[] = [];
  for (const [name, which] of Object.entries(MODULES)) {
    const mod = require(`node:${name}`) as Record<string, unknown>;
    const keys = which === 'all' ? Object.keys(mod).filter((k) => typeof mod[k] === 'function' && /^[a-z]/.test(k)) : which;
    for (const key of keys) {
      const original = mod[key];
      if (typeof original !== 'function') continue;
      const descriptor = Object.getOwnPropertyDescriptor(mod, key);
      if (!descriptor || (!descriptor.writable && !descriptor.set && !descriptor.configurable)) continue;
      const trap = function trapped(): never {
        calls.push(`${name}.${key}`);
        throw new Error(`sandbox trap: ${name}.${key} called while evaluating a sheet`);
      };
      try {
        Object.defineProperty(mod, key, { ...descriptor, value: trap, ...(descriptor.get ? {} : {}) });
      } catch {
        continue;
      }
      restore.push(() => Object.defineProperty(mod, key, descriptor));
    }
  }
  const g = globalThis as Record<string, unknown>;
  const fetchBefore = g.fetch;
  g.fetch = () => {
    calls.push('fetch');
    throw new Error('sandbox trap: fetch called while evaluating a sheet');
  };
  restore.push(() => {
    g.fetch = fetchBefore;
  });
  return {
    calls,
    disarm: () => {
      for (const r of restore.reverse()) r();
    },
  };
}

/** Property names of the global object and the built-in prototypes an escape would pollute. */
export function globalShape(): Record<string, string[]> {
  const protos: Record<string, object> = {
    globalThis, Object: Object.prototype, Function: Function.prototype, Array: Array.prototype,
    String: String.prototype, Number: Number.prototype, Promise: Promise.prototype, Error: Error.prototype,
  };
  return Object.fromEntries(Object.entries(protos).map(([k, o]) => [k, Reflect.ownKeys(o).map(String).sort()]));
}
