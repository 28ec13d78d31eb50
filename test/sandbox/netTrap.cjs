// Preloaded (`node --require`) into the language server or CLI under test. Node's permission
// model (--experimental-permission / --permission) already refuses file writes, child processes
// and workers; it does not cover the network, so this file refuses that: every attempt to open a
// socket, resolve a name or fetch is written to stderr as a SANDBOX-VIOLATION line and throws.
// Standard input and output are pipes opened by Node itself and are not touched. Test-only.
'use strict';
const report = (what) => {
  process.stderr.write(`SANDBOX-VIOLATION ${what}\n`);
  throw new Error(`sandbox: ${what} is not allowed while evaluating sheets`);
};
const trap = (mod, keys) => {
  const m = require(mod);
  for (const key of keys) {
    if (typeof m[key] === 'function') m[key] = () => report(`${mod}.${key}`);
  }
};
trap('net', ['connect', 'createConnection', 'createServer']);
trap('tls', ['connect', 'createServer']);
trap('dgram', ['createSocket']);
trap('http', ['request', 'get', 'createServer']);
trap('https', ['request', 'get', 'createServer']);
trap('http2', ['connect', 'createServer']);
trap('dns', ['lookup', 'resolve', 'resolve4', 'resolve6', 'resolveAny']);
const net = require('net');
const connect = net.Socket.prototype.connect;
net.Socket.prototype.connect = function trapped(...args) {
  return report(`net.Socket.connect ${JSON.stringify(args[0])}`.slice(0, 200)) ?? connect;
};
globalThis.fetch = () => report('fetch');
process.stderr.write('SANDBOX-ARMED\n');
