/** The transmission-line engine: pure functions over SI numbers. */
export * from './constants.js';
export * from './complex.js';
export * from './types.js';
export * from './idealLine.js';
export * from './coaxLine.js';
export * from './microstripStatic.js';
export * from './microstripDispersion.js';
export * from './microstripSynthesis.js';
export * from './microstripLine.js';
export * from './stub.js';
export * from './resonance.js';
export * from './stubSynthesis.js';
export * from './band.js';
export * from './rootFind.js';
